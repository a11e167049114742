// The spray's own window (planned, or from the applied time for the same length) and the
// exposure window the residue extends it to.
import { productBeeHazard } from '../../../../shared/domain/bee-toxicity.js';

const HOUR_MS = 3_600_000;

export function sprayWindow(plan: { startsAt: Date; endsAt: Date; appliedAt: Date | null }): { from: Date; to: Date } {
  if (!plan.appliedAt) return { from: plan.startsAt, to: plan.endsAt };
  return { from: plan.appliedAt, to: new Date(plan.appliedAt.getTime() + (plan.endsAt.getTime() - plan.startsAt.getTime())) };
}

export function exposureEnd(to: Date, label: { ld50UgPerBee: number | null; rt25Hours: number | null }): Date {
  return new Date(to.getTime() + productBeeHazard(label).residualHours * HOUR_MS);
}
