// The commitments made to requests, as the API shows them (with the apiary's name and
// the agreement each became). Read by the requests and commitments modules alike.
import type { Transaction, WhereOptions } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { Commitment } from '../../db/models/commitment.model.js';
import type { CommitmentDto } from '../../../../shared/schemas/requests.js';

export async function listCommitments(ctx: AppContext, where: { requestId?: string; apiaryId?: string; id?: string }, t?: Transaction): Promise<CommitmentDto[]> {
  const filter: WhereOptions<Commitment> = {};
  if (where.requestId) filter.requestId = where.requestId;
  if (where.apiaryId) filter.apiaryId = where.apiaryId;
  if (where.id) filter.id = where.id;
  const rows = await ctx.models.Commitment.findAll({
    where: filter,
    include: [
      { model: ctx.models.Organization, as: 'apiary', attributes: ['name'] },
      { model: ctx.models.Agreement, as: 'agreement', attributes: ['id'] },
    ],
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
    transaction: t,
  });
  return rows.map((c) => ({
    id: c.id, requestId: c.requestId, apiaryId: c.apiaryId, apiaryName: c.apiary!.name, colonies: c.colonies, proposedPriceCents: c.proposedPriceCents,
    state: c.state, note: c.note, agreementId: c.agreement?.id ?? null, createdAt: c.createdAt.toISOString(),
  }));
}
