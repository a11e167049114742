// The signed-in user: loaded once, updated on sign-in, sign-out and joining by invitation.
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import { authApi } from '@/api/auth';
import { organizationApi } from '@/api/organization';
import { connectSocket, disconnectSocket } from '@/api/socket';
import type { LoginBody, SignupBody, PreferencesBody, SessionUser } from '@shared/schemas/auth';
import type { AcceptInvitationBody } from '@shared/schemas/organization';
import { roleKey, type RoleKey } from '@shared/roles';

export const useSessionStore = defineStore('session', () => {
  const user = ref<SessionUser | null>(null);
  const loaded = ref(false);

  const side = computed<'farm' | 'apiary' | 'admin' | null>(() =>
    !user.value ? null : user.value.role === 'admin' ? 'admin' : user.value.organization!.kind,
  );
  const currentRoleKey = computed<RoleKey | null>(() =>
    user.value ? roleKey(user.value.organization?.kind ?? null, user.value.role) : null,
  );
  const units = computed(() => user.value?.units ?? 'imperial');
  const timeZone = computed(() => user.value?.timeZone ?? user.value?.organization?.timeZone ?? 'UTC');

  function setUser(next: SessionUser | null) {
    user.value = next;
    loaded.value = true;
    if (next) connectSocket();
    else disconnectSocket();
  }

  async function load() {
    if (loaded.value) return user.value;
    try {
      const { signedIn } = await authApi.csrf();
      setUser(signedIn ? (await authApi.me()).user : null);
    } catch {
      setUser(null);
    }
    return user.value;
  }

  return {
    user,
    loaded,
    side,
    roleKey: currentRoleKey,
    units,
    timeZone,
    load,
    setUser,
    async login(body: LoginBody) {
      setUser((await authApi.login(body)).user);
    },
    async signup(body: SignupBody) {
      setUser((await authApi.signup(body)).user);
    },
    async acceptInvitation(body: AcceptInvitationBody) {
      setUser((await organizationApi.acceptInvitation(body)).user);
    },
    async logout() {
      await authApi.logout();
      setUser(null);
    },
    async updatePreferences(body: PreferencesBody) {
      setUser((await authApi.updatePreferences(body)).user);
    },
    forget() {
      setUser(null);
    },
  };
});
