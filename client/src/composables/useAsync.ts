// One pattern for loading data on a page: run a loader, keep its result, whether it is
// running and what went wrong (message and per-field errors from the server's answer).
// `run` reloads; a newer run wins over an older one still in flight.
import { ref, shallowRef, type Ref, type ShallowRef } from 'vue';
import { fieldErrorsOf, messageOf } from '@/api/error-messages';

export interface AsyncState<T, A extends unknown[]> {
  data: ShallowRef<T | null>;
  loading: Ref<boolean>;
  error: Ref<string | null>;
  fieldErrors: Ref<Record<string, string>>;
  run: (...args: A) => Promise<T | null>;
}

export function useAsync<T, A extends unknown[] = []>(loader: (...args: A) => Promise<T>, options: { immediate?: boolean } = {}): AsyncState<T, A> {
  const data = shallowRef<T | null>(null);
  const loading = ref(false);
  const error = ref<string | null>(null);
  const fieldErrors = ref<Record<string, string>>({});
  let latest = 0;

  async function run(...args: A): Promise<T | null> {
    const mine = ++latest;
    loading.value = true;
    error.value = null;
    fieldErrors.value = {};
    try {
      const result = await loader(...args);
      if (mine === latest) data.value = result;
      return result;
    } catch (err) {
      if (mine === latest) {
        error.value = messageOf(err);
        fieldErrors.value = fieldErrorsOf(err);
      }
      return null;
    } finally {
      if (mine === latest) loading.value = false;
    }
  }

  if (options.immediate !== false && loader.length === 0) void run(...([] as unknown as A));
  return { data, loading, error, fieldErrors, run };
}
