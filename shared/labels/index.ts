// Every label set in one list, so a test can walk each code of each set.
import type { LabelSet } from './label-set.js';
import { requestStateSet, commitmentStateSet, requestEventSet } from './requests.js';
import { agreementStateSet, amendmentStateSet, amendmentTermSet } from './agreements.js';
import { placementStateSet, fieldStepSet } from './placements.js';
import { sprayStateSet, conflictGradeSet, beeToxicitySet } from './sprays.js';
import { alertStateSet, alertActionSet, alertResponseSet } from './alerts.js';
import { invoiceStatusSet, pricedLineSet, paymentStateSet, paymentMethodSet } from './invoices.js';
import { organizationKindSet, memberRoleSet } from './organizations.js';
import { cropSet } from './crops.js';
import { jobStateSet, queueSet } from './jobs.js';
import { timelineItemKindSet, mapFeatureKindSet, bloomStateSet } from './season.js';

export { labelOf, type LabelSet } from './label-set.js';

export const labelSets: readonly LabelSet[] = [
  requestStateSet, commitmentStateSet, requestEventSet,
  agreementStateSet, amendmentStateSet, amendmentTermSet,
  placementStateSet, fieldStepSet,
  sprayStateSet, conflictGradeSet, beeToxicitySet,
  alertStateSet, alertActionSet, alertResponseSet,
  invoiceStatusSet, pricedLineSet, paymentStateSet, paymentMethodSet,
  organizationKindSet, memberRoleSet,
  cropSet, jobStateSet, queueSet,
  timelineItemKindSet, mapFeatureKindSet, bloomStateSet,
];
