// The pests policy table lives in shared/policies so the client's useCan() reads the same rules.
export { pestsPolicy } from '../../../../shared/policies/pests.js';
