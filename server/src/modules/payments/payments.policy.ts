// The payments policy table lives in shared/policies so the client's useCan() reads the same rules.
export { paymentsPolicy } from '../../../../shared/policies/payments.js';
