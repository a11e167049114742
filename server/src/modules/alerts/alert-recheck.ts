// Re-runs the conflict check of one spray plan and brings its alerts in line: a new
// finding raises an alert (socket + e-mail), a changed one updates it, a finding that is
// gone resolves it, and one that comes back reopens it. Each step is kept in the history.
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../../context.js';
import { checkStoredSpray, loadStoredSpray } from '../conflicts/stored-spray-check.js';
import type { SprayConflict } from '../../../../shared/schemas/sprays.js';
import type { AlertFinding } from '../../../../shared/schemas/alerts.js';
import { publishAlert } from './alert-publish.js';
import { enqueueAlertEmails } from '../../jobs/alert-emails.js';

interface StoredAlert {
  id: string; apiary_id: string | null; state: string; grade: string; grades: string[]; reasons: string[]; findings: AlertFinding;
}

type Change = { alertId: string; kind: 'raised' | 'updated' };

const keyOf = (apiaryId: string | null) => apiaryId ?? 'farm';

export async function recheckSpray(ctx: AppContext, sprayId: string): Promise<Change[]> {
  const seq = ctx.sequelize;
  const now = ctx.now().toISOString();
  const changes = await seq.transaction(async (transaction) => {
    const spray = await loadStoredSpray(seq, sprayId, { forUpdate: true, transaction });
    if (!spray) return [];
    const check = spray.state === 'cancelled' ? null : await checkStoredSpray(seq, spray);
    const conflicts = check?.conflicts ?? [];
    const existing = await seq.query<StoredAlert>(
      'SELECT id, apiary_id, state, grade, grades, reasons, findings FROM alerts WHERE spray_plan_id = :sprayId FOR UPDATE',
      { replacements: { sprayId }, type: QueryTypes.SELECT, transaction },
    );
    const byKey = new Map(existing.map((a) => [keyOf(a.apiary_id), a]));
    const result: Change[] = [];
    const event = (alertId: string, action: string, detail: object = {}) =>
      seq.query('INSERT INTO alert_events (alert_id, action, detail, created_at) VALUES (:alertId, :action, CAST(:detail AS jsonb), :now)', {
        replacements: { alertId, action, detail: JSON.stringify(detail), now }, transaction,
      });

    for (const conflict of conflicts) {
      const findings: AlertFinding = { colonies: conflict.colonies, duringBloom: check!.duringBloom, residualHours: check!.hazard.residualHours, bufferM: check!.bufferM };
      const values = { grade: conflict.grade, grades: `{${conflict.grades.join(',')}}`, reasons: JSON.stringify(conflict.reasons), findings: JSON.stringify(findings), now };
      const current = byKey.get(keyOf(conflict.apiaryId));
      byKey.delete(keyOf(conflict.apiaryId));
      if (!current) {
        const [row] = await seq.query<{ id: string }>(
          `INSERT INTO alerts (spray_plan_id, farm_id, apiary_id, grade, grades, reasons, findings, raised_at, created_at, updated_at)
           VALUES (:sprayId, :farmId, :apiaryId, :grade, CAST(:grades AS text[]), CAST(:reasons AS jsonb), CAST(:findings AS jsonb), :now, :now, :now) RETURNING id`,
          { replacements: { ...values, sprayId, farmId: spray.farm_id, apiaryId: conflict.apiaryId }, type: QueryTypes.SELECT, transaction },
        );
        await event(row.id, 'raised', { grade: conflict.grade });
        result.push({ alertId: row.id, kind: 'raised' });
      } else if (current.state === 'resolved') {
        await seq.query(
          `UPDATE alerts SET state = 'raised', grade = :grade, grades = CAST(:grades AS text[]), reasons = CAST(:reasons AS jsonb), findings = CAST(:findings AS jsonb),
             raised_at = :now, resolved_at = NULL, revision = nextval('alert_revisions'), updated_at = :now WHERE id = :id`,
          { replacements: { ...values, id: current.id }, transaction },
        );
        await seq.query('DELETE FROM alert_views WHERE alert_id = :id', { replacements: { id: current.id }, transaction });
        await event(current.id, 'reopened', { grade: conflict.grade });
        result.push({ alertId: current.id, kind: 'raised' });
      } else if (!sameFinding(current, conflict, findings)) {
        await seq.query(
          `UPDATE alerts SET grade = :grade, grades = CAST(:grades AS text[]), reasons = CAST(:reasons AS jsonb), findings = CAST(:findings AS jsonb),
             revision = nextval('alert_revisions'), updated_at = :now WHERE id = :id`,
          { replacements: { ...values, id: current.id }, transaction },
        );
        await event(current.id, 'updated', { grade: conflict.grade, previousGrade: current.grade });
        result.push({ alertId: current.id, kind: 'updated' });
      }
    }
    for (const gone of byKey.values()) {
      if (gone.state === 'resolved') continue;
      await seq.query(
        `UPDATE alerts SET state = 'resolved', resolved_at = :now, revision = nextval('alert_revisions'), updated_at = :now WHERE id = :id`,
        { replacements: { id: gone.id, now }, transaction },
      );
      await event(gone.id, 'resolved', { because: spray.state === 'cancelled' ? 'spray-cancelled' : 'no-conflict-found' });
      result.push({ alertId: gone.id, kind: 'updated' });
    }
    return result;
  });

  for (const change of changes) {
    const dto = await publishAlert(ctx, change.alertId, change.kind === 'raised' ? 'alert:raised' : 'alert:updated');
    if (dto && change.kind === 'raised') await enqueueAlertEmails(ctx, dto);
  }
  return changes;
}

function sameFinding(current: StoredAlert, conflict: SprayConflict, findings: AlertFinding): boolean {
  return current.grade === conflict.grade && JSON.stringify(current.grades) === JSON.stringify(conflict.grades)
    && JSON.stringify(current.reasons) === JSON.stringify(conflict.reasons) && JSON.stringify(current.findings) === JSON.stringify(findings);
}

/** Re-checks every spray that may touch these blocks (a bloom window changed). */
export async function recheckSpraysOnBlocks(ctx: AppContext, blockIds: string[]): Promise<void> {
  const sprays = await ctx.sequelize.query<{ id: string }>(
    `SELECT DISTINCT s.id FROM spray_plans s JOIN spray_plan_blocks sb ON sb.spray_plan_id = s.id
     WHERE sb.block_id = ANY(CAST(:blockIds AS uuid[])) AND s.state <> 'cancelled' AND upper(s.exposure_window) > :now`,
    { replacements: { blockIds: `{${blockIds.join(',')}}`, now: ctx.now().toISOString() }, type: QueryTypes.SELECT },
  );
  for (const s of sprays) await recheckSpray(ctx, s.id);
}

/**
 * Re-checks every spray that may touch an agreement's colonies (a placement or agreement
 * changed): sprays whose blocks lie within their farm's buffer of the agreement's drop
 * sites, and sprays that already have an alert for its apiary business.
 */
export async function recheckSpraysForAgreement(ctx: AppContext, agreementId: string): Promise<void> {
  const sprays = await ctx.sequelize.query<{ id: string }>(
    `SELECT s.id FROM agreements a
       JOIN drop_sites d ON d.request_id = a.request_id
       JOIN spray_plans s ON s.state <> 'cancelled' AND upper(s.exposure_window) > :now
       JOIN organizations o ON o.id = s.farm_id
       JOIN spray_plan_blocks sb ON sb.spray_plan_id = s.id
       JOIN blocks b ON b.id = sb.block_id
     WHERE a.id = :agreementId AND ST_DWithin(d.location::geography, coalesce(b.outline, b.location)::geography, o.spray_buffer_m)
     UNION
     SELECT al.spray_plan_id FROM agreements a JOIN alerts al ON al.apiary_id = a.apiary_id AND al.state <> 'resolved' WHERE a.id = :agreementId`,
    { replacements: { agreementId, now: ctx.now().toISOString() }, type: QueryTypes.SELECT },
  );
  for (const s of sprays) await recheckSpray(ctx, s.id);
}
