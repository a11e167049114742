// Test file order: files which mostly wait (the mail server down for a whole minute) start
// first, so their waiting overlaps the other files instead of ending the run alone; then the
// files known to run longest, so none of them starts late and ends its pass alone; then
// vitest's own order (by last run's duration, or by size in a fresh clone, which has no
// durations yet and would start the long authorization tables and the words walk late).
import { BaseSequencer, type TestSpecification } from 'vitest/node';

const waitingFiles = ['tests/faults/smtp-outage.test.ts'];
/** Longest first, as measured on a fresh clone (seconds in the closing notes). */
const longFiles = [
  'tests/e2e/words.test.ts',
  'tests/e2e/look.test.ts',
  'tests/api/fuzz-routes.test.ts',
  'tests/api/cross-tenant.test.ts',
  'tests/api/authorization-deals.test.ts',
  'tests/faults/database-outage.test.ts',
  'tests/faults/crash-after-commit.test.ts',
  'tests/api/authorization-season.test.ts',
  'tests/api/authorization.test.ts',
];
const rankOf = (spec: TestSpecification) => {
  const waiting = waitingFiles.findIndex((file) => spec.moduleId.endsWith(file));
  if (waiting >= 0) return waiting;
  const long = longFiles.findIndex((file) => spec.moduleId.endsWith(file));
  return long >= 0 ? waitingFiles.length + long : Number.POSITIVE_INFINITY;
};

export class WaitingFirstSequencer extends BaseSequencer {
  override async sort(files: TestSpecification[]): Promise<TestSpecification[]> {
    const sorted = await super.sort(files);
    // A stable sort: files of neither list keep vitest's order after the listed ones.
    return sorted.map((spec, index) => ({ spec, index })).sort((a, b) => rankOf(a.spec) - rankOf(b.spec) || a.index - b.index).map((x) => x.spec);
  }
}
