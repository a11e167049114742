// Bloom forecast: from accumulated degree days and a crop's stage thresholds (a published
// range per stage), the dates each stage is expected, with the range the thresholds imply,
// and a bloom window to prefill the grower's form.
import type { AccumulatedDay } from './degree-days.js';

export interface StageThreshold {
  stage: string;
  label: string;
  /** Low and high end of the published degree-day range for the stage. */
  ddLow: number;
  ddHigh: number;
}

export interface StagePrediction {
  stage: string;
  label: string;
  ddLow: number;
  ddHigh: number;
  /** First day the low / middle / high end of the range is reached; null when not within the data. */
  earliest: string | null;
  expected: string | null;
  latest: string | null;
  /** True when a date was reached only on estimated (normal) days. */
  estimated: boolean;
}

function firstDayReaching(series: readonly AccumulatedDay[], total: number): AccumulatedDay | null {
  return series.find((d) => d.cumulative >= total) ?? null;
}

export function predictStages(series: readonly AccumulatedDay[], thresholds: readonly StageThreshold[]): StagePrediction[] {
  return [...thresholds]
    .sort((a, b) => a.ddLow - b.ddLow)
    .map((t) => {
      const earliest = firstDayReaching(series, t.ddLow);
      const expected = firstDayReaching(series, (t.ddLow + t.ddHigh) / 2);
      const latest = firstDayReaching(series, t.ddHigh);
      return {
        stage: t.stage, label: t.label, ddLow: t.ddLow, ddHigh: t.ddHigh,
        earliest: earliest?.day ?? null, expected: expected?.day ?? null, latest: latest?.day ?? null,
        estimated: Boolean(expected?.estimated ?? earliest?.estimated),
      };
    });
}

/** The last stage whose low end has been reached by `cumulative` degree days, or null before the first. */
export function currentStage(cumulative: number, thresholds: readonly StageThreshold[]): StageThreshold | null {
  const reached = [...thresholds].sort((a, b) => a.ddLow - b.ddLow).filter((t) => cumulative >= t.ddLow);
  return reached.at(-1) ?? null;
}

export interface SuggestedBloomWindow {
  bloomStart: string;
  fullBloom: string | null;
  petalFall: string;
}

/**
 * A bloom window from the predictions: bloom starts when the bloom stage's low end is
 * reached, full bloom at its high end, petal fall at the middle of the petal-fall range.
 * Null when the data do not reach those stages.
 */
export function suggestBloomWindow(predictions: readonly StagePrediction[]): SuggestedBloomWindow | null {
  const bloom = predictions.find((p) => p.stage === 'bloom');
  const petalFall = predictions.find((p) => p.stage === 'petal-fall');
  if (!bloom?.earliest || !petalFall?.expected) return null;
  const fullBloom = bloom.latest && bloom.latest <= petalFall.expected ? bloom.latest : null;
  return { bloomStart: bloom.earliest, fullBloom, petalFall: petalFall.expected < bloom.earliest ? bloom.earliest : petalFall.expected };
}
