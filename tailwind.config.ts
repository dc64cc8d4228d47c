import type { Config } from 'tailwindcss';
import plugin from 'tailwindcss/plugin';

/**
 * Varden's design tokens. apps/web/src/styles/index.css loads this file with `@config`, so
 * every class the web app uses (bg-paper, text-ink, fill-watch, text-lg, p-4, desk:flex …)
 * comes from here and nowhere else: Tailwind's default palette, type scale and spacing are
 * replaced, not extended.
 *
 * Colours are CSS variables (--v-<token>) so the light and dark themes share class names;
 * the values of both themes live in `palette` below and are written to :root by the plugin
 * at the end of this file. Every pair that carries text or a glyph is checked for WCAG 2.2
 * AA in apps/web/src/styles/contrast.test.ts.
 */

export const themeNames = ['light', 'dark'] as const;
export type ThemeName = (typeof themeNames)[number];

export const colorTokens = [
  // Ground and ink.
  'paper', // page ground: warm off-white paper (light), deep slate (dark)
  'surface', // panels and cards, one step up from paper
  'sunken', // wells, table headers, code
  'ink', // body text: deep blue-slate, the colour of painted switchgear
  'ink-muted', // secondary text that must still pass AA
  'line', // decorative dividers (no contrast duty)
  'line-strong', // borders that delimit a control (≥ 3:1 against paper and surface)
  // Accent.
  'copper', // primary actions and links: windings and busbars
  'on-copper', // text on a copper fill
  'focus', // focus ring on paper and surface
  // The app frame (rail and phone header), painted in the ink colour.
  'frame',
  'frame-ink',
  'frame-ink-muted',
  'frame-active', // the current section in the rail
  'frame-focus', // focus ring on the frame
  // Condition bands: always drawn with their shape and word, never colour alone.
  'healthy', // filled circle, blue-green
  'watch', // triangle, ochre
  'replace', // square, brick red
  'remeasure', // diamond, violet
  // Service status (health panel): own glyphs, colours shared with healthy / replace.
  'up',
  'down',
] as const;
export type ColorToken = (typeof colorTokens)[number];

type ThemePalette = Record<ColorToken, `#${string}`>;

const lightBands = {
  healthy: '#17706A',
  watch: '#8A5A00',
  replace: '#A83A26',
  remeasure: '#6E43A6',
} as const;

const darkBands = {
  healthy: '#4CC0B2',
  watch: '#DDB04A',
  replace: '#F0826C',
  remeasure: '#B79CF2',
} as const;

export const palette = {
  light: {
    paper: '#F5F2EA',
    surface: '#FFFDF7',
    sunken: '#ECE7DC',
    ink: '#1C2A38',
    'ink-muted': '#4B5867',
    line: '#DDD6C8',
    'line-strong': '#7D7768',
    copper: '#9C4A1A',
    'on-copper': '#FFFFFF',
    focus: '#9C4A1A',
    frame: '#1E2E3D',
    'frame-ink': '#EEF1F4',
    'frame-ink-muted': '#AEBBC8',
    'frame-active': '#2F4356',
    'frame-focus': '#E8995C',
    ...lightBands,
    up: lightBands.healthy,
    down: lightBands.replace,
  },
  dark: {
    paper: '#11171E',
    surface: '#18212A',
    sunken: '#0D1217',
    ink: '#E8E4DA',
    'ink-muted': '#A8B2BC',
    line: '#2A3642',
    'line-strong': '#7E8A96',
    copper: '#E2955A',
    'on-copper': '#1A1006',
    focus: '#E2955A',
    frame: '#0A0F14',
    'frame-ink': '#E8E4DA',
    'frame-ink-muted': '#A0ACB8',
    'frame-active': '#1F2C38',
    'frame-focus': '#E2955A',
    ...darkBands,
    up: darkBands.healthy,
    down: darkBands.replace,
  },
} as const satisfies Record<ThemeName, ThemePalette>;

/** Pairs that must meet WCAG 2.2 AA in both themes: text 4.5:1, glyphs and control edges 3:1. */
export const contrastPairs: ReadonlyArray<{
  foreground: ColorToken;
  background: ColorToken;
  minimum: 4.5 | 3;
}> = [
  ...(['ink', 'ink-muted', 'copper', 'healthy', 'watch', 'replace', 'remeasure', 'up', 'down'] as const).flatMap(
    (foreground) =>
      (['paper', 'surface', 'sunken'] as const).map((background) => ({ foreground, background, minimum: 4.5 as const })),
  ),
  { foreground: 'on-copper', background: 'copper', minimum: 4.5 },
  { foreground: 'frame-ink', background: 'frame', minimum: 4.5 },
  { foreground: 'frame-ink-muted', background: 'frame', minimum: 4.5 },
  { foreground: 'frame-ink', background: 'frame-active', minimum: 4.5 },
  { foreground: 'focus', background: 'paper', minimum: 3 },
  { foreground: 'focus', background: 'surface', minimum: 3 },
  { foreground: 'frame-focus', background: 'frame', minimum: 3 },
  { foreground: 'frame-focus', background: 'frame-active', minimum: 3 },
  { foreground: 'line-strong', background: 'paper', minimum: 3 },
  { foreground: 'line-strong', background: 'surface', minimum: 3 },
];

/** Type scale in px: 12/14/16/20/24/32. 16 is the floor for anything read or typed on a phone. */
export const typeScale = {
  xs: { sizePx: 12, lineHeightPx: 16 },
  sm: { sizePx: 14, lineHeightPx: 20 },
  base: { sizePx: 16, lineHeightPx: 24 },
  lg: { sizePx: 20, lineHeightPx: 28 },
  xl: { sizePx: 24, lineHeightPx: 32 },
  '2xl': { sizePx: 32, lineHeightPx: 40 },
} as const satisfies Record<string, { sizePx: number; lineHeightPx: number }>;

/** Spacing on a 4 px grid, plus a few named layout measures. */
export const spacing = {
  '0': '0px',
  px: '1px',
  '0.5': '0.125rem',
  '1': '0.25rem',
  '1.5': '0.375rem',
  '2': '0.5rem',
  '3': '0.75rem',
  '4': '1rem',
  '5': '1.25rem',
  '6': '1.5rem',
  '8': '2rem',
  '10': '2.5rem',
  '12': '3rem',
  '16': '4rem',
  '20': '5rem',
  '24': '6rem',
  /** Minimum touch target on a phone (48 px). */
  touch: '3rem',
  /** Minimum control height on a desk (40 px). */
  control: '2.5rem',
  /** Width of the section rail on a desk. */
  rail: '13rem',
  /** Comfortable measure for running text. */
  measure: '40rem',
  /** Widest the content column grows. */
  content: '72rem',
} as const satisfies Record<string, string>;

/** One breakpoint: at 641 px and wider the desk layout (rail) replaces the phone layout. */
export const screens = { desk: '641px' } as const;

const rem = (px: number) => `${px / 16}rem`;

const cssVariables = (theme: ThemeName) =>
  Object.fromEntries(colorTokens.map((token) => [`--v-${token}`, palette[theme][token]]));

const themeVariables = plugin(({ addBase }) => {
  addBase({
    ':root': { ...cssVariables('light'), colorScheme: 'light' },
    '@media (prefers-color-scheme: dark)': {
      ':root:not([data-theme="light"])': { ...cssVariables('dark'), colorScheme: 'dark' },
    },
    ':root[data-theme="dark"]': { ...cssVariables('dark'), colorScheme: 'dark' },
    // The frame is dark in both themes, so its focus ring switches to a lighter copper.
    '[data-surface="frame"]': { '--v-focus': 'var(--v-frame-focus)' },
    // Paper is white whatever the screen theme: print with the light palette.
    '@media print': {
      ':root, :root[data-theme], :root:not([data-theme="light"])': { ...cssVariables('light'), colorScheme: 'light' },
    },
  });
});

export default {
  content: ['./apps/web/index.html', './apps/web/src/**/*.{ts,tsx}'],
  theme: {
    colors: {
      transparent: 'transparent',
      current: 'currentColor',
      ...Object.fromEntries(colorTokens.map((token) => [token, `var(--v-${token})`])),
    },
    fontFamily: {
      sans: ['"Work Sans"', 'system-ui', '-apple-system', '"Segoe UI"', 'Roboto', 'sans-serif'],
      mono: ['ui-monospace', '"SFMono-Regular"', 'Menlo', 'Consolas', 'monospace'],
    },
    fontSize: Object.fromEntries(
      Object.entries(typeScale).map(([name, { sizePx, lineHeightPx }]) => [
        name,
        [rem(sizePx), { lineHeight: rem(lineHeightPx) }],
      ]),
    ),
    fontWeight: { normal: '400', medium: '500', semibold: '600' },
    spacing,
    screens,
    borderRadius: { none: '0px', sm: '2px', DEFAULT: '4px', md: '6px', full: '9999px' },
    extend: {
      maxWidth: { measure: spacing.measure, content: spacing.content },
    },
  },
  plugins: [themeVariables],
} satisfies Config;
