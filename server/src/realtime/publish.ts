// Sends one typed event to the rooms of several organizations at once.
import type { RealtimeServer } from '../context.js';
import type { ServerToClientEvents } from '../../../shared/events.js';
import { rooms } from './rooms.js';

export function publishToOrganizations<E extends keyof ServerToClientEvents>(
  io: RealtimeServer,
  organizationIds: Iterable<string>,
  event: E,
  ...payload: Parameters<ServerToClientEvents[E]>
) {
  const targets = [...new Set(organizationIds)].map(rooms.organization);
  if (!targets.length) return;
  (io.to(targets).emit as (event: E, ...args: Parameters<ServerToClientEvents[E]>) => boolean)(event, ...payload);
}
