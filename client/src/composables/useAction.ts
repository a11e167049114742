// A button's action on a page: busy while it runs, a toast saying it was done (or why not),
// then the page's data reloaded. `running` names the action at work, so a page with several
// buttons can show which one is busy. A refusal is toasted as "Not done" unless the page
// names it in its own words (`failed`, e.g. "Not changed").
import { ref } from 'vue';
import { useToast } from 'primevue/usetoast';
import { messageOf } from '@/api/error-messages';

export function useAction(reload: () => unknown = () => undefined, options: { failed?: string } = {}) {
  const toast = useToast();
  const busy = ref(false);
  const running = ref<string | null>(null);

  /** Runs `what`; true when it succeeded. */
  async function act(what: () => Promise<unknown>, done: string, name: string | null = null): Promise<boolean> {
    busy.value = true;
    running.value = name;
    try {
      await what();
      toast.add({ severity: 'success', summary: done, life: 4000 });
      await reload();
      return true;
    } catch (err) {
      toast.add({ severity: 'error', summary: options.failed ?? 'Not done', detail: messageOf(err), life: 6000 });
      return false;
    } finally {
      busy.value = false;
      running.value = null;
    }
  }

  return { busy, running, act };
}
