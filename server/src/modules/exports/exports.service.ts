// CSV exports of an organization's requests, agreements and placements.
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { createRequestsService } from '../requests/requests.service.js';
import { createAgreementsService } from '../agreements/agreements.service.js';
import { createPlacementsService } from '../placements/placements.service.js';
import { toCsv } from './csv.js';
import { labelOf } from '../../../../shared/labels/label-set.js';
import { requestStateSet } from '../../../../shared/labels/requests.js';
import { agreementStateSet } from '../../../../shared/labels/agreements.js';
import { placementStateSet } from '../../../../shared/labels/placements.js';
import { cropSet } from '../../../../shared/labels/crops.js';

const dollars = (cents: number) => (cents / 100).toFixed(2);

export type ExportsService = ReturnType<typeof createExportsService>;

export function createExportsService(ctx: AppContext) {
  return {
    async requests(user: AuthUser) {
      const list = await createRequestsService(ctx).list(user, {});
      return toCsv(
        ['id', 'title', 'grower', 'state', 'crops', 'colonies_requested', 'colonies_committed', 'colonies_open', 'min_frames_of_bees', 'on_site_from', 'on_site_to', 'price_per_colony', 'currency', 'respond_by', 'distance_km'],
        list.map((r) => [r.id, r.title, r.farmName, labelOf(requestStateSet, r.state), r.crops.map((c) => labelOf(cropSet, c)).join('; '), r.coloniesRequested, r.coloniesCommitted, r.coloniesOpen, r.minFramesOfBees, r.expectedOnSite?.from, r.expectedOnSite?.to, dollars(r.pricePerColonyCents), r.currency, r.respondBy, r.distanceKm]),
      );
    },
    async agreements(user: AuthUser) {
      const list = await createAgreementsService(ctx).list(user);
      return toCsv(
        ['id', 'request', 'grower', 'beekeeper', 'state', 'version', 'colonies', 'price_per_colony', 'currency', 'min_frames_of_bees', 'on_site_from', 'on_site_to', 'notice_hours', 'grower_confirmed_at', 'beekeeper_confirmed_at'],
        list.map((a) => [a.id, a.requestTitle, a.farmName, a.apiaryName, labelOf(agreementStateSet, a.state), a.version, a.colonies, dollars(a.pricePerColonyCents), a.currency, a.minFramesOfBees, a.expectedOnSite.from, a.expectedOnSite.to, a.noticeHours, a.farmConfirmation.at, a.apiaryConfirmation.at]),
      );
    },
    async placements(user: AuthUser) {
      const list = await createPlacementsService(ctx).list(user);
      return toCsv(
        ['id', 'agreement_id', 'request', 'grower', 'beekeeper', 'drop_site', 'block', 'state', 'colonies_planned', 'colonies_dropped_off', 'dropped_off_at', 'colonies_picked_up', 'picked_up_at', 'last_check_average_frames', 'last_check_meets_agreement', 'dispute'],
        list.map((p) => {
          const last = p.strengthChecks.at(-1)?.summary;
          return [p.id, p.agreementId, p.requestTitle, p.farmName, p.apiaryName, p.dropSite.name, p.blockName, labelOf(placementStateSet, p.state), p.coloniesPlanned, p.coloniesDelivered, p.deliveredAt, p.coloniesPickedUp, p.pickedUpAt, last?.averageFramesOfBees, last?.meetsAgreement, p.dispute?.note];
        }),
      );
    },
  };
}
