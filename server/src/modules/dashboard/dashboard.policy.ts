// The dashboard policy table lives in shared/policies so the client's useCan() reads the same rules.
export { dashboardPolicy } from '../../../../shared/policies/dashboard.js';
