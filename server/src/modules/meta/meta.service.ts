// Public settings the client needs before sign-in (the map tile server; an empty URL
// means maps are drawn without a base layer).
import type { AppContext } from '../../context.js';

export interface MetaDto {
  mapTileUrl: string;
  mapAttribution: string;
}

export function createMetaService(ctx: AppContext) {
  return {
    settings(): MetaDto {
      return { mapTileUrl: ctx.config.mapTileUrl, mapAttribution: ctx.config.mapAttribution };
    },
  };
}

export type MetaService = ReturnType<typeof createMetaService>;
