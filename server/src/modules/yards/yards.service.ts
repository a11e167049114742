// An apiary business's yards: the home locations distances to requests are measured from.
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import type { Yard } from '../../db/models/yard.model.js';
import { notFound } from '../../errors/http-errors.js';
import { plainGeoJson } from '../../db/geojson.js';
import type { YardBody, YardDto } from '../../../../shared/schemas/yards.js';

const toDto = (row: Yard): YardDto => ({ id: row.id, name: row.name, location: plainGeoJson(row.location), colonies: row.colonies, notes: row.notes });

export type YardsService = ReturnType<typeof createYardsService>;

export function createYardsService(ctx: AppContext) {
  const yardsOf = (user: AuthUser) => ctx.models.Yard.scope({ method: ['ofApiary', user.organizationId] });
  const attributes = (body: YardBody) => ({ name: body.name, location: body.location, colonies: body.colonies ?? null, notes: body.notes ?? null });
  async function own(user: AuthUser, id: string) {
    const yard = await yardsOf(user).findOne({ where: { id } });
    if (!yard) throw notFound('That yard');
    return yard;
  }
  return {
    async list(user: AuthUser): Promise<YardDto[]> {
      return (await yardsOf(user).findAll({ order: [['name', 'ASC'], ['id', 'ASC']] })).map(toDto);
    },
    async create(user: AuthUser, body: YardBody): Promise<YardDto> {
      return toDto(await ctx.models.Yard.create({ apiaryId: user.organizationId!, ...attributes(body) }));
    },
    async update(user: AuthUser, id: string, body: YardBody): Promise<YardDto> {
      return toDto(await (await own(user, id)).update(attributes(body)));
    },
    async remove(user: AuthUser, id: string): Promise<void> {
      await (await own(user, id)).destroy();
    },
  };
}
