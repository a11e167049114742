// The invoices policy table lives in shared/policies so the client's useCan() reads the same rules.
export { invoicesPolicy } from '../../../../shared/policies/invoices.js';
