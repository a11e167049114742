// How a conflict grade looks: the tag severity, most serious in red (its words: shared/labels/sprays.ts).
import type { ConflictGrade } from '@shared/domain/conflict-grading';

export const gradeSeverity = (grade: ConflictGrade) => (grade === 'label-bar' || grade === 'colonies-exposed' ? 'danger' : grade === 'bloom-spray' ? 'warn' : 'info');
