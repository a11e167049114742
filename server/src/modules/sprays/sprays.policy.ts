// The sprays policy table lives in shared/policies so the client's useCan() reads the same rules.
export { spraysPolicy } from '../../../../shared/policies/sprays.js';
