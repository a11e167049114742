// The weather policy table lives in shared/policies so the client's useCan() reads the same rules.
export { weatherPolicy } from '../../../../shared/policies/weather.js';
