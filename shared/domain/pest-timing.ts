// Pest timing from trap counts and degree days: the biofix is the first of two successive
// trap checks that both caught moths; degree days accumulated from the biofix (codling
// moth: 50/88 °F, single sine, horizontal cutoff) give the expected dates of each stage
// (first egg hatch at 250 DD°F). MSU Enviroweather; Jones, Doerr & Brunner 2008. One season
// at a time: the farm's calendar year in its time zone.
import { DateTime } from 'luxon';
import { dailyDegreeDays, type DailyTemperature } from './degree-days.js';

export interface PestModelParameters {
  lowerThresholdF: number;
  upperThresholdF: number;
  method: 'single-sine';
  stages: Array<{ name: string; degreeDaysF: number }>;
}

/** Codling moth as published (MSU Enviroweather; Jones, Doerr & Brunner 2008). The stored model rows carry the same values. */
export const codlingMoth: PestModelParameters = {
  lowerThresholdF: 50,
  upperThresholdF: 88,
  method: 'single-sine',
  stages: [
    { name: 'First egg hatch', degreeDaysF: 250 },
    { name: '20% egg hatch', degreeDaysF: 350 },
  ],
};

export interface TrapCheck {
  /** YYYY-MM-DD */
  day: string;
  moths: number;
}

/** The first check of the first two successive checks with a catch, or null. */
export function findBiofix(checks: readonly TrapCheck[]): string | null {
  const sorted = [...checks].sort((a, b) => a.day.localeCompare(b.day));
  for (let i = 0; i + 1 < sorted.length; i++) {
    if (sorted[i].moths > 0 && sorted[i + 1].moths > 0) return sorted[i].day;
  }
  return null;
}

export interface StageTiming {
  name: string;
  degreeDaysF: number;
  /** The day the total reached the stage, or null when not reached within the data. */
  reachedOn: string | null;
  /** True when the stage is reached only on estimated (normal) days: a prediction. */
  estimated: boolean;
}

export interface PestTiming {
  /** The farm's season (calendar year in its time zone) the checks and temperatures belong to. */
  season: number;
  biofix: string | null;
  /** Degree days (°F) from the biofix through the last observed day. */
  degreeDaysF: number;
  /** The last observed day counted (estimated days only predict the stages). */
  lastDay: string | null;
  stages: StageTiming[];
}

/** The farm's season a moment falls in: the calendar year in the farm's time zone. */
export function seasonOf(at: Date, timeZone: string): number {
  const local = DateTime.fromJSDate(at, { zone: timeZone });
  if (!local.isValid) throw new RangeError(`unknown time zone: ${timeZone}`);
  return local.year;
}

/** The first and last day of a season, YYYY-MM-DD. */
export function seasonDays(season: number): { from: string; to: string } {
  return { from: `${season}-01-01`, to: `${season}-12-31` };
}

/**
 * Timing within one season (days in °F; the biofix day counts): checks and temperatures of
 * other seasons are left out, so last year's catches never set this year's biofix.
 */
export function pestTiming(model: PestModelParameters, checks: readonly TrapCheck[], daysF: readonly DailyTemperature[], season: number): PestTiming {
  const { from, to } = seasonDays(season);
  const inSeason = (day: string) => day >= from && day <= to;
  const biofix = findBiofix(checks.filter((c) => inSeason(c.day)));
  const stages: StageTiming[] = model.stages.map((s) => ({ ...s, reachedOn: null, estimated: false }));
  if (!biofix) return { season, biofix, degreeDaysF: 0, lastDay: null, stages };
  let total = 0;
  let observedTotal = 0;
  let lastDay: string | null = null;
  for (const day of daysF.filter((d) => d.day >= biofix && inSeason(d.day)).sort((a, b) => a.day.localeCompare(b.day))) {
    total += dailyDegreeDays(day.tmin, day.tmax, model.lowerThresholdF, model.upperThresholdF, 'sine');
    if (!day.estimated) {
      observedTotal = total;
      lastDay = day.day;
    }
    for (const stage of stages) {
      if (stage.reachedOn || total < stage.degreeDaysF) continue;
      stage.reachedOn = day.day;
      stage.estimated = Boolean(day.estimated);
    }
  }
  return { season, biofix, degreeDaysF: observedTotal, lastDay, stages };
}
