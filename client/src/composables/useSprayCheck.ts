// The dry-run conflict check of a spray plan while it is written: run half a second after
// the last change once the plan is complete enough (`ready`), or at once with `run`. A newer
// check wins over one still in flight (useAsync). A refused check shows no conflicts; its
// message is given only when no field is named, since the fields carry their own.
import { computed, onScopeDispose, watch } from 'vue';
import { spraysApi } from '@/api/sprays';
import { useAsync } from './useAsync';
import type { SprayInput } from '@shared/schemas/sprays';

const DEBOUNCE_MS = 500;

export function useSprayCheck(input: () => SprayInput, ready: () => boolean) {
  const state = useAsync(async (body: SprayInput) => (await spraysApi.check(body)).check, { immediate: false });
  let timer: ReturnType<typeof setTimeout> | null = null;

  async function run() {
    if (!ready()) return;
    await state.run(input());
    if (state.error.value) state.data.value = null;
  }

  watch(input, () => {
    if (timer) clearTimeout(timer);
    timer = setTimeout(run, DEBOUNCE_MS);
  }, { deep: true, immediate: true });
  onScopeDispose(() => { if (timer) clearTimeout(timer); });

  const error = computed(() => (Object.keys(state.fieldErrors.value).length ? null : state.error.value));
  return { check: state.data, checking: state.loading, error, fieldErrors: state.fieldErrors, run };
}
