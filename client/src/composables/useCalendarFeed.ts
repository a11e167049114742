// The user's private calendar feed address: loaded once, and renewed on request (the old
// address stops working). `error` is what went wrong with either.
import { computed } from 'vue';
import { calendarApi } from '@/api/calendar';
import { useAsync } from './useAsync';
import { useSubmit } from './useSubmit';

export function useCalendarFeed() {
  const feed = useAsync(async () => (await calendarApi.feed()).url);
  const renewal = useSubmit(async () => {
    const { url } = await calendarApi.renew();
    feed.data.value = url;
    return url;
  });
  const error = computed(() => renewal.error.value ?? feed.error.value);
  return { url: feed.data, error, renewing: renewal.saving, renew: renewal.submit };
}
