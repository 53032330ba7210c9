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

export const theme: ThemeConfig = {
  token: {
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
