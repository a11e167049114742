// Honey bee toxicity of a spray product from its label data: the acute contact LD50
// category (EPA OCSPP 850.3020, categories after Atkins et al. 1981) and whether the
// residue stays toxic for long (RT25 over 8 hours). Without label data a product is
// treated as the worst case until the user enters the label's values.

export type BeeToxicityClass = 'highly-toxic' | 'moderately-toxic' | 'practically-nontoxic';

/** LD50 below this (µg/bee) is highly toxic; exactly 2.0 is moderately toxic (Atkins: 0.001–1.99 / 2.0–10.99 / >= 11). */
export const HIGHLY_TOXIC_BELOW_UG = 2;
/** LD50 below this (µg/bee) is "acutely toxic" in EPA's 2017 bee policy, and moderately toxic from 2. */
export const ACUTELY_TOXIC_BELOW_UG = 11;
/** RT25 above this many hours is extended residual toxicity. */
export const EXTENDED_RESIDUAL_OVER_HOURS = 8;
/**
 * Residual hours assumed when the RT25 is not known: a full day, longer than the 8-hour
 * edge so an unknown product counts as extended (our conservative choice, no source).
 */
export const ASSUMED_RESIDUAL_HOURS = 24;

function requireNonNegative(value: number, name: string) {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`${name} must be a number of zero or more`);
}

export function beeToxicityClass(ld50UgPerBee: number): 'highly-toxic' | 'moderately-toxic' | 'practically-nontoxic' {
  requireNonNegative(ld50UgPerBee, 'ld50UgPerBee');
  if (ld50UgPerBee < HIGHLY_TOXIC_BELOW_UG) return 'highly-toxic';
  if (ld50UgPerBee < ACUTELY_TOXIC_BELOW_UG) return 'moderately-toxic';
  return 'practically-nontoxic';
}

export function hasExtendedResidualToxicity(rt25Hours: number): boolean {
  requireNonNegative(rt25Hours, 'rt25Hours');
  return rt25Hours > EXTENDED_RESIDUAL_OVER_HOURS;
}

export interface ProductBeeHazard {
  toxicityClass: BeeToxicityClass;
  /** LD50 < 11 µg/bee (EPA 2017 "acutely toxic"), or unknown. */
  acutelyToxic: boolean;
  extendedResidual: boolean;
  /** Hours after application the residue is counted as a hazard: RT25, or the assumed value. */
  residualHours: number;
  /** True when LD50 or RT25 is missing and the worst case stands in for it. */
  assumed: { ld50: boolean; rt25: boolean };
}

/** The hazard a product's label data describe; a missing value counts as the worst case. */
export function productBeeHazard(label: { ld50UgPerBee: number | null; rt25Hours: number | null }): ProductBeeHazard {
  const ld50Known = label.ld50UgPerBee !== null;
  const rt25Known = label.rt25Hours !== null;
  const toxicityClass = ld50Known ? beeToxicityClass(label.ld50UgPerBee!) : 'highly-toxic';
  return {
    toxicityClass,
    acutelyToxic: toxicityClass !== 'practically-nontoxic',
    extendedResidual: rt25Known ? hasExtendedResidualToxicity(label.rt25Hours!) : true,
    residualHours: rt25Known ? label.rt25Hours! : ASSUMED_RESIDUAL_HOURS,
    assumed: { ld50: !ld50Known, rt25: !rt25Known },
  };
}

