// The commitments policy table lives in shared/policies so the client's useCan() reads the same rules.
export { commitmentsPolicy } from '../../../../shared/policies/commitments.js';
