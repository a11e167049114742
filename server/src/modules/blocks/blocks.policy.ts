// The blocks policy table lives in shared/policies so the client's useCan() reads the same rules.
export { blocksPolicy } from '../../../../shared/policies/blocks.js';
