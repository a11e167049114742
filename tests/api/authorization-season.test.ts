// The authorization table's season rows: blocks, the season overviews and sprays
// (runner and callers in tests/api/authz/authorization-table.ts).
import { describeAuthorizationTable } from './authz/authorization-table.js';

await describeAuthorizationTable('season');
