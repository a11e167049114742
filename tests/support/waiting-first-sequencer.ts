// Test file order: vitest's own (by last run's duration, or by size in a fresh clone), except
// that files which mostly wait (the mail server down for a whole minute) start first, so
// their waiting overlaps the other files instead of ending the run alone.
import { BaseSequencer, type TestSpecification } from 'vitest/node';

const waitingFiles = ['tests/faults/smtp-outage.test.ts'];
const waits = (spec: TestSpecification) => waitingFiles.some((file) => spec.moduleId.endsWith(file));

export class WaitingFirstSequencer extends BaseSequencer {
  override async sort(files: TestSpecification[]): Promise<TestSpecification[]> {
    const sorted = await super.sort(files);
    return [...sorted.filter(waits), ...sorted.filter((spec) => !waits(spec))];
  }
}
