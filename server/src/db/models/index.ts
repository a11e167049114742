// Every model of the app, defined on one Sequelize instance, with their associations.
// createApp() calls defineModels() once and keeps the registry on its context (ctx.models),
// so two apps in one process each keep their own database. Add a new model here.
import type { Sequelize } from 'sequelize';
import { defineOrganization } from './organization.model.js';
import { defineUser } from './user.model.js';
import { defineInvitation } from './invitation.model.js';
import { definePasswordResetToken } from './password-reset-token.model.js';
import { defineSprayPlan } from './spray-plan.model.js';
import { defineSprayPlanBlock } from './spray-plan-block.model.js';
import { definePestModel } from './pest-model.model.js';
import { definePestTrapCount } from './pest-trap-count.model.js';
import { defineAlert } from './alert.model.js';
import { defineAlertEvent } from './alert-event.model.js';
import { defineAlertView } from './alert-view.model.js';
import { defineBlock } from './block.model.js';
import { defineBloomWindow } from './bloom-window.model.js';
import { defineWeatherStation } from './weather-station.model.js';
import { defineDailyTemperature } from './daily-temperature.model.js';
import { defineForecastLow } from './forecast-low.model.js';
import { defineCropStageThreshold } from './crop-stage-threshold.model.js';
import { defineFrostCriticalTemperature } from './frost-critical-temperature.model.js';
import { defineBloomDigestMark } from './bloom-digest-mark.model.js';
import { defineInvoice } from './invoice.model.js';
import { defineInvoiceLine } from './invoice-line.model.js';
import { defineCreditNote } from './credit-note.model.js';
import { definePayment } from './payment.model.js';
import { defineRefund } from './refund.model.js';
// invoices and payments
import { defineInvoiceNumberCounter } from './invoice-number-counter.model.js';
import { defineProcessedWebhookEvent } from './processed-webhook-event.model.js';
import { defineInvoiceReminder } from './invoice-reminder.model.js';
import { defineIdempotencyKey } from './idempotency-key.model.js';
// requests, commitments, agreements, placements and yards
import { defineYard } from './yard.model.js';
import { defineHiveRequest } from './hive-request.model.js';
import { defineHiveRequestBlock } from './hive-request-block.model.js';
import { defineDropSite } from './drop-site.model.js';
import { defineHiveRequestEvent } from './hive-request-event.model.js';
import { defineCommitment } from './commitment.model.js';
import { defineAgreement } from './agreement.model.js';
import { defineAgreementAmendment } from './agreement-amendment.model.js';
import { definePlacement } from './placement.model.js';
import { definePlacementPhoto } from './placement-photo.model.js';
import { defineStrengthCheck } from './strength-check.model.js';
import { associateModels } from '../associations.js';

export function defineModels(sequelize: Sequelize) {
  const models = {
    Organization: defineOrganization(sequelize),
    User: defineUser(sequelize),
    Invitation: defineInvitation(sequelize),
    PasswordResetToken: definePasswordResetToken(sequelize),
    SprayPlan: defineSprayPlan(sequelize),
    SprayPlanBlock: defineSprayPlanBlock(sequelize),
    PestModel: definePestModel(sequelize),
    PestTrapCount: definePestTrapCount(sequelize),
    Alert: defineAlert(sequelize),
    AlertEvent: defineAlertEvent(sequelize),
    AlertView: defineAlertView(sequelize),
    Block: defineBlock(sequelize),
    BloomWindow: defineBloomWindow(sequelize),
    WeatherStation: defineWeatherStation(sequelize),
    DailyTemperature: defineDailyTemperature(sequelize),
    ForecastLow: defineForecastLow(sequelize),
    CropStageThreshold: defineCropStageThreshold(sequelize),
    FrostCriticalTemperature: defineFrostCriticalTemperature(sequelize),
    BloomDigestMark: defineBloomDigestMark(sequelize),
    Invoice: defineInvoice(sequelize),
    InvoiceLine: defineInvoiceLine(sequelize),
    CreditNote: defineCreditNote(sequelize),
    Payment: definePayment(sequelize),
    Refund: defineRefund(sequelize),
    IdempotencyKey: defineIdempotencyKey(sequelize),
    // invoices and payments
    InvoiceNumberCounter: defineInvoiceNumberCounter(sequelize),
    ProcessedWebhookEvent: defineProcessedWebhookEvent(sequelize),
    InvoiceReminder: defineInvoiceReminder(sequelize),
    // requests, commitments, agreements, placements and yards
    Yard: defineYard(sequelize),
    HiveRequest: defineHiveRequest(sequelize),
    HiveRequestBlock: defineHiveRequestBlock(sequelize),
    DropSite: defineDropSite(sequelize),
    HiveRequestEvent: defineHiveRequestEvent(sequelize),
    Commitment: defineCommitment(sequelize),
    Agreement: defineAgreement(sequelize),
    AgreementAmendment: defineAgreementAmendment(sequelize),
    Placement: definePlacement(sequelize),
    PlacementPhoto: definePlacementPhoto(sequelize),
    StrengthCheck: defineStrengthCheck(sequelize),
  };
  associateModels(models);
  return models;
}

export type Models = ReturnType<typeof defineModels>;
