// The authorization table's deal rows: hive requests, agreements, placements and invoices
// (runner and callers in tests/api/authz/authorization-table.ts).
import { describeAuthorizationTable } from './authz/authorization-table.js';

await describeAuthorizationTable('deals');
