// The requests policy table lives in shared/policies so the client's useCan() reads the same rules.
export { requestsPolicy } from '../../../../shared/policies/requests.js';
