import type { GlobalThemeOverrides } from 'naive-ui'

/**
 * Our palette: deep ink blue, steel greys, ice white and one warm accent. Status is never told by colour alone,
 * so Naive UI's success/warning/error colours are kept for form feedback and are not used for measurement status.
 */
export const palette = {
  ink: '#1b2a41',
  inkSoft: '#324a6d',
  steel700: '#4a5868',
  steel500: '#7b8898',
  steel300: '#c3ccd6',
  steel100: '#e7ecf1',
  ice: '#f6f9fb',
  accent: '#c8742a',
  accentPale: '#f6e3d0',
} as const

const fontFamily = "'IBM Plex Sans', system-ui, sans-serif"

export const themeOverrides: GlobalThemeOverrides = {
  common: {
    fontFamily,
    fontFamilyMono: "'IBM Plex Mono', ui-monospace, monospace",
    primaryColor: palette.ink,
    primaryColorHover: palette.inkSoft,
    primaryColorPressed: '#111c2c',
    primaryColorSuppl: palette.inkSoft,
    infoColor: palette.steel700,
    infoColorHover: palette.steel500,
    bodyColor: palette.ice,
    textColorBase: palette.ink,
    textColor1: palette.ink,
    textColor2: '#2b3a50',
    textColor3: palette.steel700,
    borderColor: palette.steel300,
    dividerColor: palette.steel100,
    borderRadius: '6px',
  },
  Layout: { headerColor: palette.ink, color: palette.ice },
  Card: { borderColor: palette.steel300 },
}
