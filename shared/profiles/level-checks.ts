/**
 * Physical checks of a list of atmosphere levels (surface first), shared by the level-table
 * editor (live validation in the browser), sounding uploads and the server before saving.
 * Every issue names the level and the field and says what was expected, in plain English.
 */
import {
  FREEZING_POINT_K,
  saturationVapourPressurePa,
  type SaturationPhase,
} from '../physics/atmosphere/humidity'
import type { AtmosphereLevel, GasId } from '../physics/types'
import { formatNumber } from './format'
import {
  fromSi,
  unitSymbol,
  type HeightUnit,
  type PressureUnit,
  type TemperatureUnit,
} from './units'

/**
 * Limits of a stored profile.
 * - minLevels 3: two layers are the least that can show a vertical gradient.
 * - maxLevels 500: bounds run cost and storage; far more than radiative transfer needs (common
 *   practice is 50–150 levels to the stratopause).
 * - 150–350 K: colder than any tropopause and warmer than any surface air on Earth (the
 *   observed extremes are about 160 K and 330 K) — anything outside is a unit or data error.
 * - Relative humidity: above 100 % is a warning (supersaturation occurs briefly in clouds and,
 *   with respect to ice, in the upper troposphere); above 110 % is an error.
 */
export const LEVEL_LIMITS = Object.freeze({
  minLevels: 3,
  maxLevels: 500,
  minTemperatureK: 150,
  maxTemperatureK: 350,
  relativeHumidityWarningPercent: 100,
  relativeHumidityErrorPercent: 110,
})

/** The field of a level an issue is about; 'levels' for the profile as a whole. */
export type LevelField = 'levels' | 'pressurePa' | 'temperatureK' | 'heightM' | `vmr.${GasId}`

export type LevelIssueCode =
  | 'TOO_FEW_LEVELS'
  | 'TOO_MANY_LEVELS'
  | 'NOT_A_NUMBER'
  | 'PRESSURE_NOT_POSITIVE'
  | 'PRESSURE_NOT_DECREASING'
  | 'DUPLICATE_LEVEL'
  | 'TEMPERATURE_OUT_OF_RANGE'
  | 'HEIGHT_NOT_INCREASING'
  | 'NEGATIVE_AMOUNT'
  | 'AMOUNT_TOO_LARGE'
  | 'SUPERSATURATED'
  | 'SUPERSATURATION'

/** One problem found in a level list. */
export interface LevelIssue {
  /** 0-based index in the level array (level 1 in messages is index 0); null for the whole list. */
  levelIndex: number | null
  field: LevelField
  /** The offending value in SI (Pa, K, m, mol/mol), or the level count for 'levels'. */
  value: number | null
  code: LevelIssueCode
  /** What was expected, e.g. 'a pressure lower than 860 hPa'. */
  expected: string
  /** Full sentence for analysts, e.g. 'Level 12: pressure 860 hPa is not lower than …'. */
  message: string
}

/** Options of `checkLevels`. */
export interface CheckLevelsOptions {
  /** Reference phase for relative humidity, default 'water' (the WMO convention). */
  saturationPhase?: SaturationPhase
  /** Default LEVEL_LIMITS.minLevels. */
  minLevels?: number
  /** Default LEVEL_LIMITS.maxLevels. */
  maxLevels?: number
  /** Units used in messages, default hPa, K and m. */
  displayUnits?: { pressure?: PressureUnit; temperature?: TemperatureUnit; height?: HeightUnit }
  /** How a level is named at the start of a message, default `Level ${index + 1}`. */
  describeLevel?: (levelIndex: number) => string
}

const GAS_NAMES: Record<GasId, string> = {
  H2O: 'water vapour',
  CO2: 'carbon dioxide',
  O3: 'ozone',
  N2O: 'nitrous oxide',
  CH4: 'methane',
}

/** Relative humidity of a level and the phase it refers to, or null where it is undefined. */
export interface LevelRelativeHumidity {
  /** Relative humidity, fraction. */
  relativeHumidity: number
  /** 'water' or 'ice' — the phase the saturation vapour pressure was taken over. */
  over: 'water' | 'ice'
}

/**
 * Relative humidity of a level from its water-vapour volume mixing ratio.
 *
 * Method: RH = x p/e_s(T) with e_s over liquid water, or over ice below 273.15 K when the phase
 * is 'ice-below-freezing'.
 * Notes: returns null when x, p or T are not usable or T is outside the saturation formula's
 * range (123–332 K over water, 110–273.16 K over ice).
 * Source: WMO-No. 8 (definition of RH); Murphy & Koop 2005, QJRMS 131, 1539, eqs. (7), (10).
 *
 * @param waterVmr mol/mol
 * @param temperatureK K
 * @param pressurePa Pa
 * @param phase reference phase, default 'water'
 * @returns relative humidity (fraction) and phase, or null
 */
export function levelRelativeHumidity(
  waterVmr: number,
  temperatureK: number,
  pressurePa: number,
  phase: SaturationPhase = 'water',
): LevelRelativeHumidity | null {
  if (!(waterVmr >= 0 && waterVmr < 1 && pressurePa > 0 && Number.isFinite(pressurePa))) {
    return null
  }
  const overIce = phase === 'ice-below-freezing' && temperatureK < FREEZING_POINT_K
  const [min, max] = overIce ? [110, 273.16] : [123, 332]
  if (!(temperatureK >= min && temperatureK <= max)) return null
  const saturationPa = saturationVapourPressurePa(temperatureK, phase)
  return {
    relativeHumidity: (waterVmr * pressurePa) / saturationPa,
    over: overIce ? 'ice' : 'water',
  }
}

/** Phrase for messages: 'with respect to liquid water' or 'with respect to ice (below 0 °C)'. */
export function saturationPhaseText(over: 'water' | 'ice'): string {
  return over === 'ice' ? 'with respect to ice (below 0 °C)' : 'with respect to liquid water'
}

/**
 * Checks a level list: at least 3 and at most 500 levels; pressure positive and strictly
 * decreasing upward (equal pressures are duplicate levels); temperature 150–350 K; heights
 * strictly increasing; gas amounts finite, non-negative and below 1 mol/mol; relative humidity
 * above 110 % an error and above 100 % a warning.
 *
 * Method: one pass over the levels; relative humidity from `levelRelativeHumidity`.
 * Notes: all problems are returned, none is thrown; the list is valid when `errors` is empty.
 * Source: limits in LEVEL_LIMITS (common practice; see its comment).
 *
 * @param levels levels, surface first; pressures Pa, temperatures K, heights m, vmr mol/mol
 * @param options phase for RH, level-count limits, message units and level names
 * @returns errors and warnings
 */
export function checkLevels(
  levels: readonly AtmosphereLevel[],
  options: CheckLevelsOptions = {},
): { errors: LevelIssue[]; warnings: LevelIssue[] } {
  const errors: LevelIssue[] = []
  const warnings: LevelIssue[] = []
  const minLevels = options.minLevels ?? LEVEL_LIMITS.minLevels
  const maxLevels = options.maxLevels ?? LEVEL_LIMITS.maxLevels
  const pressureUnit = options.displayUnits?.pressure ?? 'hPa'
  const temperatureUnit = options.displayUnits?.temperature ?? 'K'
  const heightUnit = options.displayUnits?.height ?? 'm'
  const name = options.describeLevel ?? ((i: number) => `Level ${i + 1}`)
  const showPressure = (pa: number) =>
    `${formatNumber(fromSi('pressure', pa, pressureUnit))} ${unitSymbol('pressure', pressureUnit)}`
  const showTemperature = (k: number) =>
    `${formatNumber(fromSi('temperature', k, temperatureUnit))} ${unitSymbol('temperature', temperatureUnit)}`
  const showHeight = (m: number) =>
    `${formatNumber(fromSi('height', m, heightUnit))} ${unitSymbol('height', heightUnit)}`

  const issue = (
    list: LevelIssue[],
    levelIndex: number | null,
    field: LevelField,
    value: number | null,
    code: LevelIssueCode,
    expected: string,
    message: string,
  ) => list.push({ levelIndex, field, value, code, expected, message })

  const n = levels.length
  if (n < minLevels) {
    issue(
      errors,
      null,
      'levels',
      n,
      'TOO_FEW_LEVELS',
      `at least ${minLevels} levels`,
      `The profile has ${n} level${n === 1 ? '' : 's'}; at least ${minLevels} are needed.`,
    )
  }
  if (n > maxLevels) {
    issue(
      errors,
      null,
      'levels',
      n,
      'TOO_MANY_LEVELS',
      `at most ${maxLevels} levels`,
      `The profile has ${n} levels; at most ${maxLevels} are allowed. Thin the levels first.`,
    )
  }

  for (let i = 0; i < n; i++) {
    const level = levels[i]
    const label = name(i)
    const p = level.pressurePa
    const pressureOk = Number.isFinite(p) && p > 0
    if (!Number.isFinite(p)) {
      issue(
        errors,
        i,
        'pressurePa',
        p,
        'NOT_A_NUMBER',
        'a pressure in Pa',
        `${label}: pressure is not a number.`,
      )
    } else if (p <= 0) {
      issue(
        errors,
        i,
        'pressurePa',
        p,
        'PRESSURE_NOT_POSITIVE',
        'a pressure above 0',
        `${label}: pressure ${showPressure(p)} is not positive; expected a pressure above 0.`,
      )
    }
    if (i > 0 && pressureOk) {
      const below = levels[i - 1].pressurePa
      if (Number.isFinite(below) && below > 0) {
        if (p === below) {
          issue(
            errors,
            i,
            'pressurePa',
            p,
            'DUPLICATE_LEVEL',
            `a pressure lower than ${showPressure(below)}`,
            `${label}: pressure ${showPressure(p)} repeats the level below (${name(i - 1)}); ` +
              'each level needs its own pressure — remove the duplicate.',
          )
        } else if (p > below) {
          issue(
            errors,
            i,
            'pressurePa',
            p,
            'PRESSURE_NOT_DECREASING',
            `a pressure lower than ${showPressure(below)}`,
            `${label}: pressure ${showPressure(p)} is not lower than the level below ` +
              `(${name(i - 1)}, ${showPressure(below)}); pressure must decrease upward, ` +
              'surface first.',
          )
        }
      }
    }

    const t = level.temperatureK
    if (!Number.isFinite(t)) {
      issue(
        errors,
        i,
        'temperatureK',
        t,
        'NOT_A_NUMBER',
        'a temperature in K',
        `${label}: temperature is not a number.`,
      )
    } else if (t < LEVEL_LIMITS.minTemperatureK || t > LEVEL_LIMITS.maxTemperatureK) {
      const range = `${showTemperature(LEVEL_LIMITS.minTemperatureK)} to ${showTemperature(LEVEL_LIMITS.maxTemperatureK)}`
      issue(
        errors,
        i,
        'temperatureK',
        t,
        'TEMPERATURE_OUT_OF_RANGE',
        `a temperature from ${range}`,
        `${label}: temperature ${showTemperature(t)} is outside ${range}; check the unit ` +
          '(°C or K) and the value.',
      )
    }

    const h = level.heightM
    if (!Number.isFinite(h)) {
      issue(
        errors,
        i,
        'heightM',
        h,
        'NOT_A_NUMBER',
        'a height in m',
        `${label}: height is not a number.`,
      )
    } else if (i > 0 && Number.isFinite(levels[i - 1].heightM) && h <= levels[i - 1].heightM) {
      const below = levels[i - 1].heightM
      issue(
        errors,
        i,
        'heightM',
        h,
        'HEIGHT_NOT_INCREASING',
        `a height above ${showHeight(below)}`,
        `${label}: height ${showHeight(h)} is not above the level below (${name(i - 1)}, ` +
          `${showHeight(below)}); heights must increase upward.`,
      )
    }

    for (const gas of Object.keys(level.vmr) as GasId[]) {
      const x = level.vmr[gas]
      if (x === undefined) continue
      const field: LevelField = `vmr.${gas}`
      const gasName = GAS_NAMES[gas] ?? gas
      if (!Number.isFinite(x)) {
        issue(
          errors,
          i,
          field,
          x,
          'NOT_A_NUMBER',
          'a volume mixing ratio',
          `${label}: ${gasName} amount is not a number.`,
        )
      } else if (x < 0) {
        issue(
          errors,
          i,
          field,
          x,
          'NEGATIVE_AMOUNT',
          'an amount of 0 or more',
          `${label}: ${gasName} ${formatNumber(x * 1e6)} ppmv is negative; expected 0 or more.`,
        )
      } else if (x >= 1) {
        issue(
          errors,
          i,
          field,
          x,
          'AMOUNT_TOO_LARGE',
          'a volume mixing ratio below 1 mol/mol',
          `${label}: ${gasName} ${formatNumber(x)} mol/mol is not below 1 mol/mol; check the unit.`,
        )
      }
    }

    const water = level.vmr.H2O
    const temperatureOk = t >= LEVEL_LIMITS.minTemperatureK && t <= LEVEL_LIMITS.maxTemperatureK
    // RH is not judged at an impossible temperature (one error, not two).
    if (water !== undefined && pressureOk && temperatureOk) {
      const rh = levelRelativeHumidity(water, t, p, options.saturationPhase)
      if (rh) {
        const percent = rh.relativeHumidity * 100
        const phaseText = saturationPhaseText(rh.over)
        if (percent > LEVEL_LIMITS.relativeHumidityErrorPercent) {
          issue(
            errors,
            i,
            'vmr.H2O',
            water,
            'SUPERSATURATED',
            `a relative humidity of at most ${LEVEL_LIMITS.relativeHumidityErrorPercent} %`,
            `${label}: relative humidity ${formatNumber(percent, 4)} % (${phaseText}) is above ` +
              `${LEVEL_LIMITS.relativeHumidityErrorPercent} %; check the humidity value and unit.`,
          )
        } else if (percent > LEVEL_LIMITS.relativeHumidityWarningPercent) {
          issue(
            warnings,
            i,
            'vmr.H2O',
            water,
            'SUPERSATURATION',
            `a relative humidity of at most ${LEVEL_LIMITS.relativeHumidityWarningPercent} %`,
            `${label}: relative humidity ${formatNumber(percent, 4)} % (${phaseText}) is above ` +
              '100 % (supersaturated); accepted, but check it.',
          )
        }
      }
    }
  }
  return { errors, warnings }
}
