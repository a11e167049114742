// The organization policy table lives in shared/policies so the client's useCan() reads the same rules.
export { organizationPolicy } from '../../../../shared/policies/organization.js';
