// The record a detail page shows, loaded by the :id in its address and again when the
// address moves to another one (useAsync's data, loading, error and run).
import { computed, watch } from 'vue';
import { useRoute } from 'vue-router';
import { useAsync } from './useAsync';

export function useRouteRecord<T>(load: (id: string) => Promise<T>) {
  const route = useRoute();
  const id = computed(() => String(route.params.id));
  const record = useAsync(() => load(id.value));
  watch(id, () => void record.run());
  return { id, record };
}
