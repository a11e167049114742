// Whether the signed-in user's role may do an action, read from the same policy tables the
// server's allow() uses (shared/policies). It only shows or hides; the server decides.
import { computed, type ComputedRef } from 'vue';
import { can, type PolicyAction } from '@shared/policies/index';
import { useSessionStore } from '@/stores/session';

export function useCan(action: PolicyAction): ComputedRef<boolean> {
  const session = useSessionStore();
  return computed(() => can(session.roleKey, action));
}
