/**
 * The product look: one naive-ui override object shared by the light and dark themes.
 * Petrol/teal carries actions and focus; warm amber is kept for lamps and highlights.
 */
import type { GlobalThemeOverrides } from 'naive-ui';

export const palette = {
  petrol: '#1f6f78',
  petrolHover: '#26838d',
  petrolPressed: '#175960',
  petrolLight: '#4fb3bc',
  petrolLightHover: '#66c2ca',
  petrolLightPressed: '#3f9aa2',
  amber: '#f2b544',
  amberHover: '#f5c462',
  amberPressed: '#d99b2b',
  ink: '#16262b',
} as const;

const fontFamily =
  "'Inter', system-ui, -apple-system, 'Segoe UI', Roboto, 'Helvetica Neue', Arial, sans-serif";

export const themeOverrides: GlobalThemeOverrides = {
  common: {
    fontFamily,
    fontWeightStrong: '600',
    primaryColor: palette.petrol,
    primaryColorHover: palette.petrolHover,
    primaryColorPressed: palette.petrolPressed,
    primaryColorSuppl: palette.petrolHover,
    warningColor: palette.amberPressed,
    warningColorHover: palette.amber,
    warningColorPressed: '#c0861f',
    warningColorSuppl: palette.amber,
    borderRadius: '8px',
    borderRadiusSmall: '6px',
  },
  Button: { fontWeight: '500' },
  // Hints under fields must reach 4.5:1 on white (WCAG 2.1, 1.4.3).
  Form: { feedbackTextColor: '#5b6b70' },
  Card: { borderRadius: '12px' },
  Tag: { borderRadius: '6px' },
};

/** Dark backgrounds need a lighter primary to keep text and focus rings readable. */
export const darkThemeOverrides: GlobalThemeOverrides = {
  ...themeOverrides,
  common: {
    ...themeOverrides.common,
    primaryColor: palette.petrolLight,
    primaryColorHover: palette.petrolLightHover,
    primaryColorPressed: palette.petrolLightPressed,
    primaryColorSuppl: palette.petrolLightHover,
    warningColor: palette.amber,
    warningColorHover: palette.amberHover,
    warningColorPressed: palette.amberPressed,
    warningColorSuppl: palette.amberHover,
    bodyColor: '#111a1d',
    cardColor: '#172327',
    modalColor: '#172327',
    popoverColor: '#1c2a2f',
  },
  Form: { feedbackTextColor: '#a3b5ba' },
};
