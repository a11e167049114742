// Frost risk to flower buds: a forecast low against the published critical temperatures
// of the block's current stage (temperature held 30 minutes that kills about 10% / 90% of
// buds; WSU Extension, as republished by Penn State Extension and Utah State Univ.).

export interface CriticalTemperature {
  /** °C; 10% and 90% bud kill. */
  kill10C: number;
  kill90C: number;
}

export type FrostRisk = 'none' | 'damage' | 'severe';

/** 'damage' when the low is below the 10%-kill temperature, 'severe' below the 90%-kill one. */
export function frostRisk(forecastLowC: number, critical: CriticalTemperature): FrostRisk {
  if (forecastLowC < critical.kill90C) return 'severe';
  if (forecastLowC < critical.kill10C) return 'damage';
  return 'none';
}
