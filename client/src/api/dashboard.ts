// Season overview calls: each side's dashboard, the colony total, the timeline and the map.
import { http } from './http';
import type { BeekeeperDashboard, GrowerDashboard, SeasonMap, SeasonTimeline } from '@shared/schemas/dashboard';

export const dashboardApi = {
  grower: (season?: number) => http.get<GrowerDashboard>('/dashboard/grower', { query: { season } }),
  beekeeper: (days = 7, season?: number) => http.get<BeekeeperDashboard>('/dashboard/beekeeper', { query: { days, season } }),
  setColoniesOwned: (coloniesOwned: number | null) => http.put<{ coloniesOwned: number | null }>('/dashboard/colonies-owned', { coloniesOwned }),
  timeline: (season?: number) => http.get<SeasonTimeline>('/dashboard/timeline', { query: { season } }),
  map: (season?: number) => http.get<SeasonMap>('/dashboard/map', { query: { season } }),
};
