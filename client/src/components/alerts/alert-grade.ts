// How a conflict grade looks: its words and the tag severity, most serious in red.
import { conflictGradeLabels, type ConflictGrade } from '@shared/domain/conflict-grading';
import type { AlertState } from '@shared/schemas/alerts';

export const gradeSeverity = (grade: ConflictGrade) => (grade === 'label-bar' || grade === 'colonies-exposed' ? 'danger' : grade === 'bloom-spray' ? 'warn' : 'info');
export const gradeLabel = (grade: ConflictGrade) => conflictGradeLabels[grade];
export const alertStateLabels: Record<AlertState, string> = { raised: 'New', seen: 'Seen', answered: 'Answered', resolved: 'Resolved' };
export const alertActionLabels: Record<string, string> = {
  raised: 'Raised by the conflict check', updated: 'Changed by a new check', seen: 'Seen', answered: 'Answered', resolved: 'Resolved: the check finds no conflict', reopened: 'Raised again by a new check',
};
