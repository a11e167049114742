// The auth policy table lives in shared/policies so the client's useCan() reads the same rules.
export { authPolicy } from '../../../../shared/policies/auth.js';
