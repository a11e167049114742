// A form's save: `saving` while it runs, the server's message and per-field errors when it
// is refused (for <FormField :error>), and optional toasts when it is done or refused.
import { useToast } from 'primevue/usetoast';
import { useAsync } from './useAsync';

interface SubmitOptions<T> {
  done?: string | ((result: T) => string);
  /** Toast a refusal under this title (for forms that show no message of their own). */
  failed?: string;
}

export function useSubmit<T, A extends unknown[] = []>(save: (...args: A) => Promise<T>, options: SubmitOptions<T> = {}) {
  const toast = useToast();
  const state = useAsync(save, { immediate: false });

  async function submit(...args: A): Promise<T | null> {
    const result = await state.run(...args);
    if (state.error.value) {
      if (options.failed) toast.add({ severity: 'error', summary: options.failed, detail: state.error.value, life: 6000 });
    } else if (options.done) {
      toast.add({ severity: 'success', summary: typeof options.done === 'function' ? options.done(result as T) : options.done, life: 4000 });
    }
    return result;
  }

  return { saving: state.loading, error: state.error, fieldErrors: state.fieldErrors, submit };
}
