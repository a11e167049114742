// Pollenpact's own design tokens on top of PrimeVue's styled base. Every colour ramp the
// base refers to is replaced by one of ours, so no stock colour shows anywhere:
//   moss    primary: deep orchard-leaf green        straw   surfaces: sun-bleached neutrals
//   river   information: slate-water blue          ember   caution: spray amber
//   rust    danger: iron-oxide red                 heather help: muted violet
//   petal   bloom: blossom pink
// Firm, small radii; strong borders and text (contrast for reading in sunlight); a wide
// amber focus ring. Light and dark schemes share the ramps.
import { definePreset } from '@primeuix/themes';
import Aura from '@primeuix/themes/aura';

type Ramp = Record<50 | 100 | 200 | 300 | 400 | 500 | 600 | 700 | 800 | 900 | 950, string>;

export const moss: Ramp = {
  50: '#f1f6ee', 100: '#dde9d6', 200: '#bcd4ae', 300: '#94b97f', 400: '#6f9c58',
  500: '#52803d', 600: '#3f662f', 700: '#324f27', 800: '#2a4023', 900: '#23351f', 950: '#111d0e',
};
export const straw: Ramp & { 0: string } = {
  0: '#ffffff', 50: '#faf8f3', 100: '#f2eee4', 200: '#e4ddcc', 300: '#cfc5ad', 400: '#aa9f86',
  500: '#857b65', 600: '#665e4d', 700: '#4d463a', 800: '#34302a', 900: '#22201c', 950: '#151411',
};
export const river: Ramp = {
  50: '#eef5f8', 100: '#d5e6ee', 200: '#aecfdd', 300: '#7fb1c8', 400: '#5192ae',
  500: '#357893', 600: '#2a6078', 700: '#234d60', 800: '#1e3f4e', 900: '#1a3441', 950: '#0e1e26',
};
export const ember: Ramp = {
  50: '#fdf6e9', 100: '#f9e7c4', 200: '#f2cf8a', 300: '#e8b04e', 400: '#d9922a',
  500: '#c77d12', 600: '#a5630d', 700: '#844c0f', 800: '#6b3d12', 900: '#593312', 950: '#331a06',
};
export const rust: Ramp = {
  50: '#fcf1ef', 100: '#f8dcd7', 200: '#f0b8ae', 300: '#e48a7b', 400: '#d45f4b',
  500: '#bf4330', 600: '#a13424', 700: '#852b1f', 800: '#6e271d', 900: '#5c241c', 950: '#32100b',
};
export const heather: Ramp = {
  50: '#f6f2f7', 100: '#ebe2ee', 200: '#d7c5dd', 300: '#bc9fc6', 400: '#9d77a9',
  500: '#815a8e', 600: '#6a4775', 700: '#573b60', 800: '#49334f', 900: '#3e2d43', 950: '#241727',
};
export const petal: Ramp = {
  50: '#fcf0f4', 100: '#f9dde6', 200: '#f3bccd', 300: '#ea90ab', 400: '#df6a8d',
  500: '#d04f75', 600: '#b13a5e', 700: '#912f4d', 800: '#772941', 900: '#632639', 950: '#39111d',
};

export const pollenpactPreset = definePreset(Aura, {
  primitive: {
    borderRadius: { none: '0', xs: '2px', sm: '3px', md: '4px', lg: '6px', xl: '10px' },
    // The base's named ramps, each pointed at one of ours.
    emerald: moss, green: moss, lime: moss, teal: river, cyan: river, sky: river, blue: river, indigo: river,
    violet: heather, purple: heather, fuchsia: petal, pink: petal, rose: petal,
    red: rust, orange: ember, amber: ember, yellow: ember,
    slate: straw, gray: straw, zinc: straw, neutral: straw, stone: straw,
  },
  components: {
    // Zoom and filter switches: the chosen option filled with the primary colour, the others in
    // dark text, so the state reads at a glance in bright light.
    togglebutton: {
      colorScheme: {
        light: {
          root: { background: '{surface.100}', borderColor: '{surface.400}', hoverBackground: '{surface.200}', color: '{surface.800}', hoverColor: '{surface.950}', checkedBackground: '{primary.700}', checkedColor: '#ffffff', checkedBorderColor: '{primary.700}' },
          content: { checkedBackground: '{primary.700}' },
          icon: { color: '{surface.700}', hoverColor: '{surface.900}', checkedColor: '#ffffff' },
        },
        dark: {
          root: { background: '{surface.900}', borderColor: '{surface.600}', hoverBackground: '{surface.800}', color: '{surface.100}', hoverColor: '{surface.0}', checkedBackground: '{primary.300}', checkedColor: '{primary.950}', checkedBorderColor: '{primary.300}' },
          content: { checkedBackground: '{primary.300}' },
          icon: { color: '{surface.200}', hoverColor: '{surface.0}', checkedColor: '{primary.950}' },
        },
      },
    },
  },
  semantic: {
    primary: moss,
    focusRing: { width: '3px', style: 'solid', color: '{amber.500}', offset: '2px' },
    formField: { paddingX: '0.75rem', paddingY: '0.625rem', borderRadius: '{border.radius.md}' },
    colorScheme: {
      light: {
        surface: straw,
        primary: { color: '{primary.700}', contrastColor: '#ffffff', hoverColor: '{primary.800}', activeColor: '{primary.900}' },
        highlight: { background: '{primary.100}', focusBackground: '{primary.200}', color: '{primary.900}', focusColor: '{primary.950}' },
        text: { color: '{surface.900}', hoverColor: '{surface.950}', mutedColor: '{surface.600}', hoverMutedColor: '{surface.700}' },
        content: { borderColor: '{surface.300}' },
        // Field borders at 3:1 or more against white (WCAG 2.1, 1.4.11 non-text contrast).
        formField: { borderColor: '{surface.500}', hoverBorderColor: '{surface.700}', placeholderColor: '{surface.600}', floatLabelColor: '{surface.600}' },
      },
      dark: {
        surface: straw,
        primary: { color: '{primary.300}', contrastColor: '{primary.950}', hoverColor: '{primary.200}', activeColor: '{primary.100}' },
        highlight: { background: 'rgba(148,185,127,.2)', focusBackground: 'rgba(148,185,127,.3)', color: '{primary.100}', focusColor: '{primary.50}' },
        text: { color: '{surface.50}', hoverColor: '{surface.0}', mutedColor: '{surface.300}', hoverMutedColor: '{surface.200}' },
        content: { borderColor: '{surface.700}' },
        formField: { borderColor: '{surface.500}', hoverBorderColor: '{surface.300}', placeholderColor: '{surface.400}', floatLabelColor: '{surface.400}' },
      },
    },
  },
});
