// How much of the season the timeline shows at once.
export type TimelineZoom = 'season' | 'month' | 'week' | 'day';
