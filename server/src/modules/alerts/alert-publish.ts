// Sends a changed alert over socket.io to the rooms of every organization it concerns,
// each with its own view of it (seen or not).
import type { AppContext } from '../../context.js';
import { publishToOrganizations } from '../../realtime/publish.js';
import { loadAlertDtos, organizationsOf } from './alert-dtos.js';
import type { AlertDto } from '../../../../shared/schemas/alerts.js';

export async function publishAlert(ctx: AppContext, alertId: string, event: 'alert:raised' | 'alert:updated'): Promise<AlertDto | null> {
  let first: AlertDto | null = null;
  for (const orgId of await organizationsOf(ctx.sequelize, alertId)) {
    const [dto] = await loadAlertDtos(ctx.sequelize, orgId, { ids: [alertId] });
    if (!dto) continue;
    first ??= dto;
    publishToOrganizations(ctx.io, [orgId], event, dto);
  }
  return first;
}
