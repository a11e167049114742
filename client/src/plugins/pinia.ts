// Pinia store registry.
import type { App } from 'vue';
import { createPinia } from 'pinia';

export const pinia = createPinia();

export function install(app: App) {
  app.use(pinia);
}
