// Calendar feed calls (server module calendar): the private iCalendar address and a new one.
import { http } from './http';

export const calendarApi = {
  feed: () => http.get<{ url: string | null }>('/calendar'),
  renew: () => http.post<{ url: string }>('/calendar/token'),
};
