// The agreements policy table lives in shared/policies so the client's useCan() reads the same rules.
export { agreementsPolicy } from '../../../../shared/policies/agreements.js';
