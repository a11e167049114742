// The bloom policy table lives in shared/policies so the client's useCan() reads the same rules.
export { bloomPolicy } from '../../../../shared/policies/bloom.js';
