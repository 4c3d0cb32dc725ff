import type { ChartColors } from '@/composables/use-chart-theme'

// The look every Tauline chart shares, for the current theme's colours: one place, so the
// spectra, profiles, stick and sweep charts stay alike.

/** Background, font and legend of a chart; the legend shows only when asked for. */
export function chartChrome(c: ChartColors, showLegend: boolean) {
  return {
    backgroundColor: 'transparent',
    textStyle: { fontFamily: "'Inter', system-ui, sans-serif" },
    legend: {
      show: showLegend,
      top: 4,
      textStyle: { color: c.text, fontSize: 12 },
      itemWidth: 22,
      itemHeight: 8,
    },
  }
}

/** Colours and text of a tooltip. */
export function tooltipStyle(c: ChartColors) {
  return {
    backgroundColor: c.tooltipBackground,
    borderColor: c.tooltipBorder,
    textStyle: { color: c.text, fontSize: 12 },
  }
}

/** Tick-label text of an axis (spread into `axisLabel` alongside a formatter). */
export const axisLabelText = (c: ChartColors) => ({ color: c.muted, fontSize: 11 })

/**
 * Name, line and grid lines of a value axis, name centred along it. `showLine` draws the axis
 * line even where ECharts hides it by default (value axes).
 */
export function axisStyle(c: ChartColors, showLine = false) {
  return {
    nameLocation: 'middle' as const,
    nameTextStyle: { color: c.text, fontSize: 12, fontWeight: 500 as const },
    axisLine: showLine ? { show: true, lineStyle: { color: c.axisLine } } : { lineStyle: { color: c.axisLine } },
    splitLine: { lineStyle: { color: c.splitLine } },
  }
}
