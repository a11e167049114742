// An apiary business's yards: the home locations distances to requests are measured from.
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { notFound } from '../../errors/http-errors.js';
import type { YardBody, YardDto } from '../../../../shared/schemas/yards.js';
import { execute, selectOne, selectRows } from '../requests/sql.js';

type YardRow = { id: string; name: string; location: string; colonies: number | null; notes: string | null };
const columns = 'id, name, ST_AsGeoJSON(location) AS location, colonies, notes';
const toDto = (row: YardRow): YardDto => ({ id: row.id, name: row.name, location: JSON.parse(row.location), colonies: row.colonies, notes: row.notes });

export function createYardsService(ctx: AppContext) {
  return {
    async list(user: AuthUser): Promise<YardDto[]> {
      const rows = await selectRows<YardRow>(ctx, `SELECT ${columns} FROM yards WHERE apiary_id = :org ORDER BY name, id`, { org: user.organizationId });
      return rows.map(toDto);
    },
    async create(user: AuthUser, body: YardBody): Promise<YardDto> {
      const row = await selectOne<YardRow>(
        ctx,
        `INSERT INTO yards (apiary_id, name, location, colonies, notes)
         VALUES (:org, :name, ST_SetSRID(ST_GeomFromGeoJSON(:location), 4326), :colonies, :notes) RETURNING ${columns}`,
        { org: user.organizationId, name: body.name, location: JSON.stringify(body.location), colonies: body.colonies ?? null, notes: body.notes ?? null },
      );
      return toDto(row!);
    },
    async update(user: AuthUser, id: string, body: YardBody): Promise<YardDto> {
      const row = await selectOne<YardRow>(
        ctx,
        `UPDATE yards SET name = :name, location = ST_SetSRID(ST_GeomFromGeoJSON(:location), 4326), colonies = :colonies, notes = :notes, updated_at = now()
         WHERE id = :id AND apiary_id = :org RETURNING ${columns}`,
        { id, org: user.organizationId, name: body.name, location: JSON.stringify(body.location), colonies: body.colonies ?? null, notes: body.notes ?? null },
      );
      if (!row) throw notFound('That yard');
      return toDto(row);
    },
    async remove(user: AuthUser, id: string): Promise<void> {
      const row = await selectOne<{ id: string }>(ctx, 'SELECT id FROM yards WHERE id = :id AND apiary_id = :org', { id, org: user.organizationId });
      if (!row) throw notFound('That yard');
      await execute(ctx, 'DELETE FROM yards WHERE id = :id', { id });
    },
  };
}
