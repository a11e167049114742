// Whether the browser believes it has a connection, kept current by `online` / `offline`.
import { onScopeDispose, ref } from 'vue';

export function useOnline() {
  const online = ref(navigator.onLine);
  const update = () => { online.value = navigator.onLine; };
  window.addEventListener('online', update);
  window.addEventListener('offline', update);
  onScopeDispose(() => { window.removeEventListener('online', update); window.removeEventListener('offline', update); });
  return online;
}
