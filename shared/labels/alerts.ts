// Spray alerts: their states, what happened to them, and the answers each side may give.
import { alertStates, alertActions, alertResponses, type AlertState, type AlertAction, type AlertResponse } from '../schemas/alerts.js';
import { labelSet } from './label-set.js';

export const alertStateSet = labelSet<AlertState>('alert states', alertStates, {
  raised: 'New',
  seen: 'Seen',
  answered: 'Answered',
  resolved: 'Resolved',
});

export const alertActionSet = labelSet<AlertAction>('alert history', alertActions, {
  raised: 'Raised by the conflict check',
  updated: 'Changed by a new check',
  seen: 'Seen',
  answered: 'Answered',
  resolved: 'Resolved: the check finds no conflict',
  reopened: 'Raised again by a new check',
});

export const alertResponseSet = labelSet<AlertResponse>('alert answers', alertResponses, {
  'will-move-colonies': 'We will move the colonies out of range',
  'will-close-colonies': 'We will close the colonies in for the spray',
  'will-reschedule': 'We will reschedule the spray',
  'will-change-product': 'We will use a product safer for bees',
  noted: 'Noted, no change',
});
