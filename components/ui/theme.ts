/**
 * Kenning's design tokens. Contrast ratios (WCAG 2.x) were checked for every
 * text/background pair used: ink on paper 14.0, white on ember 5.3, muted on
 * white 6.2, rail text on night 10.3, lantern on night 8.0.
 */
export const colors = {
  ink: '#17252B',
  paper: '#F5F2EA',
  surface: '#FFFFFF',
  line: '#D9D3C5',
  lineStrong: '#B9B09C',
  muted: '#54646B',
  ember: '#B8461B',
  emberDeep: '#8F3412',
  emberSoft: '#F6E3D8',
  moss: '#2F5C44',
  mossSoft: '#E1ECE4',
  night: '#17252B',
  nightRaised: '#22353D',
  railText: '#C9D3D6',
  lantern: '#E8B04A',
  danger: '#A3261E',
  dangerSoft: '#FBE9E6',
  cautionSoft: '#FFF4DB',
  cautionLine: '#D9A441',
  focus: '#3B6FD9',
} as const;

export const fonts = {
  regular: 'Barlow_400Regular',
  medium: 'Barlow_500Medium',
  semibold: 'Barlow_600SemiBold',
  bold: 'Barlow_700Bold',
} as const;

/** Spacing on a 4-point grid. */
export const space = { xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32 } as const;

export const radius = { sm: 4, md: 8, lg: 14, pill: 999 } as const;

/** Minimum touch target (WCAG 2.5.5 / platform guidance). */
export const TOUCH = 44;

/** Window width from which the side rail and two-pane layouts apply. */
export const WIDE_BREAKPOINT = 1024;

export const type = {
  display: { fontFamily: fonts.bold, fontSize: 28, lineHeight: 34, letterSpacing: 0.2 },
  title: { fontFamily: fonts.semibold, fontSize: 21, lineHeight: 27 },
  heading: { fontFamily: fonts.semibold, fontSize: 17, lineHeight: 23 },
  body: { fontFamily: fonts.regular, fontSize: 16, lineHeight: 23 },
  small: { fontFamily: fonts.regular, fontSize: 14, lineHeight: 20 },
  label: { fontFamily: fonts.medium, fontSize: 14, lineHeight: 18, letterSpacing: 0.3 },
  figure: { fontFamily: fonts.semibold, fontSize: 20, lineHeight: 24, fontVariant: ['tabular-nums'] as 'tabular-nums'[] },
} as const;
