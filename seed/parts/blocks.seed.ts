// The demo's blocks, weather and bloom: two farms' blocks in the invented valley, a
// weather station per farm with synthetic but plausible daily temperatures (this season
// and the one before, so the forecast can extend with the station's own normals), the
// season shifted so bloom is happening around world.today, published bloom windows (one
// revised), and a forecast low that puts one block under a frost warning.
import { QueryTypes } from 'sequelize';
import { buildBlock, buildBloomWindow, squareOutline, type BuiltBlock } from '../../tests/support/builders/season.js';
import { buildDailyTemperatures, buildForecastLow, buildStation, syntheticSpring } from '../../tests/support/builders/weather.js';
import { accumulateDegreeDays } from '../../shared/domain/degree-days.js';
import { predictStages, suggestBloomWindow, type StageThreshold } from '../../shared/domain/bloom-forecast.js';
import { celsiusToFahrenheit } from '../../shared/domain/units.js';
import { insertPublishedReference } from '../../server/src/modules/bloom/published-reference.js';
import type { SeedWorld } from '../seed-world.js';
import { builderSequelize } from '../../tests/support/builders/builder-database.js';

const DAY = 86_400_000;
const isoDay = (d: Date) => d.toISOString().slice(0, 10);

export interface SeedBlocks {
  blocks: Record<'benchGala' | 'benchBraeburn' | 'benchPear' | 'benchCherry' | 'ridgeFuji' | 'ridgePlum', BuiltBlock>;
  stations: Record<'bench' | 'ridge', { id: string; name: string }>;
  /** First day of the demo season's degree-day accumulation (the shifted "March 1"). */
  degreeDayStart: string;
}

async function appleThresholds(): Promise<StageThreshold[]> {
  const rows = await builderSequelize().query<{ stage: string; label: string; dd_low_f: number; dd_high_f: number }>(
    "SELECT stage, label, dd_low_f, dd_high_f FROM crop_stage_thresholds WHERE farm_id IS NULL AND crop = 'apple' AND variety IS NULL ORDER BY sort_order",
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ stage: r.stage, label: r.label, ddLow: r.dd_low_f, ddHigh: r.dd_high_f }));
}

async function setBlockForecast(block: BuiltBlock, stationId: string, degreeDayStart: string, variety: string | null, pollinizer: string | null) {
  await builderSequelize().query(
    'UPDATE blocks SET weather_station_id = :stationId, degree_day_start = :start, variety = :variety, pollinizer_variety = :pollinizer, year_planted = 2014, trees_per_acre = 900 WHERE id = :id',
    { replacements: { id: block.id, stationId, start: degreeDayStart, variety, pollinizer } },
  );
}

export async function seedBlocks(world: SeedWorld) {
  const today = new Date(Date.UTC(world.today.getUTCFullYear(), world.today.getUTCMonth(), world.today.getUTCDate()));
  const seasonStart = new Date(today.getTime() - 60 * DAY);
  const degreeDayStart = isoDay(seasonStart);
  const { farm, farm2 } = world.organizations;
  // Reloading the demo empties every table, the published reference data included.
  await insertPublishedReference(builderSequelize());

  const bench = await buildStation({ farm, name: 'Larkspur Bench mast', lon: -119.905, lat: 44.905 });
  const ridge = await buildStation({ farm: farm2, name: 'Cinder Ridge hut', lon: -119.82, lat: 44.95 });
  const thisSeason = { bench: syntheticSpring({ from: seasonStart, days: 60, meanFromC: 4, meanToC: 14, seed: 3 }), ridge: syntheticSpring({ from: seasonStart, days: 60, meanFromC: 3.5, meanToC: 13.5, seed: 7 }) };
  const lastYear = new Date(seasonStart.getTime() - 365 * DAY);
  await buildDailyTemperatures({ station: bench, days: [...syntheticSpring({ from: lastYear, days: 150, meanFromC: 3, meanToC: 19, seed: 11 }), ...thisSeason.bench] });
  await buildDailyTemperatures({ station: ridge, days: [...syntheticSpring({ from: lastYear, days: 150, meanFromC: 2.5, meanToC: 18, seed: 13 }), ...thisSeason.ridge] });

  const blocks: SeedBlocks['blocks'] = {
    benchGala: await buildBlock({ farm, name: 'Upper Bench Gala', crop: 'apple', lon: -119.906, lat: 44.903, acres: 24, coloniesPerAcre: 1.5 }),
    benchBraeburn: await buildBlock({ farm, name: 'Creekside Braeburn', crop: 'apple', lon: -119.897, lat: 44.9, acres: 18, coloniesPerAcre: 2 }),
    benchPear: await buildBlock({ farm, name: 'Millrace Pears', crop: 'pear', lon: -119.912, lat: 44.909, acres: 15, coloniesPerAcre: 2.5 }),
    benchCherry: await buildBlock({ farm, name: 'South Slope Cherries', crop: 'sweet-cherry', lon: -119.9, lat: 44.896, acres: 10, withOutline: false, coloniesPerAcre: 3 }),
    ridgeFuji: await buildBlock({ farm: farm2, name: 'Ridge Top Fuji', crop: 'apple', lon: -119.825, lat: 44.948, acres: 30, coloniesPerAcre: 1.5 }),
    ridgePlum: await buildBlock({ farm: farm2, name: 'Ash Hollow Plums', crop: 'plum', lon: -119.815, lat: 44.955, acres: 12, coloniesPerAcre: 1.3 }),
  };
  await setBlockForecast(blocks.benchGala, bench.id, degreeDayStart, 'Gala', 'Snowdrift crab');
  await setBlockForecast(blocks.benchBraeburn, bench.id, degreeDayStart, 'Braeburn', 'Manchurian crab');
  await setBlockForecast(blocks.benchPear, bench.id, degreeDayStart, 'Bartlett', 'Bosc');
  await setBlockForecast(blocks.benchCherry, bench.id, degreeDayStart, 'Bing', 'Rainier');
  await setBlockForecast(blocks.ridgeFuji, ridge.id, degreeDayStart, 'Fuji', 'Snowdrift crab');
  await setBlockForecast(blocks.ridgePlum, ridge.id, degreeDayStart, 'Italian prune', null);

  // Apple windows come from the same forecast the app shows; the others are set by hand.
  const thresholds = await appleThresholds();
  const windowFor = (days: typeof thisSeason.bench) => {
    const series = accumulateDegreeDays(
      days.map((d) => ({ day: d.day, tmin: celsiusToFahrenheit(d.tminC), tmax: celsiusToFahrenheit(d.tmaxC) })),
      { lower: 43, upper: null, method: 'average', from: degreeDayStart },
    );
    // Past the data, keep the last week's warmth going for the demo's window.
    const last = series.at(-1)!;
    const perDay = (last.cumulative - series.at(-8)!.cumulative) / 7;
    const extended = [...series, ...Array.from({ length: 40 }, (_, i) => ({ ...last, day: isoDay(new Date(today.getTime() + i * DAY)), cumulative: last.cumulative + perDay * (i + 1), estimated: true }))];
    return suggestBloomWindow(predictStages(extended, thresholds));
  };
  const shift = (day: string, days: number) => isoDay(new Date(Date.parse(`${day}T00:00:00Z`) + days * DAY));
  const season = today.getUTCFullYear();
  const grower = world.users.grower;
  const gala = windowFor(thisSeason.bench);
  if (gala) {
    await buildBloomWindow({ block: blocks.benchGala, season, bloomStart: shift(gala.bloomStart, 2), fullBloom: gala.fullBloom ? shift(gala.fullBloom, 2) : null, petalFall: shift(gala.petalFall, 2), revisedBy: grower, note: 'First estimate from the degree-day forecast' });
    await buildBloomWindow({ block: blocks.benchGala, season, bloomStart: gala.bloomStart, fullBloom: gala.fullBloom, petalFall: gala.petalFall, revisedBy: grower, note: 'Warm week: moved two days earlier' });
    await buildBloomWindow({ block: blocks.benchBraeburn, season, bloomStart: shift(gala.bloomStart, 1), fullBloom: gala.fullBloom ? shift(gala.fullBloom, 1) : null, petalFall: shift(gala.petalFall, 1), revisedBy: grower, note: 'Follows the Gala by about a day' });
  }
  await buildBloomWindow({ block: blocks.benchPear, season, bloomStart: isoDay(new Date(today.getTime() - 2 * DAY)), fullBloom: isoDay(new Date(today.getTime() + 3 * DAY)), petalFall: isoDay(new Date(today.getTime() + 11 * DAY)), revisedBy: grower, note: 'Scouted: first white showing' });
  const fuji = windowFor(thisSeason.ridge);
  if (fuji) await buildBloomWindow({ block: blocks.ridgeFuji, season, bloomStart: fuji.bloomStart, fullBloom: fuji.fullBloom, petalFall: fuji.petalFall, revisedBy: world.users.grower2, note: 'From the degree-day forecast' });

  // A cold night ahead on the ridge: below the critical temperature of apple at first pink and bloom (28 °F, WSU).
  await buildForecastLow({ station: ridge, day: isoDay(new Date(today.getTime() + 2 * DAY)), lowC: -3 });
  await buildForecastLow({ station: bench, day: isoDay(new Date(today.getTime() + 2 * DAY)), lowC: 1.5 });

  const handles: SeedBlocks = { blocks, stations: { bench, ridge }, degreeDayStart };
  world.extra.blocks = handles;
}
