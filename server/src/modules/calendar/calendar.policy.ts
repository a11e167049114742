// The calendar policy table lives in shared/policies so the client's useCan() reads the same rules.
export { calendarPolicy } from '../../../../shared/policies/calendar.js';
