// Re-runs the conflict check of one spray plan and brings its alerts in line, all in one
// transaction on one connection: a new finding raises an alert, a changed one updates it, a
// finding that is gone resolves it, and one that comes back reopens it. Each step is kept
// in the history, and the jobs that publish and e-mail it are written in the same
// transaction (alert-outbox.ts), so a crash after the commit loses nothing.
import { isDeepStrictEqual } from 'node:util';
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import { checkStoredSpray, loadStoredSpray, type StoredSpray } from '../conflicts/stored-spray-check.js';
import type { CheckOutput } from '../conflicts/conflict-check.js';
import type { Alert } from '../../db/models/alert.model.js';
import type { SprayConflict } from '../../../../shared/schemas/sprays.js';
import type { AlertAction, AlertDto, AlertFinding } from '../../../../shared/schemas/alerts.js';
import { alertDtoOf, alertEventDtoOf, loadAlertDtos } from './alert-dtos.js';
import { queueAlertEmails, queueAlertPublication } from './alert-outbox.js';

/** `unseen`: a newly raised alert as this transaction leaves it (nobody has seen it yet). */
export type AlertChange = { alertId: string; kind: 'raised' | 'updated'; unseen?: AlertDto };

export interface RecheckResult {
  spray: StoredSpray | null;
  /** The check as run (for a cancelled spray, with no conflicts). */
  check: CheckOutput | null;
  changes: AlertChange[];
}

const keyOf = (apiaryId: string | null) => apiaryId ?? 'farm';

/**
 * The re-check inside the caller's transaction (a spray save answers from its result).
 * `justCreated`: the spray as this transaction inserted it; nobody else can see it yet, so
 * it is neither read again nor locked, and it has no alerts.
 */
export async function recheckSprayIn(ctx: AppContext, transaction: Transaction, sprayId: string, justCreated?: StoredSpray): Promise<RecheckResult> {
  const { Alert, AlertEvent, AlertView } = ctx.models;
  const now = ctx.now();
  const spray = justCreated ?? (await loadStoredSpray(ctx, sprayId, { forUpdate: true, transaction }));
  if (!spray) return { spray: null, check: null, changes: [] };
  const ran = await checkStoredSpray(ctx, spray, transaction);
  const check = spray.state === 'cancelled' ? { ...ran, conflicts: [] } : ran;
  const existing = justCreated ? [] : await Alert.findAll({ where: { sprayPlanId: sprayId }, lock: transaction.LOCK.UPDATE, transaction });
  const byKey = new Map(existing.map((a) => [keyOf(a.apiaryId), a]));
  const changes: AlertChange[] = [];
  if (ctx.config.faults.exitAfterAlertCommit) {
    // Test-only (NODE_ENV=test): die the moment the alerts are committed, before any job is
    // fetched (this hook runs before the ones that wake the workers).
    transaction.afterCommit(() => void (changes.length && process.kill(process.pid, 'SIGKILL')));
  }
  const event = (alertId: string, action: AlertAction, detail: Record<string, unknown> = {}) => AlertEvent.create({ alertId, action, detail, createdAt: now }, { transaction });
  const nextRevision = ctx.sequelize.literal("nextval('alert_revisions')");

  for (const conflict of check.conflicts) {
    const findings: AlertFinding = { colonies: conflict.colonies, duringBloom: check.duringBloom, residualHours: check.hazard.residualHours, bufferM: check.bufferM };
    const values = { grade: conflict.grade, grades: conflict.grades, reasons: conflict.reasons, findings };
    const current = byKey.get(keyOf(conflict.apiaryId));
    byKey.delete(keyOf(conflict.apiaryId));
    if (!current) {
      const alert = await Alert.create({ ...values, sprayPlanId: sprayId, farmId: spray.farmId, apiaryId: conflict.apiaryId, raisedAt: now, resolvedAt: null, createdAt: now, updatedAt: now }, { transaction, silent: true });
      const raised = await event(alert.id, 'raised', { grade: conflict.grade });
      const unseen = alertDtoOf(alert, {
        farm: spray.farm, apiary: conflict.apiaryId ? { id: conflict.apiaryId, name: conflict.apiaryName! } : null,
        spray: { id: spray.id, state: spray.state, productName: spray.productName, epaRegNo: spray.epaRegNo, plannedWindow: [{ value: spray.startsAt, inclusive: true }, { value: spray.endsAt, inclusive: false }] },
        blockNames: check.blocks.map((b) => b.name), seenByMe: false, history: [alertEventDtoOf(raised)],
      });
      changes.push({ alertId: alert.id, kind: 'raised', unseen });
    } else if (current.state === 'resolved') {
      await Alert.update({ ...values, state: 'raised', raisedAt: now, resolvedAt: null, revision: nextRevision, updatedAt: now }, { where: { id: current.id }, transaction, silent: true });
      await AlertView.destroy({ where: { alertId: current.id }, transaction });
      await event(current.id, 'reopened', { grade: conflict.grade });
      changes.push({ alertId: current.id, kind: 'raised' });
    } else if (!sameFinding(current, conflict, findings)) {
      await Alert.update({ ...values, revision: nextRevision, updatedAt: now }, { where: { id: current.id }, transaction, silent: true });
      await event(current.id, 'updated', { grade: conflict.grade, previousGrade: current.grade });
      changes.push({ alertId: current.id, kind: 'updated' });
    }
  }
  for (const gone of byKey.values()) {
    if (gone.state === 'resolved') continue;
    await Alert.update({ state: 'resolved', resolvedAt: now, revision: nextRevision, updatedAt: now }, { where: { id: gone.id }, transaction, silent: true });
    await event(gone.id, 'resolved', { because: spray.state === 'cancelled' ? 'spray-cancelled' : 'no-conflict-found' });
    changes.push({ alertId: gone.id, kind: 'updated' });
  }

  for (const change of changes) {
    // A raised (or reopened) alert is seen by nobody yet, so its one view serves the farm and
    // the apiary business alike: published on commit as built or loaded here, and e-mailed.
    // A new one is built from what this check holds; a reopened one is loaded with its history.
    const [raised] = change.unseen ? [change.unseen] : change.kind === 'raised' ? await loadAlertDtos(ctx, spray.farmId, { ids: [change.alertId] }, transaction) : [];
    await queueAlertPublication(ctx, transaction, change.alertId, change.kind === 'raised' ? 'alert:raised' : 'alert:updated', raised);
    if (raised) await queueAlertEmails(ctx, transaction, raised);
  }
  return { spray, check, changes };
}

/** The re-check in a transaction of its own (the durable re-check job). */
export function recheckSpray(ctx: AppContext, sprayId: string): Promise<RecheckResult> {
  return ctx.sequelize.transaction((transaction) => recheckSprayIn(ctx, transaction, sprayId));
}

/** Same finding as stored? Compared as JSON values: jsonb keeps its own key order. */
function sameFinding(current: Alert, conflict: SprayConflict, findings: AlertFinding): boolean {
  const asStored = (value: unknown) => JSON.parse(JSON.stringify(value)) as unknown;
  return current.grade === conflict.grade
    && isDeepStrictEqual(asStored(current.grades), asStored(conflict.grades))
    && isDeepStrictEqual(asStored(current.reasons), asStored(conflict.reasons))
    && isDeepStrictEqual(asStored(current.findings), asStored(findings));
}
