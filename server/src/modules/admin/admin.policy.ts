// The admin policy table lives in shared/policies so the client's useCan() reads the same rules.
export { adminPolicy } from '../../../../shared/policies/admin.js';
