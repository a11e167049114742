// Agreement calls: list, read, confirm, amend, and the PDF's address.
import { http } from './http';
import type { AgreementDto, AmendmentBody } from '@shared/schemas/agreements';

export const agreementsApi = {
  list: () => http.get<{ agreements: AgreementDto[] }>('/agreements'),
  get: (id: string) => http.get<{ agreement: AgreementDto }>(`/agreements/${id}`),
  confirm: (id: string) => http.post<{ agreement: AgreementDto }>(`/agreements/${id}/confirm`),
  propose: (id: string, body: AmendmentBody) => http.post<{ agreement: AgreementDto }>(`/agreements/${id}/amendments`, body),
  answer: (id: string, amendmentId: string, answer: 'confirm' | 'reject' | 'withdraw') => http.post<{ agreement: AgreementDto }>(`/agreements/${id}/amendments/${amendmentId}/${answer}`),
  pdfUrl: (id: string) => `/api/agreements/${id}/pdf`,
};
