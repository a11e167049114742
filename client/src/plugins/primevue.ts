// PrimeVue with our theme preset, Toast and Confirm registered once.
import type { App } from 'vue';
import PrimeVue from 'primevue/config';
import ToastService from 'primevue/toastservice';
import ConfirmationService from 'primevue/confirmationservice';
import Tooltip from 'primevue/tooltip';
import { pollenpactPreset } from './theme-preset';

interface PassThroughParams { attrs?: Record<string, unknown>; parent?: { instance?: { $options?: { name?: string } }; attrs?: Record<string, unknown> } }

// InputNumber and Select put the attributes they are given on their outer element, not on
// the element that takes focus; a field's hint and message (FormField's aria-describedby)
// must be on the focused one for a screen reader to read them with it.
const describedBy = (attrs: Record<string, unknown> | undefined) => (attrs?.['aria-describedby'] ? { 'aria-describedby': attrs['aria-describedby'] } : {});
const passThrough = {
  inputtext: { root: ({ parent }: PassThroughParams) => (parent?.instance?.$options?.name === 'InputNumber' ? describedBy(parent.attrs) : {}) },
  select: { label: ({ attrs }: PassThroughParams) => describedBy(attrs) },
};

export function install(app: App) {
  app.use(PrimeVue, { theme: { preset: pollenpactPreset, options: { darkModeSelector: '.app-dark', cssLayer: false } }, pt: passThrough });
  app.use(ToastService);
  app.use(ConfirmationService);
  app.directive('tooltip', Tooltip);
}
