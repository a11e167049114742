// Spray plans, the conflict grades the check gives them and the products' bee-toxicity classes.
import { sprayStates, type SprayState } from '../schemas/sprays.js';
import { conflictGrades, type ConflictGrade } from '../domain/conflict-grading.js';
import type { BeeToxicityClass } from '../domain/bee-toxicity.js';
import { labelSet } from './label-set.js';

export const sprayStateSet = labelSet<SprayState>('spray plan states', sprayStates, {
  planned: 'Planned',
  applied: 'Applied',
  cancelled: 'Cancelled',
});

/**
 * Each grade is named for what the check measured (toxicity class, bloom, colonies and
 * distance, hours, notice), never for what a product's label allows: the app does not read labels.
 */
export const conflictGradeSet = labelSet<ConflictGrade>('conflict grades', conflictGrades, {
  'label-bar': 'Acutely toxic, in bloom, colonies on the block',
  'colonies-exposed': 'Colonies within the buffer',
  'bloom-spray': 'Acutely toxic while in bloom',
  'short-notice': 'Less notice than agreed',
  'flight-hours': 'Inside foraging hours',
});

export const beeToxicityClasses = ['highly-toxic', 'moderately-toxic', 'practically-nontoxic'] as const satisfies readonly BeeToxicityClass[];

export const beeToxicitySet = labelSet<BeeToxicityClass>('bee-toxicity classes', beeToxicityClasses, {
  'highly-toxic': 'Highly toxic to bees (LD50 below 2 µg/bee)',
  'moderately-toxic': 'Moderately toxic to bees (LD50 2 to under 11 µg/bee)',
  'practically-nontoxic': 'Practically nontoxic to bees (LD50 11 µg/bee or more)',
});
