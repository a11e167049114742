// Spray plans of a farm: plan, change, move, apply, cancel; each change re-runs the
// conflict check and updates the alerts. Every query is scoped to the user's farm.
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { notFound, wrongState, badRequest } from '../../errors/http-errors.js';
import { productBeeHazard } from '../../../../shared/domain/bee-toxicity.js';
import type { SprayApply, SprayDto, SprayInput, SprayState, SprayUpdate, SprayWithCheck } from '../../../../shared/schemas/sprays.js';
import { runConflictCheck, type CheckOutput } from '../conflicts/conflict-check.js';
import { recheckSpray } from '../alerts/alert-recheck.js';
import { exposureEnd, sprayWindow } from './spray-window.js';
import { checkStoredSpray, loadStoredSpray } from '../conflicts/stored-spray-check.js';

interface SprayRow {
  id: string; farm_id: string; state: SprayState; starts_at: Date; ends_at: Date; applied_at: Date | null; product_name: string;
  epa_reg_no: string | null; active_ingredients: string[]; ld50_ug_per_bee: number | null; rt25_hours: number | null; target_pest: string | null;
  applicator_name: string | null; notes: string | null; noticed_at: Date; created_at: Date; updated_at: Date;
  blocks: SprayDto['blocks']; open_alerts: number;
}

const selectSprays = `
  SELECT s.id, s.farm_id, s.state, lower(s.planned_window) AS starts_at, upper(s.planned_window) AS ends_at, s.applied_at, s.product_name,
    s.epa_reg_no, s.active_ingredients, s.ld50_ug_per_bee, s.rt25_hours, s.target_pest, s.applicator_name, s.notes, s.noticed_at,
    s.created_at, s.updated_at,
    (SELECT coalesce(json_agg(json_build_object('id', b.id, 'name', b.name, 'outline', ST_AsGeoJSON(b.outline)::json,
        'lon', ST_X(coalesce(b.location, ST_Centroid(b.outline))), 'lat', ST_Y(coalesce(b.location, ST_Centroid(b.outline)))) ORDER BY b.name), '[]')
      FROM spray_plan_blocks sb JOIN blocks b ON b.id = sb.block_id WHERE sb.spray_plan_id = s.id) AS blocks,
    (SELECT count(*)::int FROM alerts a WHERE a.spray_plan_id = s.id AND a.state <> 'resolved') AS open_alerts
  FROM spray_plans s`;

function toDto(r: SprayRow): SprayDto {
  return {
    id: r.id, farmId: r.farm_id, state: r.state, startsAt: new Date(r.starts_at).toISOString(), endsAt: new Date(r.ends_at).toISOString(),
    appliedAt: r.applied_at ? new Date(r.applied_at).toISOString() : null, productName: r.product_name, epaRegNo: r.epa_reg_no,
    activeIngredients: r.active_ingredients, ld50UgPerBee: r.ld50_ug_per_bee, rt25Hours: r.rt25_hours, targetPest: r.target_pest,
    applicatorName: r.applicator_name, notes: r.notes, blocks: r.blocks,
    hazard: productBeeHazard({ ld50UgPerBee: r.ld50_ug_per_bee, rt25Hours: r.rt25_hours }), openAlerts: r.open_alerts,
    createdAt: new Date(r.created_at).toISOString(), updatedAt: new Date(r.updated_at).toISOString(),
  };
}

function publicCheck(check: CheckOutput): SprayWithCheck['check'] {
  const { blocks: _blocks, ...rest } = check;
  return rest;
}

function farmOf(user: AuthUser): string {
  if (!user.organizationId || user.organizationKind !== 'farm') throw notFound('That spray plan');
  return user.organizationId;
}

export function createSpraysService(ctx: AppContext) {
  const q = <T extends object>(sql: string, replacements: Record<string, unknown>) => ctx.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });

  async function bufferOf(farmId: string): Promise<number> {
    const [row] = await q<{ spray_buffer_m: number }>('SELECT spray_buffer_m FROM organizations WHERE id = :farmId', { farmId });
    return Number(row.spray_buffer_m);
  }

  async function requireOwnBlocks(farmId: string, blockIds: string[]) {
    const unique = [...new Set(blockIds)];
    const rows = await q<{ id: string }>('SELECT id FROM blocks WHERE farm_id = :farmId AND id = ANY(CAST(:ids AS uuid[]))', { farmId, ids: `{${unique.join(',')}}` });
    if (rows.length !== unique.length) throw badRequest('Please check: blockIds.', { blockIds: 'every block must be one of your farm\'s blocks' });
    return unique;
  }

  async function load(farmId: string, id: string): Promise<SprayRow> {
    const [row] = await q<SprayRow>(`${selectSprays} WHERE s.id = :id AND s.farm_id = :farmId`, { id, farmId });
    if (!row) throw notFound('That spray plan');
    return row;
  }

  async function withCheck(farmId: string, id: string): Promise<SprayWithCheck> {
    const row = await load(farmId, id);
    const stored = await loadStoredSpray(ctx.sequelize, id);
    const check = await checkStoredSpray(ctx.sequelize, stored!);
    const [area] = await q<{ buffer: string | null }>(
      `SELECT ST_AsGeoJSON(ST_Union(ST_Buffer(coalesce(b.outline, b.location)::geography, o.spray_buffer_m)::geometry), 6) AS buffer
       FROM spray_plan_blocks sb JOIN blocks b ON b.id = sb.block_id JOIN organizations o ON o.id = b.farm_id WHERE sb.spray_plan_id = :id`, { id },
    );
    return {
      spray: toDto(row),
      check: publicCheck(row.state === 'cancelled' ? { ...check, conflicts: [] } : check),
      buffer: area?.buffer ? JSON.parse(area.buffer) : null,
    };
  }

  return {
    async list(user: AuthUser, state?: SprayState): Promise<SprayDto[]> {
      const farmId = farmOf(user);
      const rows = await q<SprayRow>(`${selectSprays} WHERE s.farm_id = :farmId ${state ? 'AND s.state = :state' : ''} ORDER BY lower(s.planned_window) DESC`, { farmId, state });
      return rows.map(toDto);
    },

    get: (user: AuthUser, id: string) => withCheck(farmOf(user), id),

    /** The dry run: the same check, nothing stored. */
    async check(user: AuthUser, input: SprayInput): Promise<SprayWithCheck['check']> {
      const farmId = farmOf(user);
      const blockIds = await requireOwnBlocks(farmId, input.blockIds);
      const check = await runConflictCheck(ctx.sequelize, {
        farmId, blockIds, from: new Date(input.startsAt), to: new Date(input.endsAt), ld50UgPerBee: input.ld50UgPerBee, rt25Hours: input.rt25Hours,
        bufferM: await bufferOf(farmId), noticedAt: ctx.now(),
      });
      return publicCheck(check);
    },

    async create(user: AuthUser, input: SprayInput): Promise<SprayWithCheck> {
      const farmId = farmOf(user);
      const blockIds = await requireOwnBlocks(farmId, input.blockIds);
      const id = await ctx.sequelize.transaction(async (transaction) => {
        const [row] = await ctx.sequelize.query<{ id: string }>(
          `INSERT INTO spray_plans (farm_id, planned_window, exposure_window, product_name, epa_reg_no, active_ingredients, ld50_ug_per_bee,
             rt25_hours, target_pest, applicator_name, notes, noticed_at, created_by)
           VALUES (:farmId, tstzrange(:from, :to, '[)'), tstzrange(:from, :exposureTo, '[)'), :productName, :epaRegNo, CAST(:ingredients AS text[]),
             :ld50, :rt25, :targetPest, :applicatorName, :notes, :now, :userId) RETURNING id`,
          {
            transaction, type: QueryTypes.SELECT,
            replacements: {
              farmId, from: input.startsAt, to: input.endsAt, exposureTo: exposureEnd(new Date(input.endsAt), input).toISOString(),
              productName: input.productName, epaRegNo: input.epaRegNo, ingredients: toPgArray(input.activeIngredients), ld50: input.ld50UgPerBee,
              rt25: input.rt25Hours, targetPest: input.targetPest, applicatorName: input.applicatorName, notes: input.notes,
              now: ctx.now().toISOString(), userId: user.id,
            },
          },
        );
        await ctx.sequelize.query('INSERT INTO spray_plan_blocks (spray_plan_id, block_id) SELECT :id, unnest(CAST(:blockIds AS uuid[]))', {
          transaction, replacements: { id: row.id, blockIds: `{${blockIds.join(',')}}` },
        });
        return row.id;
      });
      await recheckSpray(ctx, id);
      return withCheck(farmId, id);
    },

    async update(user: AuthUser, id: string, patch: SprayUpdate): Promise<SprayWithCheck> {
      const farmId = farmOf(user);
      const row = await load(farmId, id);
      if (row.state !== 'planned') throw wrongState(`This spray is ${row.state}; only a planned spray can be changed.`);
      const blockIds = patch.blockIds ? await requireOwnBlocks(farmId, patch.blockIds) : null;
      const startsAt = patch.startsAt ?? new Date(row.starts_at).toISOString();
      const endsAt = patch.endsAt ?? new Date(row.ends_at).toISOString();
      const moved = startsAt !== new Date(row.starts_at).toISOString() || endsAt !== new Date(row.ends_at).toISOString() || blockIds !== null;
      const ld50 = patch.ld50UgPerBee !== undefined ? patch.ld50UgPerBee : row.ld50_ug_per_bee;
      const rt25 = patch.rt25Hours !== undefined ? patch.rt25Hours : row.rt25_hours;
      const pick = <K extends keyof SprayUpdate>(key: K, current: unknown) => (patch[key] !== undefined ? patch[key] : current);
      await ctx.sequelize.transaction(async (transaction) => {
        await ctx.sequelize.query(
          `UPDATE spray_plans SET planned_window = tstzrange(:from, :to, '[)'), exposure_window = tstzrange(:from, :exposureTo, '[)'),
             product_name = :productName, epa_reg_no = :epaRegNo, active_ingredients = CAST(:ingredients AS text[]), ld50_ug_per_bee = :ld50,
             rt25_hours = :rt25, target_pest = :targetPest, applicator_name = :applicatorName, notes = :notes,
             noticed_at = CASE WHEN :moved THEN CAST(:now AS timestamptz) ELSE noticed_at END, updated_at = now()
           WHERE id = :id`,
          {
            transaction,
            replacements: {
              id, from: startsAt, to: endsAt, exposureTo: exposureEnd(new Date(endsAt), { ld50UgPerBee: ld50, rt25Hours: rt25 }).toISOString(),
              productName: pick('productName', row.product_name), epaRegNo: pick('epaRegNo', row.epa_reg_no),
              ingredients: toPgArray((pick('activeIngredients', row.active_ingredients) as string[]) ?? []), ld50, rt25,
              targetPest: pick('targetPest', row.target_pest), applicatorName: pick('applicatorName', row.applicator_name), notes: pick('notes', row.notes),
              moved, now: ctx.now().toISOString(),
            },
          },
        );
        if (blockIds) {
          await ctx.sequelize.query('DELETE FROM spray_plan_blocks WHERE spray_plan_id = :id', { transaction, replacements: { id } });
          await ctx.sequelize.query('INSERT INTO spray_plan_blocks (spray_plan_id, block_id) SELECT :id, unnest(CAST(:blockIds AS uuid[]))', {
            transaction, replacements: { id, blockIds: `{${blockIds.join(',')}}` },
          });
        }
      });
      await recheckSpray(ctx, id);
      return withCheck(farmId, id);
    },

    async apply(user: AuthUser, id: string, input: SprayApply): Promise<SprayWithCheck> {
      const farmId = farmOf(user);
      const row = await load(farmId, id);
      if (row.state !== 'planned') throw wrongState(`This spray is ${row.state}; only a planned spray can be recorded as applied.`);
      const appliedAt = new Date(input.appliedAt);
      if (appliedAt.getTime() > ctx.now().getTime() + 5 * 60_000) throw badRequest('Please check: appliedAt.', { appliedAt: 'cannot be in the future' });
      const window = sprayWindow({ startsAt: new Date(row.starts_at), endsAt: new Date(row.ends_at), appliedAt });
      await ctx.sequelize.query(
        `UPDATE spray_plans SET state = 'applied', applied_at = :appliedAt, exposure_window = tstzrange(:from, :exposureTo, '[)'), updated_at = now() WHERE id = :id`,
        { replacements: { id, appliedAt: appliedAt.toISOString(), from: window.from.toISOString(), exposureTo: exposureEnd(window.to, { ld50UgPerBee: row.ld50_ug_per_bee, rt25Hours: row.rt25_hours }).toISOString() } },
      );
      await recheckSpray(ctx, id);
      return withCheck(farmId, id);
    },

    async cancel(user: AuthUser, id: string): Promise<SprayWithCheck> {
      const farmId = farmOf(user);
      const row = await load(farmId, id);
      if (row.state !== 'planned') throw wrongState(`This spray is ${row.state}; only a planned spray can be cancelled.`);
      await ctx.sequelize.query(`UPDATE spray_plans SET state = 'cancelled', updated_at = now() WHERE id = :id`, { replacements: { id } });
      await recheckSpray(ctx, id);
      return withCheck(farmId, id);
    },
  };
}

function toPgArray(values: string[]): string {
  return `{${values.map((v) => `"${v.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`).join(',')}}`;
}
