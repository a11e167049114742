// Season CSV exports (server module exports): downloaded by address, with the session cookie.
export const exportUrls = {
  requests: '/api/exports/requests.csv',
  agreements: '/api/exports/agreements.csv',
  placements: '/api/exports/placements.csv',
};
