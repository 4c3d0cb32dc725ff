import { computed } from 'vue'
import { chartSeriesColors, palette } from '@/theme/palette'
import { useThemeStore } from '@/stores/theme'

/** Colours a chart needs besides its series, for the current light or dark theme. */
export interface ChartColors {
  text: string
  muted: string
  axisLine: string
  splitLine: string
  tooltipBackground: string
  tooltipBorder: string
  /** Colour of reference marks such as the tropopause line. */
  reference: string
  series: readonly string[]
}

const light: ChartColors = {
  text: palette.ink900,
  muted: palette.ink500,
  axisLine: '#b9bdc9',
  splitLine: '#ebe9e2',
  tooltipBackground: '#ffffff',
  tooltipBorder: '#e2e0d8',
  reference: palette.ink500,
  series: chartSeriesColors,
}

// Brighter series on the dark page: the light theme's darker hues lose contrast on ink.
const dark: ChartColors = {
  text: '#eef0f6',
  muted: palette.ink300,
  axisLine: '#3a4870',
  splitLine: '#1f2a47',
  tooltipBackground: palette.ink800,
  tooltipBorder: palette.ink700,
  reference: palette.ink300,
  series: [
    palette.ember400,
    palette.teal400,
    '#8b93e8',
    '#e06a72',
    '#7cbf68',
    '#b88bcc',
    '#cdb450',
  ],
}

/** The chart colours of the active theme; charts rebuild their option when it changes. */
export function useChartTheme() {
  const theme = useThemeStore()
  return computed<ChartColors>(() => (theme.isDark ? dark : light))
}
