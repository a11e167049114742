// Suggested cover-spray days from pest timing: the days between the first two predicted
// stages of the model (codling moth: first egg hatch at 250 DD°F to 20% egg hatch at 350,
// when sprays aimed at hatching larvae are usually timed; MSU Enviroweather codling moth
// model, from memory of its guidance), each marked where it falls in the block's bloom
// window or while colonies are on site, so the conflict shows before a plan is made. A
// planning aid only: the product label is the law, and local regulations and a licensed
// applicator decide whether, when and how to spray.
import { DateTime } from 'luxon';
import type { PestTiming } from './pest-timing.js';

/** Whole local days, both ends included (YYYY-MM-DD). */
export interface DayRange {
  from: string;
  to: string;
}

export interface SuggestedSprayDay {
  day: string;
  /** True when the day comes from estimated (normal) temperatures: a prediction. */
  estimated: boolean;
  duringBloom: boolean;
  coloniesOnSite: boolean;
}

export const sprayWindowCaution = 'Suggested days are a planning aid: the product label is the law, and local regulations and a licensed applicator decide whether, when and how to spray.';

const within = (day: string, r: DayRange) => day >= r.from && day <= r.to;

export function suggestCoverSprayDays(
  timing: Pick<PestTiming, 'stages' | 'lastDay'>,
  context: { bloom: DayRange | null; coloniesOnSite: readonly DayRange[] },
): SuggestedSprayDay[] {
  const [start, end] = timing.stages;
  if (!start?.reachedOn) return [];
  const first = DateTime.fromISO(start.reachedOn, { zone: 'utc' });
  // Until the second stage is predicted, only the first day is known to fit.
  const last = DateTime.fromISO(end?.reachedOn ?? start.reachedOn, { zone: 'utc' });
  const days: SuggestedSprayDay[] = [];
  for (let d = first; d <= last; d = d.plus({ days: 1 })) {
    const day = d.toISODate()!;
    days.push({
      day,
      estimated: timing.lastDay === null || day > timing.lastDay,
      duringBloom: context.bloom ? within(day, context.bloom) : false,
      coloniesOnSite: context.coloniesOnSite.some((r) => within(day, r)),
    });
  }
  return days;
}
