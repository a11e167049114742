// Runs the conflict check of a stored spray plan, from its own row and its farm's buffer.
import { QueryTypes, type Sequelize } from 'sequelize';
import type { SprayState } from '../../../../shared/schemas/sprays.js';
import { runConflictCheck, type CheckOutput } from './conflict-check.js';
import { sprayWindow } from '../sprays/spray-window.js';

export interface StoredSpray {
  id: string;
  farm_id: string;
  state: SprayState;
  starts_at: Date;
  ends_at: Date;
  applied_at: Date | null;
  ld50_ug_per_bee: number | null;
  rt25_hours: number | null;
  noticed_at: Date;
  spray_buffer_m: number;
  block_ids: string[];
}

export async function loadStoredSpray(sequelize: Sequelize, sprayId: string, options: { forUpdate?: boolean; transaction?: import('sequelize').Transaction } = {}): Promise<StoredSpray | null> {
  const [row] = await sequelize.query<StoredSpray>(
    `SELECT s.id, s.farm_id, s.state, lower(s.planned_window) AS starts_at, upper(s.planned_window) AS ends_at, s.applied_at, s.ld50_ug_per_bee,
       s.rt25_hours, s.noticed_at, o.spray_buffer_m,
       ARRAY(SELECT block_id::text FROM spray_plan_blocks WHERE spray_plan_id = s.id ORDER BY block_id) AS block_ids
     FROM spray_plans s JOIN organizations o ON o.id = s.farm_id WHERE s.id = :sprayId ${options.forUpdate ? 'FOR UPDATE OF s' : ''}`,
    { replacements: { sprayId }, type: QueryTypes.SELECT, transaction: options.transaction },
  );
  return row ?? null;
}

export function checkStoredSpray(sequelize: Sequelize, spray: StoredSpray): Promise<CheckOutput> {
  const window = sprayWindow({ startsAt: new Date(spray.starts_at), endsAt: new Date(spray.ends_at), appliedAt: spray.applied_at ? new Date(spray.applied_at) : null });
  return runConflictCheck(sequelize, {
    farmId: spray.farm_id, blockIds: spray.block_ids, ...window, ld50UgPerBee: spray.ld50_ug_per_bee, rt25Hours: spray.rt25_hours,
    bufferM: Number(spray.spray_buffer_m), noticedAt: new Date(spray.noticed_at),
  });
}
