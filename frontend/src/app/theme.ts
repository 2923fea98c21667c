import type { ThemeConfig } from 'antd';

/** Amberline's look: amber for action, slate for structure, Noto Sans shipped with the app. */
export const palette = {
  amber: '#d97706',
  amberLight: '#fbbf24',
  slate900: '#0f172a',
  slate800: '#1e293b',
  slate600: '#475569',
  slate200: '#e2e8f0',
  slate50: '#f8fafc',
  danger: '#b91c1c',
  ok: '#15803d',
} as const;

export const theme: ThemeConfig = {
  token: {
    colorPrimary: palette.amber,
    colorInfo: palette.slate600,
    colorError: palette.danger,
    colorSuccess: palette.ok,
    colorTextBase: palette.slate900,
    colorBgLayout: palette.slate50,
    colorBorderSecondary: palette.slate200,
    fontFamily: "'Noto Sans', system-ui, sans-serif",
    borderRadius: 4,
  },
  components: {
    Layout: { headerBg: palette.slate900, siderBg: palette.slate800, headerColor: '#fff' },
    Menu: { darkItemBg: palette.slate800, darkItemSelectedBg: palette.amber },
  },
};
