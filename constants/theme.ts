/**
 * Shoalshift design tokens: the one place colours, spacing, radii, type and breakpoints live.
 * Components ask for token names (`colors.text`, `space.md`), never raw values.
 */

/** Shoalshift's palette: deep teal ink on pale sea-glass by day, soft light on slate at night. */
export const palette = {
  light: {
    background: '#F3F6F5',
    surface: '#FFFFFF',
    surfaceRaised: '#E7EEEC',
    text: '#102422',
    textMuted: '#44605B',
    border: '#D3DEDB',
    /** Form field outlines: non-text contrast ≥ 3:1 against the surface (WCAG 2.2, 1.4.11). */
    fieldBorder: '#6E8783',
    primary: '#0A5F5A',
    primaryPressed: '#07423F',
    onPrimary: '#FFFFFF',
    link: '#0A5F5A',
    focus: '#1F6FD1',
    okText: '#1C6B35',
    okSurface: '#E3F3E7',
    watchText: '#7A4D00',
    watchSurface: '#FCF0D6',
    dangerText: '#A3231B',
    dangerSurface: '#FBE5E2',
    infoText: '#1E4F8A',
    infoSurface: '#E2ECF8',
    navBackground: '#FFFFFF',
    navActive: '#0A5F5A',
    navActiveSurface: '#DCEDEA',
    navInactive: '#4A625E',
  },
  dark: {
    background: '#0C1615',
    surface: '#14211F',
    surfaceRaised: '#1C2C2A',
    text: '#E4EEEC',
    textMuted: '#A3B7B3',
    border: '#2A3D3A',
    fieldBorder: '#7C938F',
    primary: '#6FCFC4',
    primaryPressed: '#9ADFD7',
    onPrimary: '#062320',
    link: '#7FD8CD',
    focus: '#8DB8F2',
    okText: '#86D89E',
    okSurface: '#173322',
    watchText: '#F0C468',
    watchSurface: '#3A2E12',
    dangerText: '#FF9C92',
    dangerSurface: '#3D1A17',
    infoText: '#9CC3F5',
    infoSurface: '#172A42',
    navBackground: '#101C1B',
    navActive: '#7FD8CD',
    navActiveSurface: '#1D3532',
    navInactive: '#A3B7B3',
  },
} as const;

export type ColorSchemeName = keyof typeof palette;
export type ColorToken = keyof (typeof palette)['light'];
export type Colors = { readonly [K in ColorToken]: string };

/** The three water-status tones. Each one is always shown with a word, never by colour alone. */
export type StatusTone = 'ok' | 'watch' | 'danger' | 'info';
export const statusColorTokens: Record<StatusTone, { text: ColorToken; surface: ColorToken }> = {
  ok: { text: 'okText', surface: 'okSurface' },
  watch: { text: 'watchText', surface: 'watchSurface' },
  danger: { text: 'dangerText', surface: 'dangerSurface' },
  info: { text: 'infoText', surface: 'infoSurface' },
};

/** Spacing scale in density-independent pixels. */
export const space = { xxs: 2, xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32, xxxl: 48 } as const;
export type SpaceToken = keyof typeof space;

export const radii = { sm: 6, md: 10, lg: 16, pill: 999 } as const;
export type RadiusToken = keyof typeof radii;

/** Font family names as registered with expo-font (see `fontSources`). */
export const fontFamilies = {
  regular: 'AtkinsonHyperlegible-Regular',
  bold: 'AtkinsonHyperlegible-Bold',
} as const;

/** Type scale: size and line height in px. Body text is 17 px so readings stay legible at arm's length. */
export const typeScale = {
  caption: { fontSize: 14, lineHeight: 20 },
  body: { fontSize: 17, lineHeight: 24 },
  label: { fontSize: 16, lineHeight: 22 },
  title: { fontSize: 21, lineHeight: 28 },
  heading: { fontSize: 28, lineHeight: 34 },
  figure: { fontSize: 24, lineHeight: 30 },
} as const;
export type TypeVariant = keyof typeof typeScale;

/** Window widths (px) where the layout changes. Width says nothing about the pointer. */
export const breakpoints = { tablet: 600, wide: 900 } as const;

export const layout = {
  /** Readable line length for forms and lists on wide screens. */
  maxContentWidth: 1040,
  maxFormWidth: 440,
  /** WCAG 2.2 2.5.8 asks for 24 px; platform guides ask for 44 (Apple) / 48 (Material). */
  minTouchTarget: 44,
  sideRailWidth: 220,
} as const;
