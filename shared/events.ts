// Typed socket.io event maps. Event names are 'domain:verb'; payloads are DTOs from the
// feature schemas. Features add their events here.
export interface ServerToClientEvents {
  'session:ready': (payload: { userId: string; rooms: string[] }) => void;
}

export interface ClientToServerEvents {
  'session:ping': (ack: (answer: { at: string }) => void) => void;
}

export interface InterServerEvents {}

export interface SocketData {
  userId: string;
  organizationId: string | null;
}
