import { createContext, useContext } from 'react';
import { useColorScheme, type TextStyle } from 'react-native';
import {
  breakpoints,
  fontFamilies,
  layout,
  palette,
  radii,
  space,
  typeScale,
  type ColorSchemeName,
  type Colors,
} from '@/constants/theme';

export interface Theme {
  scheme: ColorSchemeName;
  colors: Colors;
  space: typeof space;
  radii: typeof radii;
  type: typeof typeScale;
  breakpoints: typeof breakpoints;
  layout: typeof layout;
  /** Ready-made text styles per weight: the app font once loaded, else the system font. */
  font: { regular: TextStyle; bold: TextStyle };
  /** True when the bundled font loaded; false while loading or after a load error. */
  appFontActive: boolean;
}

const appFont = {
  regular: { fontFamily: fontFamilies.regular },
  bold: { fontFamily: fontFamilies.bold },
} as const;
// The system font synthesises weights itself, so weight goes in fontWeight.
const systemFont = {
  regular: { fontWeight: '400' },
  bold: { fontWeight: '700' },
} as const;

export function buildTheme(scheme: ColorSchemeName, appFontActive: boolean): Theme {
  return {
    scheme,
    colors: palette[scheme],
    space,
    radii,
    type: typeScale,
    breakpoints,
    layout,
    font: appFontActive ? appFont : systemFont,
    appFontActive,
  };
}

/** Whether the bundled font is active; set by ThemeProvider from `useFonts`. */
export const FontStatusContext = createContext(false);

/** A fixed scheme for part of the tree (the printable plan is always light: it is for paper). */
export const SchemeOverrideContext = createContext<ColorSchemeName | null>(null);

/** Scheme follows the system setting unless a parent fixes it; anything but "dark" reads as light. */
export function useSchemeName(): ColorSchemeName {
  const fixed = useContext(SchemeOverrideContext);
  const system = useColorScheme() === 'dark' ? 'dark' : 'light';
  return fixed ?? system;
}

// Four possible themes: built once so consumers get stable objects.
const themes = {
  light: { app: buildTheme('light', true), system: buildTheme('light', false) },
  dark: { app: buildTheme('dark', true), system: buildTheme('dark', false) },
} as const;

/** The current theme: the system colour scheme and the font state. */
export function useTheme(): Theme {
  const scheme = useSchemeName();
  const appFontActive = useContext(FontStatusContext);
  return themes[scheme][appFontActive ? 'app' : 'system'];
}
