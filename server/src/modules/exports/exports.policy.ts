// The exports policy table lives in shared/policies so the client's useCan() reads the same rules.
export { exportsPolicy } from '../../../../shared/policies/exports.js';
