// Initialises every model on one Sequelize instance, then their associations.
// Features add their init function to the list.
import type { Sequelize } from 'sequelize';
import { initOrganization } from './organization.model.js';
import { initUser } from './user.model.js';
import { initInvitation } from './invitation.model.js';
import { initPasswordResetToken } from './password-reset-token.model.js';
import { initSprayPlan } from './spray-plan.model.js';
import { initSprayPlanBlock } from './spray-plan-block.model.js';
import { initPestModel } from './pest-model.model.js';
import { initPestTrapCount } from './pest-trap-count.model.js';
import { initAlert } from './alert.model.js';
import { initAlertEvent } from './alert-event.model.js';
import { initAlertView } from './alert-view.model.js';
import { initBlock } from './block.model.js';
import { initBloomWindow } from './bloom-window.model.js';
import { initWeatherStation } from './weather-station.model.js';
import { initDailyTemperature } from './daily-temperature.model.js';
import { initForecastLow } from './forecast-low.model.js';
import { initCropStageThreshold } from './crop-stage-threshold.model.js';
import { initFrostCriticalTemperature } from './frost-critical-temperature.model.js';
import { initBloomDigestMark } from './bloom-digest-mark.model.js';
import { initInvoice } from './invoice.model.js';
import { initInvoiceLine } from './invoice-line.model.js';
import { initCreditNote } from './credit-note.model.js';
import { initPayment } from './payment.model.js';
import { initRefund } from './refund.model.js';
import { associateModels } from '../associations.js';

const modelInitializers: Array<(sequelize: Sequelize) => void> = [initOrganization, initUser, initInvitation, initPasswordResetToken,
  initSprayPlan, initSprayPlanBlock, initPestModel, initPestTrapCount, initAlert, initAlertEvent, initAlertView,
  initBlock, initBloomWindow, initWeatherStation, initDailyTemperature, initForecastLow, initCropStageThreshold, initFrostCriticalTemperature, initBloomDigestMark,
  initInvoice, initInvoiceLine, initCreditNote, initPayment, initRefund];

export function initModels(sequelize: Sequelize) {
  for (const init of modelInitializers) init(sequelize);
  associateModels();
}
