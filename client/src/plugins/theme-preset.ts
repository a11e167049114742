// Pollenpact's own design tokens on top of PrimeVue's base: a moss-green primary, warm
// clay and sun-bleached neutrals, firm edges and high contrast for outdoor reading.
import { definePreset } from '@primeuix/themes';
import Aura from '@primeuix/themes/aura';

const moss = {
  50: '#f1f6ee', 100: '#dde9d6', 200: '#bcd4ae', 300: '#94b97f', 400: '#6f9c58',
  500: '#52803d', 600: '#3f662f', 700: '#324f27', 800: '#2a4023', 900: '#23351f', 950: '#111d0e',
};
const straw = {
  0: '#ffffff', 50: '#faf8f3', 100: '#f2eee4', 200: '#e4ddcc', 300: '#cfc5ad', 400: '#aa9f86',
  500: '#857b65', 600: '#665e4d', 700: '#4d463a', 800: '#34302a', 900: '#22201c', 950: '#151411',
};

export const pollenpactPreset = definePreset(Aura, {
  primitive: { borderRadius: { none: '0', xs: '2px', sm: '3px', md: '4px', lg: '6px', xl: '10px' } },
  semantic: {
    primary: moss,
    focusRing: { width: '3px', style: 'solid', color: '#c77d12', offset: '2px' },
    colorScheme: {
      light: {
        surface: straw,
        primary: { color: '{primary.700}', contrastColor: '#ffffff', hoverColor: '{primary.800}', activeColor: '{primary.900}' },
        highlight: { background: '{primary.100}', focusBackground: '{primary.200}', color: '{primary.900}', focusColor: '{primary.950}' },
        text: { color: '{surface.900}', mutedColor: '{surface.600}', hoverColor: '{surface.950}' },
      },
      dark: {
        surface: straw,
        primary: { color: '{primary.300}', contrastColor: '{primary.950}', hoverColor: '{primary.200}', activeColor: '{primary.100}' },
        highlight: { background: 'rgba(148,185,127,.2)', focusBackground: 'rgba(148,185,127,.3)', color: '{primary.100}', focusColor: '{primary.50}' },
      },
    },
  },
});
