// Frost risk to flower buds: a forecast low against the published critical temperatures
// of the stage the block is at on that low's day (temperature held 30 minutes that kills
// about 10% / 90% of buds; WSU Extension, as republished by Penn State Extension and Utah
// State Univ.).
// The published values are the temperatures AT which 10% / 90% of buds die, so a low at
// or below a value counts.

export interface CriticalTemperature {
  /** °C; 10% and 90% bud kill. */
  kill10C: number;
  kill90C: number;
}

export type FrostRisk = 'none' | 'damage' | 'severe';

/** Lows arrive converted from whole °F; a hair of floating-point noise must not hide an exact match. */
const SAME_TEMPERATURE_C = 1e-6;

/** 'damage' when the low is at or below the 10%-kill temperature, 'severe' at or below the 90%-kill one. */
export function frostRisk(forecastLowC: number, critical: CriticalTemperature): FrostRisk {
  if (!Number.isFinite(forecastLowC)) throw new RangeError('the forecast low must be a number');
  if (forecastLowC <= critical.kill90C + SAME_TEMPERATURE_C) return 'severe';
  if (forecastLowC <= critical.kill10C + SAME_TEMPERATURE_C) return 'damage';
  return 'none';
}

const riskOrder: Record<FrostRisk, number> = { none: 0, damage: 1, severe: 2 };

/**
 * The worst of the forecast lows, each judged against the critical temperatures of the stage
 * the block is at on that low's own day (null before the first stage): buds grow less hardy
 * as the stages pass, so a low a few days out can hurt the stage reached by then though it
 * would spare today's. The most severe risk wins, then the earlier day; null when no low
 * reaches its day's critical temperatures.
 */
export function worstFrost<C extends CriticalTemperature>(
  lows: ReadonlyArray<{ day: string; lowC: number; critical: C | null }>,
): { day: string; lowC: number; critical: C; risk: Exclude<FrostRisk, 'none'> } | null {
  let worst: { day: string; lowC: number; critical: C; risk: Exclude<FrostRisk, 'none'> } | null = null;
  for (const { day, lowC, critical } of [...lows].sort((a, b) => a.day.localeCompare(b.day))) {
    if (!critical) continue;
    const risk = frostRisk(lowC, critical);
    if (risk !== 'none' && (!worst || riskOrder[risk] > riskOrder[worst.risk])) worst = { day, lowC, critical, risk };
  }
  return worst;
}
