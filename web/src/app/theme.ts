import type { ThemeConfig } from 'antd';

/**
 * Sagline's palette: a deep slate-teal primary on cool, quiet greys, with
 * muted status colours so a failing member stands out without shouting.
 */
export const palette = {
  primary: '#1f6b72',
  primaryDark: '#174f55',
  ink: '#1d2730',
  slate: '#23313b',
  slateLight: '#3a4a56',
  mist: '#f2f5f6',
  line: '#d9e0e4',
  pass: '#3b7a4a',
  caution: '#a86f1a',
  fail: '#b0413e',
  info: '#2f6690',
} as const;

export const fontFamily =
  "'IBM Plex Sans', system-ui, -apple-system, 'Segoe UI', Roboto, 'Helvetica Neue', Arial, sans-serif";

/** `c` mixed with white (w > 0) or black (w < 0) by |w|, as #rrggbb. */
function mix(c: string, w: number): string {
  const n = parseInt(c.slice(1), 16);
  const target = w > 0 ? 255 : 0;
  const a = Math.abs(w);
  const ch = (shift: number) => {
    const v = (n >> shift) & 0xff;
    return Math.round(v + (target - v) * a)
      .toString(16)
      .padStart(2, '0');
  };
  return `#${ch(16)}${ch(8)}${ch(0)}`;
}

/**
 * antd derives the light tints (selected rows, alert backgrounds, borders)
 * from each seed colour with its own palette generator, which turns our
 * muted seeds into grey-brown tints. Spell them out instead: plain mixes
 * with white, and a darker mix for "active".
 */
function shades(name: 'Primary' | 'Success' | 'Warning' | 'Error' | 'Info', c: string) {
  return {
    [`color${name}Bg`]: mix(c, 0.9),
    [`color${name}BgHover`]: mix(c, 0.82),
    [`color${name}Border`]: mix(c, 0.62),
    [`color${name}BorderHover`]: mix(c, 0.45),
    [`color${name}Hover`]: mix(c, 0.18),
    [`color${name}Active`]: mix(c, -0.18),
    [`color${name}TextHover`]: mix(c, 0.18),
    [`color${name}Text`]: c,
    [`color${name}TextActive`]: mix(c, -0.18),
  };
}

export const theme: ThemeConfig = {
  token: {
    ...shades('Primary', palette.primary),
    ...shades('Success', palette.pass),
    ...shades('Warning', palette.caution),
    ...shades('Error', palette.fail),
    ...shades('Info', palette.info),
    controlItemBgHover: '#f0f4f5',
    controlItemBgActive: mix(palette.primary, 0.88),
    controlItemBgActiveHover: mix(palette.primary, 0.8),
    colorLinkHover: mix(palette.primary, 0.18),
    colorLinkActive: mix(palette.primary, -0.18),
    colorPrimary: palette.primary,
    colorInfo: palette.info,
    colorSuccess: palette.pass,
    colorWarning: palette.caution,
    colorError: palette.fail,
    colorLink: palette.primary,
    colorTextBase: palette.ink,
    colorBgLayout: palette.mist,
    colorBorderSecondary: '#e6ebee',
    fontFamily,
    fontSize: 14,
    borderRadius: 4,
    wireframe: false,
  },
  components: {
    Layout: {
      headerBg: palette.slate,
      headerHeight: 56,
      headerPadding: '0 24px',
      bodyBg: palette.mist,
      footerBg: 'transparent',
      footerPadding: '16px 24px',
    },
    Menu: {
      itemBg: 'transparent',
      horizontalItemSelectedColor: palette.primary,
    },
    Table: {
      headerBg: '#eef2f4',
      headerColor: palette.slateLight,
      rowHoverBg: '#f4f8f8',
    },
    Card: {
      headerFontSize: 16,
    },
    Button: {
      fontWeight: 500,
    },
  },
};
