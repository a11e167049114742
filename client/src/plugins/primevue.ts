// PrimeVue with our theme preset, Toast and Confirm registered once.
import type { App } from 'vue';
import PrimeVue from 'primevue/config';
import ToastService from 'primevue/toastservice';
import ConfirmationService from 'primevue/confirmationservice';
import Tooltip from 'primevue/tooltip';
import { pollenpactPreset } from './theme-preset';

export function install(app: App) {
  app.use(PrimeVue, { theme: { preset: pollenpactPreset, options: { darkModeSelector: '.app-dark', cssLayer: false } } });
  app.use(ToastService);
  app.use(ConfirmationService);
  app.directive('tooltip', Tooltip);
}
