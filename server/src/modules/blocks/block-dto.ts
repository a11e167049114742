// Turning a block (with its weather station's name and its current bloom window) and a
// bloom window revision (with who revised it) into the API's BlockDto and BloomWindowDto.
import type { BlockDto, BloomWindowDto } from '../../../../shared/schemas/blocks.js';
import type { CropKey } from '../../../../shared/domain/crops.js';
import { cropInfo } from '../../../../shared/domain/crops.js';
import { coloniesNeeded, stockingAdvice } from '../../../../shared/domain/stocking.js';
import { squareMetresToAcres } from '../../../../shared/domain/units.js';
import type { Block } from '../../db/models/block.model.js';
import type { BloomWindow } from '../../db/models/bloom-window.model.js';
import { plainGeoJson } from '../../db/geojson.js';

/** What a bloom window's DTO is made from: the model's fields, or the block list's row. */
export type BloomWindowFields = Pick<BloomWindow, 'id' | 'blockId' | 'season' | 'bloomStart' | 'fullBloom' | 'petalFall' | 'confidenceNote' | 'revisedBy' | 'createdAt'>
  & { reviser?: { name: string } | null };

/** What a block's DTO is made from: the model's fields, or the block list's row. */
export type BlockFields = Pick<Block, 'id' | 'farmId' | 'name' | 'crop' | 'variety' | 'pollinizerVariety' | 'yearPlanted' | 'treesPerAcre' | 'notes'
  | 'outline' | 'location' | 'enteredAcres' | 'areaM2' | 'coloniesPerAcre' | 'weatherStationId' | 'degreeDayStart' | 'createdAt' | 'updatedAt'>
  & { weatherStation?: { name: string } | null };

/** The window as the API shows it; include the `reviser` (name) when reading it. */
export function toBloomWindowDto(w: BloomWindowFields): BloomWindowDto {
  return {
    id: w.id, blockId: w.blockId, season: w.season, bloomStart: w.bloomStart, fullBloom: w.fullBloom,
    petalFall: w.petalFall, confidenceNote: w.confidenceNote,
    revisedBy: w.revisedBy ? { name: w.reviser?.name ?? '' } : null,
    createdAt: w.createdAt.toISOString(),
  };
}

/** A block as the API shows it; include `weatherStation` (name) when reading it. */
export function toBlockDto(b: BlockFields, current: BloomWindowFields | null): BlockDto {
  const acres = squareMetresToAcres(b.areaM2);
  const crop = cropInfo(b.crop);
  const range = crop?.coloniesPerAcre ?? { min: b.coloniesPerAcre, max: b.coloniesPerAcre, typical: b.coloniesPerAcre };
  return {
    id: b.id, farmId: b.farmId, name: b.name, crop: b.crop as CropKey, variety: b.variety, pollinizerVariety: b.pollinizerVariety,
    yearPlanted: b.yearPlanted, treesPerAcre: b.treesPerAcre, notes: b.notes, outline: plainGeoJson(b.outline), location: plainGeoJson(b.location),
    enteredAcres: b.enteredAcres, areaM2: b.areaM2, acres, areaSource: b.outline ? 'outline' : 'entered',
    coloniesPerAcre: b.coloniesPerAcre, coloniesNeeded: coloniesNeeded(acres, b.coloniesPerAcre),
    stocking: {
      ...range, source: crop?.stockingSource ?? 'No published range for this crop', note: crop?.stockingNote ?? null,
      advice: stockingAdvice(b.coloniesPerAcre, range),
    },
    weatherStationId: b.weatherStationId, weatherStationName: b.weatherStation?.name ?? null, degreeDayStart: b.degreeDayStart,
    bloomWindow: current ? toBloomWindowDto(current) : null,
    createdAt: b.createdAt.toISOString(), updatedAt: b.updatedAt.toISOString(),
  };
}
