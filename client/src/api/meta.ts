// Public settings from the server: the map tile URL (empty: maps without a base layer).
import { http } from './http';

export interface ClientMeta {
  mapTileUrl: string;
  mapAttribution: string;
}

let cached: Promise<ClientMeta> | null = null;

export const metaApi = {
  /** Asked once per page load. */
  get: () => (cached ??= http.get<ClientMeta>('/meta').catch((err) => { cached = null; throw err; })),
};
