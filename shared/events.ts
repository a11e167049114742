// Typed socket.io event maps. Event names are 'domain:verb'; payloads are DTOs from the
// feature schemas. Features add their events here.
import type { AlertDto } from './schemas/alerts.js';
import type { BloomRevisedEvent } from './schemas/blocks.js';
export interface ServerToClientEvents {
  'session:ready': (payload: { userId: string; rooms: string[] }) => void;
  'alert:raised': (payload: AlertDto) => void;
  'alert:updated': (payload: AlertDto) => void;
  'request:updated': (payload: { requestId: string; state: string; coloniesOpen: number }) => void;
  'commitment:updated': (payload: { commitmentId: string; requestId: string; state: string; colonies: number }) => void;
  'agreement:updated': (payload: { agreementId: string; requestId: string; state: string; version: number }) => void;
  'bloom:revised': (payload: BloomRevisedEvent) => void;
  'placement:updated': (payload: { placementId: string; agreementId: string; state: string; step: string }) => void;
  'invoice:updated': (payload: { invoiceId: string }) => void;
}

export interface ClientToServerEvents {
  'session:ping': (ack: (answer: { at: string }) => void) => void;
}

export interface InterServerEvents {}

export interface SocketData {
  userId: string;
  organizationId: string | null;
}
