// The yards policy table lives in shared/policies so the client's useCan() reads the same rules.
export { yardsPolicy } from '../../../../shared/policies/yards.js';
