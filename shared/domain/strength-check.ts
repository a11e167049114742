// Colony strength checks: how many colonies to open, and whether a group of colonies
// meets the agreed minimum. Sampling at least 10% of the colonies, chosen at random,
// follows the Pennsylvania Department of Agriculture's colony strength program and the
// Rutgers (New Jersey) recommendations; a group passes when the frames its weak colonies
// lack are made up by the frames its strong colonies have above the minimum (Rutgers),
// which is the same as a sample average at or above the minimum.
import { cropInfo } from './crops.js';

export const MINIMUM_SAMPLE_SHARE = 0.1;

/** The fewest colonies to open in a group of `colonies`: 10% rounded up, at least one. */
export function minimumSampleSize(colonies: number): number {
  if (!Number.isInteger(colonies) || colonies < 1) throw new RangeError('colonies must be a whole number of at least 1');
  // Round away floating-point noise first so 10% of 30 is 3, not 4.
  return Math.max(1, Math.ceil(Number((colonies * MINIMUM_SAMPLE_SHARE).toFixed(9))));
}

export interface StrengthSummary {
  sampled: number;
  requiredSample: number;
  sampleLargeEnough: boolean;
  averageFramesOfBees: number;
  belowMinimumCount: number;
  /** Share of sampled colonies below the minimum, 0..1. */
  belowMinimumShare: number;
  /** Frames lacking in colonies below the minimum, and frames above it in the others. */
  framesShort: number;
  framesOver: number;
  meetsAgreement: boolean;
  averageFramesOfBrood: number | null;
  meetsBroodMinimum: boolean | null;
}

const sum = (values: number[]) => values.reduce((total, v) => total + v, 0);
const round2 = (value: number) => Math.round(value * 100) / 100;

function assertFrames(values: number[], name: string) {
  if (!values.length) throw new RangeError(`${name} needs at least one colony`);
  for (const v of values) if (!Number.isFinite(v) || v < 0) throw new RangeError(`${name} must be zero or more frames each`);
}

/**
 * Summarises one sample. A group meets the agreement when the sample is large enough and
 * its colonies below the minimum are offset by those above (and, when a brood minimum is
 * agreed, the average frames of brood reach it too).
 */
export function summarizeStrength(input: {
  coloniesInGroup: number;
  framesOfBees: number[];
  minFramesOfBees: number;
  framesOfBrood?: number[] | null;
  minFramesOfBrood?: number | null;
}): StrengthSummary {
  assertFrames(input.framesOfBees, 'framesOfBees');
  const requiredSample = minimumSampleSize(input.coloniesInGroup);
  const sampled = input.framesOfBees.length;
  const min = input.minFramesOfBees;
  const below = input.framesOfBees.filter((f) => f < min);
  const framesShort = round2(sum(below.map((f) => min - f)));
  const framesOver = round2(sum(input.framesOfBees.filter((f) => f > min).map((f) => f - min)));
  const sampleLargeEnough = sampled >= requiredSample;
  const brood = input.framesOfBrood?.length ? input.framesOfBrood : null;
  if (brood) assertFrames(brood, 'framesOfBrood');
  const averageFramesOfBrood = brood ? round2(sum(brood) / brood.length) : null;
  const meetsBroodMinimum = input.minFramesOfBrood == null || averageFramesOfBrood == null ? null : averageFramesOfBrood >= input.minFramesOfBrood;
  return {
    sampled,
    requiredSample,
    sampleLargeEnough,
    averageFramesOfBees: round2(sum(input.framesOfBees) / sampled),
    belowMinimumCount: below.length,
    belowMinimumShare: below.length / sampled,
    framesShort,
    framesOver,
    meetsAgreement: sampleLargeEnough && framesOver >= framesShort && meetsBroodMinimum !== false,
    averageFramesOfBrood,
    meetsBroodMinimum,
  };
}

/**
 * Starting values for the minimum strength a grower asks, per crop: frames of bees from
 * the crop table (crops.ts, which names each value's source: Almond Board of California,
 * Delaplane & Mayer 2000, or common practice, no source); for apple also 6 frames of brood
 * covered by bees (Delaplane & Mayer 2000, Crop Pollination by Bees, ch. 17). The grower
 * may change them.
 */
export function defaultMinimumStrength(crop: string): { framesOfBees: number; framesOfBrood: number | null } {
  return { framesOfBees: cropInfo(crop)?.minFramesOfBees ?? 6, framesOfBrood: crop === 'apple' ? 6 : null };
}
