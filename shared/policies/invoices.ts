// Who may do what with invoices. Money is for owners and managers; viewers may read;
// field crew and applicators never see it. Services scope every row to the user's business.
import type { PolicyTable } from './policy-table.js';

export const invoicesPolicy = {
  read: ['apiary:owner', 'apiary:manager', 'apiary:viewer', 'farm:owner', 'farm:manager', 'farm:viewer'],
  draft: ['apiary:owner', 'apiary:manager'],
  issue: ['apiary:owner', 'apiary:manager'],
  void: ['apiary:owner', 'apiary:manager'],
  creditNote: ['apiary:owner', 'apiary:manager'],
  receivables: ['apiary:owner', 'apiary:manager', 'apiary:viewer'],
  payables: ['farm:owner', 'farm:manager', 'farm:viewer'],
} as const satisfies PolicyTable;
