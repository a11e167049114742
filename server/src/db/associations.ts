// Every association between models, in one place, declared on one app's registry.
// Features add theirs here.
import type { Models } from './models/index.js';

export function associateModels(m: Models) {
  m.Organization.hasMany(m.User, { foreignKey: 'organizationId', as: 'members' });
  m.User.belongsTo(m.Organization, { foreignKey: 'organizationId', as: 'organization' });
  m.Invitation.belongsTo(m.Organization, { foreignKey: 'organizationId', as: 'organization' });
  m.Organization.hasMany(m.Invitation, { foreignKey: 'organizationId', as: 'invitations' });
  m.Invitation.belongsTo(m.User, { foreignKey: 'invitedBy', as: 'inviter' });
  m.PasswordResetToken.belongsTo(m.User, { foreignKey: 'userId', as: 'user' });
  m.IdempotencyKey.belongsTo(m.User, { foreignKey: 'userId', as: 'user' });

  // blocks, weather, bloom windows, reference thresholds and pests
  m.Block.belongsTo(m.Organization, { foreignKey: 'farmId', as: 'farm' });
  m.Organization.hasMany(m.Block, { foreignKey: 'farmId', as: 'blocks' });
  m.Block.belongsTo(m.WeatherStation, { foreignKey: 'weatherStationId', as: 'weatherStation' });
  m.WeatherStation.hasMany(m.Block, { foreignKey: 'weatherStationId', as: 'blocks' });
  m.Block.hasMany(m.BloomWindow, { foreignKey: 'blockId', as: 'bloomWindows' });
  m.BloomWindow.belongsTo(m.Block, { foreignKey: 'blockId', as: 'block' });
  m.BloomWindow.belongsTo(m.User, { foreignKey: 'revisedBy', as: 'reviser' });
  m.WeatherStation.belongsTo(m.Organization, { foreignKey: 'farmId', as: 'farm' });
  m.WeatherStation.hasMany(m.DailyTemperature, { foreignKey: 'stationId', as: 'temperatures' });
  m.DailyTemperature.belongsTo(m.WeatherStation, { foreignKey: 'stationId', as: 'station' });
  m.DailyTemperature.belongsTo(m.User, { foreignKey: 'enteredBy', as: 'enterer' });
  m.WeatherStation.hasMany(m.ForecastLow, { foreignKey: 'stationId', as: 'forecastLows' });
  m.ForecastLow.belongsTo(m.WeatherStation, { foreignKey: 'stationId', as: 'station' });
  m.ForecastLow.belongsTo(m.User, { foreignKey: 'enteredBy', as: 'enterer' });
  m.CropStageThreshold.belongsTo(m.Organization, { foreignKey: 'farmId', as: 'farm' });
  m.CropStageThreshold.belongsTo(m.User, { foreignKey: 'updatedBy', as: 'updater' });
  m.FrostCriticalTemperature.belongsTo(m.User, { foreignKey: 'updatedBy', as: 'updater' });
  m.BloomDigestMark.belongsTo(m.Organization, { foreignKey: 'apiaryId', as: 'apiary' });
  m.Block.hasMany(m.PestTrapCount, { foreignKey: 'blockId', as: 'trapCounts' });
  m.PestTrapCount.belongsTo(m.Block, { foreignKey: 'blockId', as: 'block' });
  m.PestTrapCount.belongsTo(m.PestModel, { foreignKey: 'pestModelId', as: 'pestModel' });
  m.PestModel.hasMany(m.PestTrapCount, { foreignKey: 'pestModelId', as: 'trapCounts' });
  m.PestTrapCount.belongsTo(m.User, { foreignKey: 'recordedBy', as: 'recorder' });

  // sprays and conflict alerts
  m.SprayPlan.belongsTo(m.Organization, { foreignKey: 'farmId', as: 'farm' });
  m.SprayPlan.belongsTo(m.User, { foreignKey: 'createdBy', as: 'creator' });
  m.SprayPlan.hasMany(m.SprayPlanBlock, { foreignKey: 'sprayPlanId', as: 'blockLinks' });
  m.SprayPlan.belongsToMany(m.Block, { through: m.SprayPlanBlock, foreignKey: 'sprayPlanId', otherKey: 'blockId', as: 'blocks' });
  m.SprayPlanBlock.belongsTo(m.SprayPlan, { foreignKey: 'sprayPlanId', as: 'spray' });
  m.SprayPlanBlock.belongsTo(m.Block, { foreignKey: 'blockId', as: 'block' });
  m.SprayPlan.hasMany(m.Alert, { foreignKey: 'sprayPlanId', as: 'alerts' });
  m.Alert.belongsTo(m.SprayPlan, { foreignKey: 'sprayPlanId', as: 'spray' });
  m.Alert.belongsTo(m.Organization, { foreignKey: 'farmId', as: 'farm' });
  m.Alert.belongsTo(m.Organization, { foreignKey: 'apiaryId', as: 'apiary' });
  m.Alert.hasMany(m.AlertEvent, { foreignKey: 'alertId', as: 'history' });
  m.AlertEvent.belongsTo(m.Alert, { foreignKey: 'alertId', as: 'alert' });
  m.AlertEvent.belongsTo(m.User, { foreignKey: 'actorId', as: 'actor' });
  m.AlertEvent.belongsTo(m.Organization, { foreignKey: 'organizationId', as: 'organization' });
  m.Alert.hasMany(m.AlertView, { foreignKey: 'alertId', as: 'views' });
  m.AlertView.belongsTo(m.Alert, { foreignKey: 'alertId', as: 'alert' });
  m.AlertView.belongsTo(m.Organization, { foreignKey: 'organizationId', as: 'organization' });
  m.AlertView.belongsTo(m.User, { foreignKey: 'seenBy', as: 'seer' });

  // invoices and payments
  m.Invoice.belongsTo(m.Agreement, { foreignKey: 'agreementId', as: 'agreement' });
  m.Agreement.hasMany(m.Invoice, { foreignKey: 'agreementId', as: 'invoices' });
  m.Invoice.belongsTo(m.Organization, { foreignKey: 'apiaryId', as: 'apiary' });
  m.Invoice.belongsTo(m.Organization, { foreignKey: 'farmId', as: 'farm' });
  m.Invoice.belongsTo(m.User, { foreignKey: 'issuedBy', as: 'issuer' });
  m.Invoice.belongsTo(m.User, { foreignKey: 'createdBy', as: 'creator' });
  m.Invoice.hasMany(m.InvoiceLine, { foreignKey: 'invoiceId', as: 'lines' });
  m.InvoiceLine.belongsTo(m.Invoice, { foreignKey: 'invoiceId', as: 'invoice' });
  m.InvoiceLine.belongsTo(m.Placement, { foreignKey: 'placementId', as: 'placement' });
  m.Invoice.hasMany(m.CreditNote, { foreignKey: 'invoiceId', as: 'creditNotes' });
  m.CreditNote.belongsTo(m.Invoice, { foreignKey: 'invoiceId', as: 'invoice' });
  m.CreditNote.belongsTo(m.Organization, { foreignKey: 'apiaryId', as: 'apiary' });
  m.CreditNote.belongsTo(m.User, { foreignKey: 'createdBy', as: 'creator' });
  m.Invoice.hasMany(m.Payment, { foreignKey: 'invoiceId', as: 'payments' });
  m.Payment.belongsTo(m.Invoice, { foreignKey: 'invoiceId', as: 'invoice' });
  m.Payment.belongsTo(m.User, { foreignKey: 'recordedBy', as: 'recorder' });
  m.Invoice.hasMany(m.Refund, { foreignKey: 'invoiceId', as: 'refunds' });
  m.Refund.belongsTo(m.Invoice, { foreignKey: 'invoiceId', as: 'invoice' });
  m.Refund.belongsTo(m.User, { foreignKey: 'requestedBy', as: 'requester' });
  m.Invoice.hasMany(m.InvoiceReminder, { foreignKey: 'invoiceId', as: 'reminders' });
  m.InvoiceReminder.belongsTo(m.Invoice, { foreignKey: 'invoiceId', as: 'invoice' });
  m.Organization.hasMany(m.InvoiceNumberCounter, { foreignKey: 'apiaryId', as: 'invoiceCounters' });
  m.InvoiceNumberCounter.belongsTo(m.Organization, { foreignKey: 'apiaryId', as: 'apiary' });

  // requests, commitments, agreements, placements and yards
  m.Yard.belongsTo(m.Organization, { foreignKey: 'apiaryId', as: 'apiary' });
  m.Organization.hasMany(m.Yard, { foreignKey: 'apiaryId', as: 'yards' });
  m.HiveRequest.belongsTo(m.Organization, { foreignKey: 'farmId', as: 'farm' });
  m.HiveRequest.belongsTo(m.User, { foreignKey: 'createdBy', as: 'creator' });
  m.HiveRequest.belongsToMany(m.Block, { through: m.HiveRequestBlock, foreignKey: 'requestId', otherKey: 'blockId', as: 'blocks' });
  m.Block.belongsToMany(m.HiveRequest, { through: m.HiveRequestBlock, foreignKey: 'blockId', otherKey: 'requestId', as: 'requests' });
  m.HiveRequest.hasMany(m.HiveRequestBlock, { foreignKey: 'requestId', as: 'blockShares' });
  m.HiveRequestBlock.belongsTo(m.HiveRequest, { foreignKey: 'requestId', as: 'request' });
  m.HiveRequestBlock.belongsTo(m.Block, { foreignKey: 'blockId', as: 'block' });
  m.HiveRequest.hasMany(m.DropSite, { foreignKey: 'requestId', as: 'dropSites' });
  m.DropSite.belongsTo(m.HiveRequest, { foreignKey: 'requestId', as: 'request' });
  m.DropSite.belongsTo(m.Block, { foreignKey: 'blockId', as: 'block' });
  m.HiveRequest.hasMany(m.HiveRequestEvent, { foreignKey: 'requestId', as: 'events' });
  m.HiveRequestEvent.belongsTo(m.HiveRequest, { foreignKey: 'requestId', as: 'request' });
  m.HiveRequestEvent.belongsTo(m.User, { foreignKey: 'actorId', as: 'actor' });
  m.HiveRequest.hasMany(m.Commitment, { foreignKey: 'requestId', as: 'commitments' });
  m.Commitment.belongsTo(m.HiveRequest, { foreignKey: 'requestId', as: 'request' });
  m.Commitment.belongsTo(m.Organization, { foreignKey: 'apiaryId', as: 'apiary' });
  m.Commitment.belongsTo(m.User, { foreignKey: 'createdBy', as: 'creator' });
  m.Commitment.belongsTo(m.User, { foreignKey: 'decidedBy', as: 'decider' });
  m.Commitment.hasOne(m.Agreement, { foreignKey: 'commitmentId', as: 'agreement' });
  m.Agreement.belongsTo(m.Commitment, { foreignKey: 'commitmentId', as: 'commitment' });
  m.HiveRequest.hasMany(m.Agreement, { foreignKey: 'requestId', as: 'agreements' });
  m.Agreement.belongsTo(m.HiveRequest, { foreignKey: 'requestId', as: 'request' });
  m.Agreement.belongsTo(m.Organization, { foreignKey: 'farmId', as: 'farm' });
  m.Agreement.belongsTo(m.Organization, { foreignKey: 'apiaryId', as: 'apiary' });
  m.Agreement.belongsTo(m.User, { foreignKey: 'farmConfirmedBy', as: 'farmConfirmer' });
  m.Agreement.belongsTo(m.User, { foreignKey: 'apiaryConfirmedBy', as: 'apiaryConfirmer' });
  m.Agreement.hasMany(m.AgreementAmendment, { foreignKey: 'agreementId', as: 'amendments' });
  m.AgreementAmendment.belongsTo(m.Agreement, { foreignKey: 'agreementId', as: 'agreement' });
  m.AgreementAmendment.belongsTo(m.User, { foreignKey: 'proposedBy', as: 'proposer' });
  m.AgreementAmendment.belongsTo(m.User, { foreignKey: 'decidedBy', as: 'decider' });
  m.Agreement.hasMany(m.Placement, { foreignKey: 'agreementId', as: 'placements' });
  m.Placement.belongsTo(m.Agreement, { foreignKey: 'agreementId', as: 'agreement' });
  m.DropSite.hasMany(m.Placement, { foreignKey: 'dropSiteId', as: 'placements' });
  m.Placement.belongsTo(m.DropSite, { foreignKey: 'dropSiteId', as: 'dropSite' });
  m.Placement.belongsTo(m.User, { foreignKey: 'deliveredBy', as: 'deliverer' });
  m.Placement.belongsTo(m.User, { foreignKey: 'pickedUpBy', as: 'picker' });
  m.Placement.belongsTo(m.User, { foreignKey: 'disputedBy', as: 'disputer' });
  m.Placement.hasMany(m.StrengthCheck, { foreignKey: 'placementId', as: 'strengthChecks' });
  m.StrengthCheck.belongsTo(m.Placement, { foreignKey: 'placementId', as: 'placement' });
  m.StrengthCheck.belongsTo(m.User, { foreignKey: 'checkedBy', as: 'checker' });
  m.Placement.hasMany(m.PlacementPhoto, { foreignKey: 'placementId', as: 'photos' });
  m.PlacementPhoto.belongsTo(m.Placement, { foreignKey: 'placementId', as: 'placement' });
  m.PlacementPhoto.belongsTo(m.User, { foreignKey: 'uploadedBy', as: 'uploader' });
}
