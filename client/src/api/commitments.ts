// Commitment calls (server module commitments): offer colonies for a request, list one's own, answer or withdraw an offer.
import { http } from './http';
import type { CommitmentBody, CommitmentDto } from '@shared/schemas/requests';

type CommitResult = { commitment: CommitmentDto; coloniesOpen: number };

export const commitmentsApi = {
  offer: (id: string, body: CommitmentBody) => http.post<CommitResult>(`/requests/${id}/commitments`, body),
  mine: () => http.get<{ commitments: CommitmentDto[] }>('/commitments'),
  accept: (id: string) => http.post<CommitResult>(`/commitments/${id}/accept`),
  decline: (id: string) => http.post<CommitResult>(`/commitments/${id}/decline`),
  withdraw: (id: string) => http.post<CommitResult>(`/commitments/${id}/withdraw`),
};
