import type { GlobalThemeOverrides } from 'naive-ui'
import { palette } from './palette'

const font = "'Inter', system-ui, -apple-system, 'Segoe UI', sans-serif"
const mono = "'JetBrains Mono', 'SFMono-Regular', ui-monospace, Menlo, Consolas, monospace"

const shared: GlobalThemeOverrides['common'] = {
  fontFamily: font,
  fontFamilyMono: mono,
  borderRadius: '6px',
  borderRadiusSmall: '4px',
  fontSize: '14px',
  fontWeightStrong: '600',
}

export const lightOverrides: GlobalThemeOverrides = {
  common: {
    ...shared,
    primaryColor: palette.ember600,
    primaryColorHover: palette.ember500,
    primaryColorPressed: '#8f4007',
    primaryColorSuppl: palette.ember500,
    infoColor: palette.teal500,
    infoColorHover: palette.teal400,
    successColor: palette.moss500,
    errorColor: palette.rose500,
    bodyColor: palette.paper,
    cardColor: '#ffffff',
    textColorBase: palette.ink900,
    textColor1: palette.ink900,
    textColor2: '#2c3550',
    textColor3: palette.ink500,
    borderColor: '#e2e0d8',
    dividerColor: '#e8e6df',
  },
  Card: { borderRadius: '10px', titleFontWeight: '600' },
  Layout: { color: palette.paper, headerColor: palette.paper, siderColor: palette.ink900 },
  DataTable: { thColor: '#f3f1ea', thFontWeight: '600' },
}

export const darkOverrides: GlobalThemeOverrides = {
  common: {
    ...shared,
    primaryColor: palette.ember400,
    primaryColorHover: palette.ember300,
    primaryColorPressed: palette.ember500,
    primaryColorSuppl: palette.ember500,
    infoColor: palette.teal400,
    successColor: '#6fb35c',
    errorColor: '#e0646d',
    bodyColor: palette.ink950,
    cardColor: palette.ink900,
    modalColor: palette.ink900,
    popoverColor: palette.ink800,
    textColorBase: '#eef0f6',
    textColor1: '#eef0f6',
    textColor2: '#c9cfdf',
    textColor3: palette.ink300,
    borderColor: '#263252',
    dividerColor: '#222c47',
  },
  Card: { borderRadius: '10px', titleFontWeight: '600' },
  Layout: { color: palette.ink950, headerColor: palette.ink950, siderColor: '#080e1a' },
  Button: { textColorPrimary: palette.ink950, textColorHoverPrimary: palette.ink950, textColorPressedPrimary: palette.ink950, textColorFocusPrimary: palette.ink950 },
  DataTable: { thColor: palette.ink800, tdColor: palette.ink900, thFontWeight: '600' },
}
