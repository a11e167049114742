// When colonies must be on site for a hive request: from a bloom stage of the blocks'
// bloom windows ("at 5% bloom") or from a fixed date, until petal fall or a fixed date.
// Dates are whole days in the farm's time zone; the window is [arrival day 00:00,
// the day after departure 00:00).
import { DateTime } from 'luxon';

export interface BloomWindowDates {
  bloomStart: string;
  fullBloom: string | null;
  petalFall: string;
}

export type ArriveRule = { rule: 'bloom-stage'; bloomPercent: number } | { rule: 'date'; on: string };
export type DepartRule = { rule: 'petal-fall' } | { rule: 'date'; on: string };

/**
 * Usual move-in stage per crop, as percent of flowers open: apple about 5%
 * (Delaplane & Mayer 2000), almond about 10% (Almond Board of California), pear 10–20%
 * (OMAFRA; we take 10), highbush blueberry 5% (WSU). Others: 5%, common practice, no source.
 */
export function defaultArrivalBloomPercent(crop: string): number {
  return ({ almond: 10, pear: 10 } as Record<string, number>)[crop] ?? 5;
}

/**
 * The day a bloom stage is reached. Flowers are taken to open evenly from first bloom (0%)
 * to full bloom (100%); without a full-bloom date, full bloom is the midpoint of first
 * bloom and petal fall. A linear model: common practice, no source.
 */
export function bloomStageDate(window: BloomWindowDates, percent: number): string {
  if (!(percent >= 0 && percent <= 100)) throw new RangeError('percent must be between 0 and 100');
  const start = DateTime.fromISO(window.bloomStart, { zone: 'utc' });
  const end = window.fullBloom
    ? DateTime.fromISO(window.fullBloom, { zone: 'utc' })
    : start.plus({ days: Math.floor(DateTime.fromISO(window.petalFall, { zone: 'utc' }).diff(start, 'days').days / 2) });
  const days = Math.floor((end.diff(start, 'days').days * percent) / 100);
  return start.plus({ days }).toISODate()!;
}

export class WindowError extends Error {
  constructor(readonly field: 'arrive' | 'depart', message: string) {
    super(message);
  }
}

/**
 * The on-site window for a request over one or more blocks: the earliest arrival and the
 * latest departure among them. Throws WindowError naming the rule that cannot be met.
 */
export function expectedOnSite(input: { arrive: ArriveRule; depart: DepartRule; bloomWindows: BloomWindowDates[]; timeZone: string }): { from: Date; to: Date } {
  const needsBloom = input.arrive.rule === 'bloom-stage' || input.depart.rule === 'petal-fall';
  if (needsBloom && !input.bloomWindows.length) {
    throw new WindowError(input.arrive.rule === 'bloom-stage' ? 'arrive' : 'depart', 'no bloom window is published for these blocks yet; give dates instead');
  }
  const arriveDay =
    input.arrive.rule === 'date'
      ? input.arrive.on
      : input.bloomWindows.map((w) => bloomStageDate(w, (input.arrive as { bloomPercent: number }).bloomPercent)).sort()[0];
  const departDay = input.depart.rule === 'date' ? input.depart.on : input.bloomWindows.map((w) => w.petalFall).sort().at(-1)!;
  const from = DateTime.fromISO(arriveDay, { zone: input.timeZone }).startOf('day');
  const to = DateTime.fromISO(departDay, { zone: input.timeZone }).startOf('day').plus({ days: 1 });
  if (to <= from) throw new WindowError('depart', 'colonies must leave after they arrive');
  return { from: from.toJSDate(), to: to.toJSDate() };
}
