// Every feature's policy table in one place, so the authorization test can check that
// each action has rows (tests/api/authz/*.rows.ts). The tables live in shared/policies,
// where the client's useCan() reads them too; features add theirs there.
export { policyTables, type PolicyTableName } from '../../../shared/policies/index.js';
