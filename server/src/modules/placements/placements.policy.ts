// The placements policy table lives in shared/policies so the client's useCan() reads the same rules.
export { placementsPolicy } from '../../../../shared/policies/placements.js';
