/**
 * Helpers of the log-pressure profile chart: the axis range and the tick labels in hPa.
 */

/** One plotted point of a profile: pressure (Pa) and the value in the chart's unit. */
export interface ProfilePoint {
  pressurePa: number
  value: number
}

/** One line of a log-pressure profile chart. */
export interface ProfileSeries {
  name: string
  points: readonly ProfilePoint[]
  /** 'dashed' for added or derived parts, e.g. a climatology extension above a sounding. */
  lineStyle?: 'solid' | 'dashed'
  /** Index into the theme's series colours; default the series' position. */
  colorIndex?: number
}

/**
 * Range of an inverted log-pressure axis in hPa: from the decade at or below the lowest pressure
 * up to the highest pressure, so the surface sits on the bottom edge and the decade ticks
 * (1000, 100, 10 … hPa) stay on the axis.
 *
 * Method: min = 10^⌊log₁₀ p_min⌋, max = p_max (both in hPa).
 * Notes: returns undefined for an empty or non-positive set, leaving the range to ECharts.
 * Source: common practice for atmospheric profile plots.
 *
 * @param pressuresHpa plotted pressures, hPa
 * @returns { minHpa, maxHpa } or undefined
 */
export function logPressureRangeHpa(
  pressuresHpa: readonly number[],
): { minHpa: number; maxHpa: number } | undefined {
  let lo = Infinity
  let hi = -Infinity
  for (const p of pressuresHpa) {
    if (!(p > 0) || !Number.isFinite(p)) continue
    if (p < lo) lo = p
    if (p > hi) hi = p
  }
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return undefined
  const minHpa = 10 ** Math.floor(Math.log10(lo) + 1e-9)
  const maxHpa = hi > minHpa ? hi : minHpa * 10
  return { minHpa, maxHpa }
}

/** A pressure tick label in hPa without needless digits: 1000, 100, 1, 0.1, 0.01. */
export function pressureTickLabel(valueHpa: number): string {
  if (valueHpa >= 1) return String(Math.round(valueHpa))
  return String(Number(valueHpa.toPrecision(2)))
}

/** A value for a tooltip or label: up to `digits` significant digits, trailing zeros dropped. */
export function shortNumber(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return '—'
  if (value !== 0 && (Math.abs(value) >= 1e6 || Math.abs(value) < 1e-3))
    return value.toExponential(digits - 1)
  return String(Number(value.toPrecision(digits)))
}

/**
 * Per-layer values as profile points, each drawn at the geometric-mean pressure of the layer's
 * bounding levels (layer i lies between levels i and i + 1); null values become gaps.
 */
export function layerPoints(levelPressurePa: readonly (number | null)[], values: readonly (number | null)[]): ProfilePoint[] {
  return values.map((v, i) => ({
    pressurePa: Math.sqrt((levelPressurePa[i] ?? NaN) * (levelPressurePa[i + 1] ?? NaN)),
    value: v ?? NaN,
  }))
}
