/**
 * The level table of the profile editor: which units each column is shown in, conversion between
 * the stored SI level and the text of a cell, and the edits that add, remove or reorder levels.
 * Levels stay in SI (Pa, K, m, mol/mol); a unit switch changes only what is shown. A blank
 * number is NaN, which `checkLevels` reports as "not a number".
 */
import { STANDARD_GRAVITY_M_PER_S2 } from '@shared/physics/constants'
import {
  DRY_AIR_GAS_CONSTANT_J_PER_KG_K,
  hypsometricHeightsM,
  virtualTemperatureK,
} from '@shared/physics/atmosphere/hydrostatic'
import type { AtmosphereLevel, GasId } from '@shared/physics/types'
import type { LevelField, LevelIssue } from '@shared/profiles/level-checks'
import {
  fromSi,
  humidityFromWaterVmr,
  toSi,
  unitSymbol,
  waterVmrFromHumidity,
  type OzoneUnit,
  type TemperatureUnit,
} from '@shared/profiles/units'

/** The columns of the level table that hold numbers. */
export type LevelColumn = 'pressure' | 'height' | 'temperature' | 'humidity' | 'ozone'
export const LEVEL_COLUMNS: readonly LevelColumn[] = [
  'pressure',
  'height',
  'temperature',
  'humidity',
  'ozone',
]

/** How humidity is shown; each has one unit (a dew point follows the temperature unit). */
export type HumidityDisplay = 'relativeHumidity' | 'dewPoint' | 'mixingRatio' | 'waterVmr'

/** The unit switches of the table. */
export interface TableUnits {
  pressure: 'hPa' | 'Pa'
  temperature: TemperatureUnit
  humidity: HumidityDisplay
  ozone: Extract<OzoneUnit, 'ppmv' | 'ppbv'>
}

export const DEFAULT_TABLE_UNITS: TableUnits = {
  pressure: 'hPa',
  temperature: 'K',
  humidity: 'relativeHumidity',
  ozone: 'ppmv',
}

export const PRESSURE_CHOICES = [
  { value: 'hPa', label: 'hPa' },
  { value: 'Pa', label: 'Pa' },
] as const
export const TEMPERATURE_CHOICES = [
  { value: 'K', label: 'K' },
  { value: 'degC', label: '°C' },
] as const
export const HUMIDITY_CHOICES = [
  { value: 'relativeHumidity', label: 'RH %' },
  { value: 'dewPoint', label: 'Dew point' },
  { value: 'mixingRatio', label: 'g/kg' },
  { value: 'waterVmr', label: 'ppmv' },
] as const
export const OZONE_CHOICES = [
  { value: 'ppmv', label: 'ppmv' },
  { value: 'ppbv', label: 'ppbv' },
] as const

/** The unit each humidity display uses in the shared unit table. */
function humidityUnit(display: HumidityDisplay, units: TableUnits): string {
  switch (display) {
    case 'relativeHumidity':
      return 'percent'
    case 'dewPoint':
      return units.temperature
    case 'mixingRatio':
      return 'gPerKg'
    case 'waterVmr':
      return 'ppmv'
  }
}

/** Column header: name and unit symbol, e.g. 'Pressure (hPa)', 'Dew point (°C)'. */
export function columnTitle(
  column: LevelColumn,
  units: TableUnits,
): { name: string; unit: string } {
  switch (column) {
    case 'pressure':
      return { name: 'Pressure', unit: unitSymbol('pressure', units.pressure) }
    case 'height':
      return { name: 'Height', unit: 'm' }
    case 'temperature':
      return { name: 'Temperature', unit: unitSymbol('temperature', units.temperature) }
    case 'humidity': {
      const q = units.humidity
      const name = {
        relativeHumidity: 'Rel. humidity',
        dewPoint: 'Dew point',
        mixingRatio: 'Mixing ratio',
        waterVmr: 'Water vapour',
      }[q]
      return { name, unit: unitSymbol(q, humidityUnit(q, units) as never) }
    }
    case 'ozone':
      return { name: 'Ozone', unit: unitSymbol('ozone', units.ozone) }
  }
}

/**
 * The value of a cell in its display unit, or null when there is none (a blank cell, a gas the
 * level does not have, or a humidity that cannot be expressed, e.g. the dew point of dry air).
 */
export function cellValue(
  level: AtmosphereLevel,
  column: LevelColumn,
  units: TableUnits,
): number | null {
  try {
    switch (column) {
      case 'pressure':
        return Number.isFinite(level.pressurePa)
          ? fromSi('pressure', level.pressurePa, units.pressure)
          : null
      case 'height':
        return Number.isFinite(level.heightM) ? level.heightM : null
      case 'temperature':
        return Number.isFinite(level.temperatureK)
          ? fromSi('temperature', level.temperatureK, units.temperature)
          : null
      case 'humidity': {
        const vmr = level.vmr.H2O
        if (vmr === undefined || !Number.isFinite(vmr)) return null
        const q = units.humidity
        const si = humidityFromWaterVmr(q, vmr, level.temperatureK, level.pressurePa)
        return fromSi(q, si, humidityUnit(q, units) as never)
      }
      case 'ozone': {
        const vmr = level.vmr.O3
        return vmr === undefined || !Number.isFinite(vmr) ? null : fromSi('ozone', vmr, units.ozone)
      }
    }
  } catch {
    return null
  }
}

/** Text of a cell: up to 6 significant digits, no exponent for ordinary magnitudes. */
export function formatCell(value: number | null): string {
  if (value === null || !Number.isFinite(value)) return ''
  if (value === 0) return '0'
  const abs = Math.abs(value)
  if (abs >= 1e7 || abs < 1e-4) return value.toExponential(4).replace(/\.?0+e/, 'e')
  return String(Number(value.toPrecision(6)))
}

/** Reads the text typed into a cell: a number (decimal point or comma), null when blank. */
export function parseCell(text: string): number | null | 'invalid' {
  const t = text
    .trim()
    .replace(/\u2212/g, '-')
    .replace(',', '.')
  if (t === '') return null
  const n = Number(t)
  return Number.isFinite(n) ? n : 'invalid'
}

/**
 * A level with one cell changed from a display value; throws Error with a sentence when the
 * value cannot be stored (humidity outside the domain of its conversion, a blank required cell
 * is kept as NaN and left to the level checks).
 */
export function withCell(
  level: AtmosphereLevel,
  column: LevelColumn,
  value: number | null,
  units: TableUnits,
): AtmosphereLevel {
  const blank = value === null
  switch (column) {
    case 'pressure':
      return { ...level, pressurePa: blank ? NaN : toSi('pressure', value, units.pressure) }
    case 'height':
      return { ...level, heightM: blank ? NaN : value }
    case 'temperature':
      return { ...level, temperatureK: blank ? NaN : toSi('temperature', value, units.temperature) }
    case 'humidity': {
      const vmr = { ...level.vmr }
      if (blank) {
        delete vmr.H2O
        return { ...level, vmr }
      }
      const q = units.humidity
      if (
        q !== 'waterVmr' &&
        q !== 'mixingRatio' &&
        !(level.pressurePa > 0 && level.temperatureK > 0)
      ) {
        throw new Error(
          'Enter the pressure and temperature of this level first; the humidity is converted with them.',
        )
      }
      try {
        vmr.H2O = waterVmrFromHumidity(
          q,
          toSi(q, value, humidityUnit(q, units) as never),
          level.temperatureK,
          level.pressurePa,
        )
      } catch (err) {
        throw new Error(
          `Cannot use this humidity: ${err instanceof Error ? err.message : String(err)}.`,
          { cause: err },
        )
      }
      return { ...level, vmr }
    }
    case 'ozone': {
      const vmr = { ...level.vmr }
      if (blank) delete vmr.O3
      else vmr.O3 = toSi('ozone', value, units.ozone)
      return { ...level, vmr }
    }
  }
}

/** The table column an issue of `checkLevels` belongs to; null for a whole-row gas issue. */
export function columnOfField(field: LevelField): LevelColumn | null {
  switch (field) {
    case 'pressurePa':
      return 'pressure'
    case 'heightM':
      return 'height'
    case 'temperatureK':
      return 'temperature'
    case 'vmr.H2O':
      return 'humidity'
    case 'vmr.O3':
      return 'ozone'
    default:
      return null
  }
}

/** One issue shown on a cell. */
export interface CellIssue {
  severity: 'error' | 'warning'
  message: string
}

/** Issues by cell key `${levelIndex}:${column}` (column '' for whole-row issues). */
export function issuesByCell(
  errors: readonly LevelIssue[],
  warnings: readonly LevelIssue[],
): Map<string, CellIssue[]> {
  const map = new Map<string, CellIssue[]>()
  const add = (issue: LevelIssue, severity: CellIssue['severity']) => {
    if (issue.levelIndex === null) return
    const key = `${issue.levelIndex}:${columnOfField(issue.field) ?? ''}`
    const list = map.get(key) ?? []
    list.push({ severity, message: issue.message })
    map.set(key, list)
  }
  for (const e of errors) add(e, 'error')
  for (const w of warnings) add(w, 'warning')
  return map
}

/** Three blank levels: the start of a profile typed in by hand. */
export function blankLevels(count = 3): AtmosphereLevel[] {
  return Array.from({ length: count }, () => ({
    pressurePa: NaN,
    temperatureK: NaN,
    heightM: NaN,
    vmr: {},
  }))
}

/** Gas amounts between two levels, each log-linear in pressure where both are positive. */
function interpolatedVmr(below: AtmosphereLevel, above: AtmosphereLevel, weightAbove: number) {
  const out: Partial<Record<GasId, number>> = {}
  const gases = new Set([...Object.keys(below.vmr), ...Object.keys(above.vmr)]) as Set<GasId>
  for (const gas of gases) {
    const a = below.vmr[gas]
    const b = above.vmr[gas]
    if (a === undefined || b === undefined) {
      const only = a ?? b
      if (only !== undefined) out[gas] = only
    } else if (a > 0 && b > 0) {
      out[gas] = Math.exp((1 - weightAbove) * Math.log(a) + weightAbove * Math.log(b))
    } else {
      out[gas] = (1 - weightAbove) * a + weightAbove * b
    }
  }
  return out
}

/**
 * A new level halfway in ln p between two levels.
 *
 * Method: p = √(p₁p₂) (the midpoint in ln p); T and z linear in ln p, i.e. the arithmetic means;
 * each gas amount log-linear in p (the geometric mean) where both amounts are positive, else the
 * arithmetic mean.
 * Notes: T linear in ln p is the assumption of the hypsometric integration, so the interpolated
 * height agrees with it to second order in the layer thickness. Returns NaN fields when either
 * neighbour has no usable pressure, for the analyst to fill in.
 * Source: hypsometric equation, Wallace & Hobbs 2006, Atmospheric Science, 2nd ed., ch. 3.
 *
 * @param below the level below (higher pressure), SI units
 * @param above the level above (lower pressure), SI units
 * @returns the new level, SI units (Pa, K, m, mol/mol)
 */
export function levelBetween(below: AtmosphereLevel, above: AtmosphereLevel): AtmosphereLevel {
  if (!(below.pressurePa > 0 && above.pressurePa > 0))
    return { pressurePa: NaN, temperatureK: NaN, heightM: NaN, vmr: {} }
  return {
    pressurePa: Math.sqrt(below.pressurePa * above.pressurePa),
    temperatureK: 0.5 * (below.temperatureK + above.temperatureK),
    heightM: 0.5 * (below.heightM + above.heightM),
    vmr: interpolatedVmr(below, above, 0.5),
  }
}

/**
 * A new level above the top: half the top pressure, isothermal with the top level.
 *
 * Method: p = p_top/2, T = T_top, gas amounts as at the top, and the height from the
 * hypsometric equation for an isothermal layer, z = z_top + (R_d T_v/g₀) ln 2.
 * Notes: a starting point for the analyst to edit; heights are geopotential metres (g₀ =
 * 9.80665 m s⁻²). Returns NaN fields when the top level has no usable pressure or temperature.
 * Source: hypsometric equation, Wallace & Hobbs 2006, Atmospheric Science, 2nd ed., ch. 3;
 * R_d from CODATA R and M_d = 28.9644 g/mol (U.S. Standard Atmosphere 1976).
 *
 * @param top the current top level, SI units
 * @returns the new level, SI units (Pa, K, m, mol/mol)
 */
export function levelAboveTop(top: AtmosphereLevel): AtmosphereLevel {
  if (!(top.pressurePa > 0 && top.temperatureK > 0))
    return { pressurePa: NaN, temperatureK: NaN, heightM: NaN, vmr: { ...top.vmr } }
  const water = top.vmr.H2O !== undefined && top.vmr.H2O >= 0 && top.vmr.H2O < 1 ? top.vmr.H2O : 0
  const scaleHeightM =
    (DRY_AIR_GAS_CONSTANT_J_PER_KG_K * virtualTemperatureK(top.temperatureK, water)) /
    STANDARD_GRAVITY_M_PER_S2
  return {
    pressurePa: top.pressurePa / 2,
    temperatureK: top.temperatureK,
    heightM: Number.isFinite(top.heightM) ? top.heightM + scaleHeightM * Math.LN2 : NaN,
    vmr: { ...top.vmr },
  }
}

/** Inserts a level above `index` (between it and the next, or above the top). */
export function insertLevelAbove(
  levels: readonly AtmosphereLevel[],
  index: number,
): AtmosphereLevel[] {
  const next = [...levels]
  const level =
    index + 1 < levels.length
      ? levelBetween(levels[index], levels[index + 1])
      : levelAboveTop(levels[index])
  next.splice(index + 1, 0, level)
  return next
}

/** Levels ordered surface first (decreasing pressure); rows without a pressure go last. */
export function sortedByPressure(levels: readonly AtmosphereLevel[]): AtmosphereLevel[] {
  const key = (l: AtmosphereLevel) => (Number.isFinite(l.pressurePa) ? l.pressurePa : -Infinity)
  return [...levels].sort((a, b) => key(b) - key(a))
}

/**
 * Heights of all levels from hydrostatic balance, keeping the height of the lowest level.
 *
 * Method: the hypsometric equation with virtual temperature (`hypsometricHeightsM`), standard
 * gravity, so heights are geopotential metres.
 * Notes: needs strictly decreasing positive pressures and finite temperatures; throws Error with
 * a sentence otherwise. A blank lowest height is taken as 0 m.
 * Source: Wallace & Hobbs 2006, Atmospheric Science, 2nd ed., ch. 3 (hypsometric equation).
 *
 * @param levels levels, surface first, SI units
 * @returns the levels with new heights, m
 */
export function withHydrostaticHeights(levels: readonly AtmosphereLevel[]): AtmosphereLevel[] {
  if (levels.some((l) => !Number.isFinite(l.temperatureK) || !(l.temperatureK > 0))) {
    throw new Error('Every level needs a temperature before heights can be computed.')
  }
  const surfaceHeightM = Number.isFinite(levels[0]?.heightM) ? levels[0].heightM : 0
  let heights: Float64Array
  try {
    heights = hypsometricHeightsM(
      levels.map((l) => l.pressurePa),
      levels.map((l) => l.temperatureK),
      levels.map((l) =>
        l.vmr.H2O !== undefined && l.vmr.H2O >= 0 && l.vmr.H2O < 1 ? l.vmr.H2O : 0,
      ),
      surfaceHeightM,
    )
  } catch {
    throw new Error(
      'Pressures must be positive and decrease upward before heights can be computed; sort the levels first.',
    )
  }
  return levels.map((l, i) => ({ ...l, heightM: Math.round(heights[i] * 10) / 10 }))
}
