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

  // invoices and payments (the agreement and placement ends are declared with those models)
  m.Invoice.belongsTo(m.Organization, { foreignKey: 'apiaryId', as: 'apiary' });
  m.Invoice.belongsTo(m.Organization, { foreignKey: 'farmId', as: 'farm' });
  m.Invoice.belongsTo(m.User, { foreignKey: 'issuedBy', as: 'issuer' });
  m.Invoice.belongsTo(m.User, { foreignKey: 'createdBy', as: 'creator' });
  m.Invoice.hasMany(m.InvoiceLine, { foreignKey: 'invoiceId', as: 'lines' });
  m.InvoiceLine.belongsTo(m.Invoice, { foreignKey: 'invoiceId', as: 'invoice' });
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
}
