// Grades one overlap the conflict search found between a spray plan and colonies (or
// bloom), from most to least serious, and says why in plain words. Pure: the search in
// PostgreSQL finds the overlaps, this decides how serious each one is.
import type { ProductBeeHazard } from './bee-toxicity.js';

/** Our grades, most serious first. */
export const conflictGrades = ['label-bar', 'colonies-exposed', 'bloom-spray', 'short-notice', 'flight-hours'] as const;
export type ConflictGrade = (typeof conflictGrades)[number];

/** What the search found for one group of colonies (one apiary business), or for the bloom alone. */
export interface FoundOverlap {
  hazard: ProductBeeHazard;
  /** The sprayed blocks bloom during the spray window extended by the residue time. */
  duringBloom: boolean;
  /** Colonies of the group; 0 when only bloom was found. */
  colonies: number;
  /** Nearest colonies to the sprayed blocks, metres (0 on the block). */
  distanceM: number;
  bufferM: number;
  /** Colonies on a sprayed block under an agreement in force during the spray itself. */
  contractedOnSprayedBlock: boolean;
  /** Colonies on site during the spray itself (not only during the residue time). */
  presentDuringSpray: boolean;
  /** Hours between the beekeeper being told (plan saved or moved) and the planned start. */
  noticeGivenHours: number;
  /** The longest notice the affected agreements ask for, hours; null without an agreement. */
  noticeAgreedHours: number | null;
  /** Hours of the spray itself that fall in the bees' flying hours at the block. */
  hoursDuringBeeFlight: number;
}

export interface GradedConflict {
  grade: ConflictGrade;
  /** Every grade that applies, most serious first. */
  grades: ConflictGrade[];
  reasons: string[];
}

const km = (m: number) => (m < 1000 ? `${Math.round(m)} m` : `${(m / 1000).toFixed(1)} km`);

/** The grades that apply to one overlap, most serious first, or null when nothing does. */
export function gradeConflict(o: FoundOverlap): GradedConflict | null {
  const found = new Map<ConflictGrade, string>();
  const unknownNote = o.hazard.assumed.ld50 ? ' (no LD50 entered, so it is treated as highly toxic until one is entered)' : '';
  const toxic = o.hazard.toxicityClass !== 'practically-nontoxic';

  if (o.hazard.acutelyToxic && o.duringBloom && o.contractedOnSprayedBlock) {
    found.set('label-bar', `An acutely toxic product${unknownNote} is planned on a block in bloom while ${o.colonies} contracted colonies are on it. Check the product's label: under EPA's 2017 bee policy, many labels of acutely toxic products restrict spraying in bloom while contracted colonies are present.`);
  }
  if (toxic && o.colonies > 0) {
    const residue = o.hazard.assumed.rt25 ? `${o.hazard.residualHours} h assumed (no RT25 entered)` : `RT25 ${o.hazard.residualHours} h`;
    found.set('colonies-exposed', `${o.colonies} colonies are ${o.distanceM === 0 ? 'on a sprayed block' : `${km(o.distanceM)} from a sprayed block`}, within the ${km(o.bufferM)} buffer, during the spray or its residue time (${residue}).`);
  }
  if (o.hazard.acutelyToxic && o.duringBloom && !found.has('label-bar')) {
    found.set('bloom-spray', `An acutely toxic product${unknownNote} is planned while the sprayed blocks are in bloom.`);
  }
  if (o.colonies > 0 && o.noticeAgreedHours !== null && o.noticeGivenHours < o.noticeAgreedHours) {
    found.set('short-notice', `The spray starts ${Math.max(0, Math.floor(o.noticeGivenHours))} h after notice; the agreement asks for ${o.noticeAgreedHours} h.`);
  }
  if (o.colonies > 0 && o.presentDuringSpray && o.hoursDuringBeeFlight > 0) {
    found.set('flight-hours', `${o.hoursDuringBeeFlight.toFixed(1)} h of the spray fall while bees fly (from 2 h before sunrise to 1 h after sunset); an evening application would be safer.`);
  }
  if (!found.size) return null;
  const grades = conflictGrades.filter((g) => found.has(g));
  return { grade: grades[0], grades, reasons: grades.map((g) => found.get(g)!) };
}

/** Negative when a is more serious than b. */
export function compareGrades(a: ConflictGrade, b: ConflictGrade): number {
  return conflictGrades.indexOf(a) - conflictGrades.indexOf(b);
}

/** Shown with every alert and every conflict list. */
export const sprayCautions = [
  'The product label is the law: read and follow it.',
  'Local regulations and a licensed applicator decide whether, when and how to apply.',
  'These alerts are a planning aid, not legal or safety advice.',
] as const;
