// A block's bloom forecast: degree days accumulated at its weather station from its start
// date (or biofix), the season's curve extended by normals, the predicted date of each
// crop stage with the range its thresholds imply, a suggested bloom window, the current
// stage with its critical bud temperatures, and a frost warning when a forecast low is at
// or below those of the stage predicted for its day (naming the stage, the table row and
// both sources).
import { DateTime } from 'luxon';
import { badRequest } from '../../errors/http-errors.js';
import type { AppContext } from '../../context.js';
import type { BlockForecastDto, ForecastQuery, FrostCriticalForStage } from '../../../../shared/schemas/blocks.js';
import { accumulateDegreeDays } from '../../../../shared/domain/degree-days.js';
import { currentStage, predictStages, suggestBloomWindow, type StageThreshold } from '../../../../shared/domain/bloom-forecast.js';
import { worstFrost } from '../../../../shared/domain/frost.js';
import { fahrenheitToCelsius } from '../../../../shared/domain/units.js';
import type { BlocksService } from '../blocks/blocks.service.js';
import type { StationsService } from '../weather/stations.service.js';
import { loadSeasonTemperatures } from '../weather/season-temperatures.js';
import type { StageThresholdsService } from './stage-thresholds.service.js';

/** How far past the start the curve is drawn (covers bloom of the tree fruits). */
const SEASON_DAYS = 150;
/** Forecast lows this many days ahead count for the frost warning. */
const FROST_LOOKAHEAD_DAYS = 10;

export function createForecastService(ctx: AppContext, deps: { blocks: BlocksService; stations: StationsService; thresholds: StageThresholdsService }) {
  return {
    async forBlock(farmId: string, blockId: string, query: ForecastQuery): Promise<BlockForecastDto> {
      const block = await deps.blocks.get(farmId, blockId);
      const thresholds = await deps.thresholds.forBlock(farmId, block.crop, block.variety);
      const station = block.weatherStationId ? await deps.stations.get(farmId, block.weatherStationId) : null;
      const zone = station?.timeZone ?? 'UTC';
      const today = DateTime.fromJSDate(ctx.now(), { zone }).toISODate()!;
      const first = thresholds[0];
      const startMonthDay = first?.startMonthDay ?? '03-01';
      const from = query.from ?? block.degreeDayStart ?? `${today.slice(0, 4)}-${startMonthDay}`;
      const method = query.method ?? first?.method ?? 'average';
      const lowerF = query.lowerF ?? first?.baseF ?? 43;
      const upperF = query.upperF ?? first?.upperF ?? null;
      if (upperF !== null && upperF <= lowerF) throw badRequest('The upper threshold must be above the lower one.', { upperF: `must be above the lower threshold (${lowerF} °F)` });
      const notes: string[] = [];
      if (!thresholds.length) notes.push(`No stage thresholds are known for ${block.crop}: add your farm's own to get predicted stages.`);
      if (!station) notes.push('Choose a weather station for this block to accumulate degree days.');

      const through = DateTime.fromISO(from, { zone: 'UTC' }).plus({ days: SEASON_DAYS }).toISODate()!;
      const temperatures = station ? await loadSeasonTemperatures(ctx, station.id, from, through) : null;
      if (station && !temperatures?.days.length) notes.push(`The station has no temperatures from ${from}: upload or enter them.`);
      const accumulated = accumulateDegreeDays(temperatures?.days ?? [], { lower: lowerF, upper: upperF, method, from });
      const stageThresholds = thresholds.map((t) => ({ stage: t.stage, label: t.label, ddLow: t.ddLowF, ddHigh: t.ddHighF }));
      const predictions = predictStages(accumulated, stageThresholds);
      const cumulativeToDate = accumulated.filter((d) => !d.estimated && d.day <= today).at(-1)?.cumulative ?? 0;
      const stage = currentStage(cumulativeToDate, stageThresholds);

      // Each stage's critical bud temperatures, loaded once per stage asked for.
      const criticalByStage = new Map<string, FrostCriticalForStage | null>();
      const criticalFor = async (at: StageThreshold): Promise<FrostCriticalForStage | null> => {
        if (!criticalByStage.has(at.stage)) {
          const row = await deps.thresholds.frostForStage(block.crop, at.stage);
          const stageSource = thresholds.find((t) => t.stage === at.stage)?.source ?? '';
          criticalByStage.set(at.stage, row && {
            stage: at.stage, stageName: at.label, stageSource, stageLabel: row.stageLabel,
            kill10C: fahrenheitToCelsius(row.kill10F), kill90C: fahrenheitToCelsius(row.kill90F), source: row.source,
          });
        }
        return criticalByStage.get(at.stage)!;
      };
      const frostCritical: BlockForecastDto['frostCritical'] = stage ? await criticalFor(stage) : null;

      // Each forecast low is judged at the stage predicted for its own day (degree days on that
      // day, observed or estimated), never earlier than today's: a block moving from tight cluster
      // to pink within the lookahead is warned of a low that only the later stage fears.
      let frost: BlockForecastDto['frost'] = null;
      if (station) {
        const until = DateTime.fromISO(today).plus({ days: FROST_LOOKAHEAD_DAYS }).toISODate()!;
        const lows = (await deps.stations.forecastLows(farmId, station.id, today)).filter((l) => l.day <= until);
        const judged = [];
        for (const low of lows) {
          const onDay = Math.max(cumulativeToDate, accumulated.find((d) => d.day === low.day)?.cumulative ?? 0);
          const stageOnDay = currentStage(onDay, stageThresholds);
          judged.push({ ...low, critical: stageOnDay ? await criticalFor(stageOnDay) : null });
        }
        const worst = worstFrost(judged);
        if (worst) frost = { ...worst.critical, risk: worst.risk, day: worst.day, lowC: worst.lowC };
      }

      return {
        blockId, stationId: station?.id ?? null, unit: 'F', method, lowerF, upperF, from,
        series: accumulated.map((d) => ({ day: d.day, degreeDays: d.degreeDays, cumulative: d.cumulative, estimated: Boolean(d.estimated) })),
        extension: temperatures?.extension ?? null,
        thresholds: thresholds.map((t) => ({ id: t.id, stage: t.stage, label: t.label, ddLow: t.ddLowF, ddHigh: t.ddHighF, source: t.source, farmOwn: t.farmId !== null })),
        predictions, suggestedWindow: suggestBloomWindow(predictions), currentStage: stage ? { stage: stage.stage, label: stage.label } : null,
        cumulativeToDate, frost, frostCritical, notes,
      };
    },
  };
}

export type ForecastService = ReturnType<typeof createForecastService>;
