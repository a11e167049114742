// The alerts policy table lives in shared/policies so the client's useCan() reads the same rules.
export { alertsPolicy } from '../../../../shared/policies/alerts.js';
