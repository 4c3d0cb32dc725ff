/**
 * Turning a parsed sounding and a confirmed column mapping into atmosphere levels (SI units,
 * water vapour as a volume mixing ratio), with every row problem reported by line and column.
 * When there is any error no level is returned, so nothing partial is ever stored.
 */
import { type ClimatologyId } from '../../physics/atmosphere/climatology'
import { saturationVapourPressurePa, type SaturationPhase } from '../../physics/atmosphere/humidity'
import { hypsometricHeightsM, type GravityModel } from '../../physics/atmosphere/hydrostatic'
import { greenOzoneVmr } from '../../physics/atmosphere/ozone'
import { getClimatologyPreset } from '../../physics/atmosphere/climatology'
import { PhysicsError } from '../../physics/errors'
import type { AtmosphereLevel } from '../../physics/types'
import { formatNumber, quoteText } from '../format'
import {
  checkLevels,
  LEVEL_LIMITS,
  levelRelativeHumidity,
  saturationPhaseText,
  type LevelField,
  type LevelIssueCode,
} from '../level-checks'
import {
  LEVEL_UNITS,
  toSi,
  unitDefinition,
  unitSymbol,
  waterVmrFromHumidity,
  type DewPointFormula,
  type HumidityQuantity,
  type LevelUnitIds,
  type LevelUnits,
} from '../units'
import { readCell } from './cells'
import {
  DEFAULT_EXTENSION_TOP_PA,
  extendWithClimatology,
  extensionLevelCount,
} from './climatology-extension'
import { pickHumiditySource, type ColumnMapping, type SoundingField } from './columns'
import { createIssueList, MAX_REPORTED_ERRORS, type IssueList, type RowError } from './issues'
import type { ParsedSounding } from './parse'

/** Ozone above this is taken for a unit error (about 10× the largest natural mixing ratio). */
const MAX_OZONE_VMR = 100e-6

/** Options of `soundingToLevels`. */
export interface SoundingToLevelsOptions {
  /**
   * Fill missing humidity cells instead of dropping their rows: ln(vmr) interpolated linearly
   * in ln p between the nearest rows with humidity; above/below them the nearest value, capped
   * at saturation. Default false (such rows are dropped and reported).
   */
  fillMissingHumidity?: boolean
  /** The same for ozone (without the saturation cap). Default false. */
  fillMissingOzone?: boolean
  /** Height of the lowest level when heights are computed, m; default 0. */
  surfaceHeightM?: number
  /** Gravity model for computed heights, default 'standard' (geopotential metres). */
  gravity?: GravityModel
  /** Which mapped humidity column to use; default the first of HUMIDITY_PRIORITY mapped. */
  humidityFrom?: HumidityQuantity
  /** Reference phase of relative humidity (input and checks), default 'water'. */
  saturationPhase?: SaturationPhase
  /** Saturation formula for dew points, default 'murphy-koop'. */
  dewPointFormula?: DewPointFormula
  /**
   * Extend the profile above the sounding's last level with a climatology up to topPressurePa
   * (default 10 Pa). When the sounding has no ozone column, every level's ozone then comes from
   * the climatology too.
   */
  extendAbove?: {
    climatology: ClimatologyId
    topPressurePa?: number
    levelSpacingLnP?: number
    relaxationScaleHeights?: number
  }
  /** Most levels of the result (sounding + extension), default LEVEL_LIMITS.maxLevels. */
  maxLevels?: number
  /** Thin the sounding evenly in ln p when it has too many levels, instead of an error. */
  thinToMaxLevels?: boolean
  /** Extra missing-value markers, e.g. ['-8888']. */
  missingValueMarkers?: readonly string[]
  /** Most errors returned, default MAX_REPORTED_ERRORS (the total is still counted). */
  maxErrors?: number
}

/** A row left out, with the reason. */
export interface DroppedRow {
  lineNumber: number
  reason: string
}

/** A cell filled in or changed, with the old text, the new SI value and the reason. */
export interface RepairedCell {
  lineNumber: number
  field: SoundingField
  from: string
  /** New value in SI (Pa, K, m, mol/mol). */
  to: number
  reason: string
}

/** What was done to the sounding on the way to levels. */
export interface SoundingConversionReport {
  dropped: DroppedRow[]
  repaired: RepairedCell[]
  /** True when any height was computed hydrostatically (column absent or cells missing). */
  heightsFilled: boolean
  /** Order of the rows in the file; 'top-first' files are reversed. */
  order: 'surface-first' | 'top-first'
  /** The humidity column used, if any. */
  humiditySource?: HumidityQuantity
  /** Number of levels before thinning, when the sounding was thinned. */
  thinnedFrom?: number
  extendedAbove?: {
    fromPressurePa: number
    topPressurePa: number
    climatology: ClimatologyId
    addedLevels: number
  }
  /** True when the sounding had no ozone column and ozone was taken from the climatology. */
  ozoneFromClimatology: boolean
  /** File line of each returned level; null for levels added from the climatology. */
  levelLineNumbers: (number | null)[]
  warnings: RowError[]
}

/** Result of `soundingToLevels`: levels (none when there is any error), report, errors. */
export interface SoundingToLevelsResult {
  levels: AtmosphereLevel[]
  report: SoundingConversionReport
  /** The first `maxErrors` errors. */
  errors: RowError[]
  /** Total number of errors found. */
  errorCount: number
}

/** One data row after reading its cells. */
interface RowRecord {
  lineNumber: number
  pressurePa: number | null
  temperatureK: number | null
  heightM: number | null
  /** Humidity in SI of its quantity (fraction, K, kg/kg, mol/mol). */
  humiditySi: number | null
  waterVmr: number | null
  ozoneVmr: number | null
  /** Raw cells of the mapped columns, for reports. */
  cells: Partial<Record<SoundingField, string>>
  hasError: boolean
  dropped: boolean
}

const FIELD_NAMES: Record<SoundingField, string> = {
  pressure: 'pressure',
  height: 'height',
  temperature: 'temperature',
  dewPoint: 'dew point',
  relativeHumidity: 'relative humidity',
  mixingRatio: 'mixing ratio',
  specificHumidity: 'specific humidity',
  waterVmr: 'water vapour',
  ozone: 'ozone',
}

function emptyReport(): SoundingConversionReport {
  return {
    dropped: [],
    repaired: [],
    heightsFilled: false,
    order: 'surface-first',
    ozoneFromClimatology: false,
    levelLineNumbers: [],
    warnings: [],
  }
}

function failed(issues: IssueList, report: SoundingConversionReport): SoundingToLevelsResult {
  return {
    levels: [],
    report: { ...report, levelLineNumbers: [] },
    errors: issues.items,
    errorCount: issues.total,
  }
}

/**
 * Converts a parsed sounding to levels, surface first, in SI units.
 *
 * Method: each row is read with the mapping and units; cells that are missing-value markers
 * (MISSING_VALUE_MARKERS: '', NA, '////', −9999…) make the row dropped and reported when they
 * are pressure, temperature, humidity or ozone (unless filling is asked for); other text is an
 * error naming line and column. Values are converted to SI; humidity to a water-vapour volume
 * mixing ratio (dew point: x = e_s(T_d)/p; RH: x = RH e_s(T)/p over water by default; mixing
 * ratio: x = r/(ε + r); specific humidity: x = q/(ε + (1 − ε)q)). Errors: negative or zero
 * pressure, temperature outside 150–350 K, negative humidity or ozone, relative humidity above
 * 110 % (given or implied), ozone above 100 ppmv, pressure not strictly decreasing upward
 * (rows are never sorted; a file listed top-first is reversed as a whole), the same pressure
 * twice with different values (exact duplicate rows are dropped and reported), heights not
 * increasing. Missing heights are computed with the hypsometric equation (virtual temperature),
 * from `surfaceHeightM` when the column is absent, or anchored on the nearest given height.
 * Optionally the top is extended with a climatology (`extendWithClimatology`) and the levels
 * thinned. Finally the levels pass `checkLevels`; its warnings (RH 100–110 %) are reported.
 * Notes: all errors are collected (up to `maxErrors`) and, if there is any, `levels` is empty.
 * Source: humidity conversions as in shared/physics/atmosphere/humidity (Murphy & Koop 2005;
 * Bolton 1980; Wallace & Hobbs 2006, ch. 3); hypsometric equation, Wallace & Hobbs 2006,
 * eq. 3.29 (number from memory).
 *
 * @param parsed result of `parseSoundingText`
 * @param mapping column index per field (pressure and temperature required)
 * @param units unit per mapped field
 * @param options filling, heights, humidity choice, extension, thinning, limits
 * @returns levels (or none), what was dropped or repaired, and the errors
 */
export function soundingToLevels(
  parsed: ParsedSounding,
  mapping: ColumnMapping,
  units: LevelUnits,
  options: SoundingToLevelsOptions = {},
): SoundingToLevelsResult {
  const issues = createIssueList(options.maxErrors ?? MAX_REPORTED_ERRORS)
  const report = emptyReport()
  const header = parsed.header
  const phase = options.saturationPhase ?? 'water'

  // ---- 1. The mapping ---------------------------------------------------------------------
  const columnName = (field: SoundingField): string | null => {
    const index = mapping[field]
    return index === undefined ? null : (header[index] ?? null)
  }
  const mappingError = (
    code: RowError['code'],
    field: string,
    expected: string,
    message: string,
    column: string | null = null,
  ) =>
    issues.add({
      code,
      lineNumber: parsed.headerLineNumber,
      column,
      field,
      value: null,
      expected,
      message,
    })
  const usedColumns = new Map<number, SoundingField>()
  const badFields = new Set<SoundingField>()
  for (const field of Object.keys(mapping) as SoundingField[]) {
    const index = mapping[field]
    if (index === undefined) continue
    if (!LEVEL_UNITS[field]) {
      mappingError(
        'INVALID_MAPPING',
        field,
        'a level-table field',
        `'${field}' is not a field of the level table.`,
      )
      continue
    }
    if (!Number.isInteger(index) || index < 0 || index >= header.length) {
      badFields.add(field)
      mappingError(
        'INVALID_MAPPING',
        field,
        `a column number from 1 to ${header.length}`,
        `The ${FIELD_NAMES[field]} is mapped to column ${index + 1}, but the header ` +
          `(line ${parsed.headerLineNumber}) has ${header.length} columns.`,
      )
      continue
    }
    const other = usedColumns.get(index)
    if (other) {
      mappingError(
        'INVALID_MAPPING',
        field,
        'one field per column',
        `Column '${header[index]}' is mapped to both ${FIELD_NAMES[other]} and ` +
          `${FIELD_NAMES[field]}; expected each column to be used once.`,
        header[index],
      )
    }
    usedColumns.set(index, field)
  }
  for (const field of ['pressure', 'temperature'] as const) {
    if (mapping[field] === undefined) {
      mappingError(
        'MISSING_COLUMN',
        field,
        `a ${FIELD_NAMES[field]} column`,
        `No ${FIELD_NAMES[field]} column: the header (line ${parsed.headerLineNumber}) has none ` +
          `that was recognised; map one of the columns to ${FIELD_NAMES[field]} ` +
          (field === 'pressure'
            ? '(usual names: PRES, pressure, p, hPa).'
            : '(usual names: TEMP, temperature, T).'),
      )
    }
  }
  let humidity: HumidityQuantity | undefined
  if (options.humidityFrom) {
    if (mapping[options.humidityFrom] === undefined) {
      mappingError(
        'INVALID_MAPPING',
        options.humidityFrom,
        `a mapped ${FIELD_NAMES[options.humidityFrom]} column`,
        `Humidity is to be taken from the ${FIELD_NAMES[options.humidityFrom]}, but no column is ` +
          'mapped to it.',
      )
    }
    humidity = options.humidityFrom
  } else {
    humidity = pickHumiditySource(mapping)
  }
  report.humiditySource = humidity
  const fields: SoundingField[] = ['pressure', 'temperature']
  if (mapping.height !== undefined) fields.push('height')
  if (humidity) fields.push(humidity)
  if (mapping.ozone !== undefined) fields.push('ozone')
  for (const field of fields) {
    if (badFields.has(field) || mapping[field] === undefined) continue
    const unit = units[field]
    let known = unit !== undefined
    if (known) {
      try {
        unitDefinition(field, unit as LevelUnitIds[typeof field])
      } catch {
        known = false
      }
    }
    if (!known) {
      mappingError(
        'MISSING_UNIT',
        field,
        `one of ${LEVEL_UNITS[field].units.map((u) => u.symbol).join(', ')}`,
        `No valid unit for the ${FIELD_NAMES[field]} column '${columnName(field)}'` +
          `${unit === undefined ? '' : ` ('${String(unit)}')`}; expected one of ` +
          `${LEVEL_UNITS[field].units.map((u) => u.symbol).join(', ')}.`,
        columnName(field),
      )
    }
  }
  if (issues.total > 0) return failed(issues, report)

  const unitOf = <F extends SoundingField>(field: F) => units[field] as LevelUnitIds[F]
  const show = (field: SoundingField, valueInUnit: number) =>
    `${formatNumber(valueInUnit)} ${unitSymbol(field, unitOf(field))}`
  const showPa = (pa: number) => {
    const unit = unitOf('pressure')
    const def = unitDefinition('pressure', unit)
    return `${formatNumber((pa - def.toSiOffset) / def.toSiScale)} ${def.symbol}`
  }

  // ---- 2. The rows ------------------------------------------------------------------------
  const extraMarkers = options.missingValueMarkers ?? []
  const records: RowRecord[] = []
  const rowError = (
    record: RowRecord,
    code: RowError['code'],
    field: SoundingField,
    expected: string,
    what: string,
  ) => {
    record.hasError = true
    const column = columnName(field)
    issues.add({
      code,
      lineNumber: record.lineNumber,
      column,
      field,
      value: record.cells[field] ?? null,
      expected,
      message: `Line ${record.lineNumber}, column '${column}': ${what}; expected ${expected}.`,
    })
  }

  parsed.rows.forEach((row, r) => {
    const record: RowRecord = {
      lineNumber: parsed.lineNumbers[r],
      pressurePa: null,
      temperatureK: null,
      heightM: null,
      humiditySi: null,
      waterVmr: null,
      ozoneVmr: null,
      cells: {},
      hasError: false,
      dropped: false,
    }
    records.push(record)
    const values: Partial<Record<SoundingField, number>> = {}
    const missing: SoundingField[] = []
    for (const field of fields) {
      const cell = row[mapping[field] as number] ?? ''
      record.cells[field] = cell
      const read = readCell(cell, parsed.decimalSeparator, extraMarkers)
      if (read.kind === 'number' && Number.isFinite(read.value)) values[field] = read.value
      else if (read.kind === 'missing') missing.push(field)
      else {
        rowError(
          record,
          'NOT_A_NUMBER',
          field,
          `a number (${FIELD_NAMES[field]} in ${unitSymbol(field, unitOf(field))}) or a ` +
            "missing-value marker such as '', NA, //// or -9999",
          `${quoteText(cell)} is not a number`,
        )
      }
    }

    // Rows missing a value they need are dropped (reported), not errors.
    const fatalMissing = missing.filter(
      (f) =>
        f === 'pressure' ||
        f === 'temperature' ||
        (f === humidity && !options.fillMissingHumidity) ||
        (f === 'ozone' && !options.fillMissingOzone),
    )
    if (fatalMissing.length > 0) {
      record.dropped = true
      report.dropped.push({
        lineNumber: record.lineNumber,
        reason: `missing ${fatalMissing
          .map(
            (f) =>
              `${FIELD_NAMES[f]} (column '${columnName(f)}': ${quoteText(record.cells[f] ?? '')})`,
          )
          .join(', ')}`,
      })
    }

    // Values, each checked even when the row is dropped for another missing cell.
    if (values.pressure !== undefined) {
      const p = toSi('pressure', values.pressure, unitOf('pressure'))
      if (p <= 0) {
        rowError(
          record,
          'PRESSURE_NOT_POSITIVE',
          'pressure',
          'a pressure above 0',
          `pressure ${show('pressure', values.pressure)} is not positive`,
        )
      } else {
        record.pressurePa = p
      }
    }
    if (values.temperature !== undefined) {
      const t = toSi('temperature', values.temperature, unitOf('temperature'))
      if (t < LEVEL_LIMITS.minTemperatureK || t > LEVEL_LIMITS.maxTemperatureK) {
        const inK = unitOf('temperature') === 'K' ? '' : ` (${formatNumber(t)} K)`
        rowError(
          record,
          'TEMPERATURE_OUT_OF_RANGE',
          'temperature',
          `a temperature from ${LEVEL_LIMITS.minTemperatureK} to ${LEVEL_LIMITS.maxTemperatureK} K ` +
            `(${formatNumber(LEVEL_LIMITS.minTemperatureK - 273.15)} to ` +
            `${formatNumber(LEVEL_LIMITS.maxTemperatureK - 273.15)} °C)`,
          `temperature ${show('temperature', values.temperature)}${inK} is impossible — check the ` +
            'value and the unit (°C or K)',
        )
      } else {
        record.temperatureK = t
      }
    }
    if (values.height !== undefined)
      record.heightM = toSi('height', values.height, unitOf('height'))
    if (humidity && values[humidity] !== undefined) {
      readHumidity(record, humidity, values[humidity] as number)
    }
    if (values.ozone !== undefined) {
      const x = toSi('ozone', values.ozone, unitOf('ozone'))
      if (x < 0) {
        rowError(
          record,
          'NEGATIVE_OZONE',
          'ozone',
          'an ozone amount of 0 or more',
          `ozone ${show('ozone', values.ozone)} is negative`,
        )
      } else if (x > MAX_OZONE_VMR) {
        rowError(
          record,
          'OZONE_TOO_HIGH',
          'ozone',
          `at most ${formatNumber(MAX_OZONE_VMR * 1e6)} ppmv — check the unit (ppmv or ppbv)`,
          `ozone ${show('ozone', values.ozone)} (${formatNumber(x * 1e6)} ppmv) is far above any atmospheric value`,
        )
      } else {
        record.ozoneVmr = x
      }
    }
  })

  function readHumidity(record: RowRecord, quantity: HumidityQuantity, value: number): void {
    const si = toSi(quantity, value, unitOf(quantity))
    record.humiditySi = si
    const shown = show(quantity, value)
    if (quantity !== 'dewPoint' && si < 0) {
      rowError(
        record,
        'NEGATIVE_HUMIDITY',
        quantity,
        `a ${FIELD_NAMES[quantity]} of 0 or more`,
        `${FIELD_NAMES[quantity]} ${shown} is negative`,
      )
      return
    }
    if (quantity === 'relativeHumidity' && si * 100 > LEVEL_LIMITS.relativeHumidityErrorPercent) {
      rowError(
        record,
        'HUMIDITY_TOO_HIGH',
        quantity,
        `a relative humidity of at most ${LEVEL_LIMITS.relativeHumidityErrorPercent} %`,
        `relative humidity ${shown} is above ${LEVEL_LIMITS.relativeHumidityErrorPercent} % — check ` +
          'the value and the unit (% or fraction)',
      )
      return
    }
    const p = record.pressurePa
    const t = record.temperatureK
    if (p === null || (quantity === 'relativeHumidity' && t === null)) return
    let vmr: number
    try {
      vmr = waterVmrFromHumidity(quantity, si, t ?? 273.15, p, {
        phase,
        dewPointFormula: options.dewPointFormula,
      })
    } catch (error) {
      if (!(error instanceof PhysicsError)) throw error
      rowError(
        record,
        'HUMIDITY_OUT_OF_RANGE',
        quantity,
        humidityRangeText(quantity),
        `${FIELD_NAMES[quantity]} ${shown} cannot be converted to water vapour (${error.message})`,
      )
      return
    }
    if (quantity !== 'relativeHumidity' && t !== null) {
      const rh = levelRelativeHumidity(vmr, t, p, phase)
      if (rh && rh.relativeHumidity * 100 > LEVEL_LIMITS.relativeHumidityErrorPercent) {
        rowError(
          record,
          'HUMIDITY_TOO_HIGH',
          quantity,
          `a humidity giving at most ${LEVEL_LIMITS.relativeHumidityErrorPercent} % relative humidity`,
          `${FIELD_NAMES[quantity]} ${shown} at temperature ${formatNumber(t)} K gives a relative ` +
            `humidity of ${formatNumber(rh.relativeHumidity * 100, 4)} % ` +
            `(${saturationPhaseText(rh.over)})`,
        )
        return
      }
    }
    record.waterVmr = vmr
  }

  // ---- 3. Order, duplicates, monotonic pressure and heights ---------------------------------
  const withPressure = records.filter((r) => r.pressurePa !== null)
  let rising = 0
  let falling = 0
  for (let i = 1; i < withPressure.length; i++) {
    const a = withPressure[i - 1].pressurePa as number
    const b = withPressure[i].pressurePa as number
    if (b > a) rising++
    else if (b < a) falling++
  }
  if (rising > falling) {
    report.order = 'top-first'
    records.reverse()
  }
  let previous: RowRecord | null = null
  for (const record of records) {
    if (record.pressurePa === null || record.dropped) continue
    if (previous && previous.pressurePa !== null) {
      const p = record.pressurePa
      const below = previous.pressurePa
      if (p === below) {
        if (!record.hasError && !previous.hasError && sameValues(record, previous)) {
          record.dropped = true
          report.dropped.push({
            lineNumber: record.lineNumber,
            reason: `exact duplicate of line ${previous.lineNumber}`,
          })
          continue
        }
        rowError(
          record,
          'DUPLICATE_PRESSURE',
          'pressure',
          `each pressure once, lower than the level below (line ${previous.lineNumber}, ${showPa(below)})`,
          `pressure ${showPa(p)} repeats line ${previous.lineNumber} with different values`,
        )
      } else if (p > below) {
        rowError(
          record,
          'PRESSURE_NOT_DECREASING',
          'pressure',
          `a pressure lower than ${showPa(below)} (levels in order from the surface up; rows are ` +
            'not sorted)',
          `pressure ${showPa(p)} is not lower than the level below (line ${previous.lineNumber}, ` +
            `${showPa(below)})`,
        )
      }
    }
    previous = record
  }
  let previousHeight: RowRecord | null = null
  for (const record of records) {
    if (record.dropped || record.heightM === null) continue
    if (
      previousHeight &&
      previousHeight.heightM !== null &&
      record.heightM <= previousHeight.heightM
    ) {
      const unit = unitOf('height')
      const def = unitDefinition('height', unit)
      const showM = (m: number) =>
        `${formatNumber((m - def.toSiOffset) / def.toSiScale)} ${def.symbol}`
      rowError(
        record,
        'HEIGHT_NOT_INCREASING',
        'height',
        `a height above ${showM(previousHeight.heightM)}`,
        `height ${showM(record.heightM)} is not above the level below (line ` +
          `${previousHeight.lineNumber}, ${showM(previousHeight.heightM)})`,
      )
    }
    previousHeight = record
  }
  if (issues.total > 0) return failed(issues, report)

  // ---- 4. Kept rows ------------------------------------------------------------------------
  const kept = records.filter((r) => !r.dropped)
  const minLevels = LEVEL_LIMITS.minLevels
  if (kept.length < minLevels) {
    const droppedLines = report.dropped.map((d) => d.lineNumber)
    issues.add({
      code: 'TOO_FEW_LEVELS',
      lineNumber: null,
      column: null,
      field: 'levels',
      value: String(kept.length),
      expected: `at least ${minLevels} levels`,
      message:
        `Only ${kept.length} level${kept.length === 1 ? '' : 's'} remain after dropping ` +
        `${droppedLines.length} row${droppedLines.length === 1 ? '' : 's'}` +
        (droppedLines.length > 0 ? ` (lines ${listLines(droppedLines)})` : '') +
        `; at least ${minLevels} levels are needed.`,
    })
    return failed(issues, report)
  }
  const n = kept.length
  const pressurePa = Float64Array.from(kept, (r) => r.pressurePa as number)
  const temperatureK = Float64Array.from(kept, (r) => r.temperatureK as number)

  // ---- 5. Missing humidity and ozone -------------------------------------------------------
  let waterVmr: Float64Array | undefined
  if (humidity) {
    const filled = fillGaps(
      pressurePa,
      kept.map((r) => r.waterVmr),
    )
    if (!filled) {
      issues.add({
        code: 'MISSING_COLUMN',
        lineNumber: parsed.headerLineNumber,
        column: columnName(humidity),
        field: humidity,
        value: null,
        expected: 'at least one humidity value',
        message: `Column '${columnName(humidity)}' has no ${FIELD_NAMES[humidity]} values to fill from.`,
      })
      return failed(issues, report)
    }
    waterVmr = filled.values
    for (const i of filled.filledIndexes) {
      const t = temperatureK[i]
      if (t >= 123 && t <= 332) {
        waterVmr[i] = Math.min(waterVmr[i], saturationVapourPressurePa(t, phase) / pressurePa[i])
      }
      report.repaired.push({
        lineNumber: kept[i].lineNumber,
        field: humidity,
        from: kept[i].cells[humidity] ?? '',
        to: waterVmr[i],
        reason:
          'missing humidity filled from the neighbouring levels (ln vmr linear in ln p), ' +
          'at most saturation',
      })
    }
  } else {
    report.warnings.push({
      code: 'NO_HUMIDITY',
      lineNumber: parsed.headerLineNumber,
      column: null,
      field: 'waterVmr',
      value: null,
      expected: 'a dew point, relative humidity or mixing ratio column',
      message:
        'No humidity column is mapped: the sounding levels are dry (no water vapour). Map a dew ' +
        'point, relative humidity or mixing ratio column if the file has one.',
    })
  }
  let ozoneVmr: Float64Array | undefined
  if (mapping.ozone !== undefined) {
    const filled = fillGaps(
      pressurePa,
      kept.map((r) => r.ozoneVmr),
    )
    if (!filled) {
      issues.add({
        code: 'MISSING_COLUMN',
        lineNumber: parsed.headerLineNumber,
        column: columnName('ozone'),
        field: 'ozone',
        value: null,
        expected: 'at least one ozone value',
        message: `Column '${columnName('ozone')}' has no ozone values to fill from.`,
      })
      return failed(issues, report)
    }
    ozoneVmr = filled.values
    for (const i of filled.filledIndexes) {
      report.repaired.push({
        lineNumber: kept[i].lineNumber,
        field: 'ozone',
        from: kept[i].cells.ozone ?? '',
        to: ozoneVmr[i],
        reason: 'missing ozone filled from the neighbouring levels (ln vmr linear in ln p)',
      })
    }
  }

  // ---- 6. Heights ------------------------------------------------------------------------------
  const gravity = options.gravity ?? 'standard'
  const surfaceHeightM = options.surfaceHeightM ?? 0
  if (!Number.isFinite(surfaceHeightM)) {
    throw new PhysicsError(
      'INVALID_ARGUMENT',
      `surfaceHeightM = ${surfaceHeightM} must be finite`,
      {},
    )
  }
  const hydrostatic = hypsometricHeightsM(pressurePa, temperatureK, waterVmr, 0, { gravity })
  const heightM = new Float64Array(n)
  if (mapping.height === undefined) {
    for (let i = 0; i < n; i++) heightM[i] = surfaceHeightM + hydrostatic[i]
    report.heightsFilled = true
  } else {
    const known = kept.map((r) => r.heightM)
    const anyKnown = known.some((h) => h !== null)
    for (let i = 0; i < n; i++) {
      const h = known[i]
      if (h !== null) {
        heightM[i] = h
        continue
      }
      let anchor = -1
      for (let j = i - 1; j >= 0 && anchor < 0; j--) if (known[j] !== null) anchor = j
      for (let j = i + 1; j < n && anchor < 0; j++) if (known[j] !== null) anchor = j
      heightM[i] =
        anchor >= 0
          ? (known[anchor] as number) + (hydrostatic[i] - hydrostatic[anchor])
          : surfaceHeightM + hydrostatic[i]
      report.heightsFilled = true
      report.repaired.push({
        lineNumber: kept[i].lineNumber,
        field: 'height',
        from: kept[i].cells.height ?? '',
        to: heightM[i],
        reason: anyKnown
          ? `missing height computed hydrostatically from line ${kept[anchor].lineNumber}`
          : `missing height computed hydrostatically from ${formatNumber(surfaceHeightM)} m at the lowest level`,
      })
    }
  }

  // ---- 7. Thinning and the climatology above ------------------------------------------------
  const maxLevels = options.maxLevels ?? LEVEL_LIMITS.maxLevels
  const extend = options.extendAbove
  const topPressurePa = extend?.topPressurePa ?? DEFAULT_EXTENSION_TOP_PA
  const plannedExtension = extend
    ? extensionLevelCount(pressurePa[n - 1], topPressurePa, extend.levelSpacingLnP ?? 0.25)
    : 0
  let indexes = Array.from({ length: n }, (_, i) => i)
  const budget = maxLevels - plannedExtension
  if (n > budget) {
    if (!options.thinToMaxLevels || budget < minLevels) {
      issues.add({
        code: 'TOO_MANY_LEVELS',
        lineNumber: null,
        column: null,
        field: 'levels',
        value: String(n + plannedExtension),
        expected: `at most ${maxLevels} levels`,
        message:
          `The profile would have ${n + plannedExtension} levels (${n} from the sounding` +
          (plannedExtension > 0 ? `, ${plannedExtension} from the climatology above` : '') +
          `); at most ${maxLevels} are allowed. Choose thinning, or thin the file.`,
      })
      return failed(issues, report)
    }
    indexes = thinIndexes(pressurePa, budget)
    report.thinnedFrom = n
  }

  const levels: AtmosphereLevel[] = []
  const levelLines: (number | null)[] = []
  let climatologyOzone: ((heightAboveSurfaceM: number, p: number, t: number) => number) | undefined
  if (extend && !ozoneVmr) {
    const params = getClimatologyPreset(extend.climatology).parameters
    climatologyOzone = (h, p, t) => greenOzoneVmr(h, p, t, params.ozone)
    report.ozoneFromClimatology = true
  } else if (!ozoneVmr) {
    report.warnings.push({
      code: 'NO_OZONE',
      lineNumber: parsed.headerLineNumber,
      column: null,
      field: 'ozone',
      value: null,
      expected: 'an ozone column, or an extension with a climatology',
      message:
        'No ozone column and no climatology: the profile has no ozone. Choose a climatology ' +
        'to take ozone from, or add ozone later.',
    })
  }
  const baseHeight = heightM[0]
  for (const i of indexes) {
    const vmr: AtmosphereLevel['vmr'] = {}
    if (waterVmr) vmr.H2O = waterVmr[i]
    if (ozoneVmr) vmr.O3 = ozoneVmr[i]
    else if (climatologyOzone) {
      vmr.O3 = climatologyOzone(heightM[i] - baseHeight, pressurePa[i], temperatureK[i])
    }
    levels.push({
      pressurePa: pressurePa[i],
      temperatureK: temperatureK[i],
      heightM: heightM[i],
      vmr,
    })
    levelLines.push(kept[i].lineNumber)
  }

  if (extend && plannedExtension > 0) {
    const top = levels[levels.length - 1]
    try {
      const added = extendWithClimatology(
        {
          pressurePa: top.pressurePa,
          temperatureK: top.temperatureK,
          heightM: top.heightM,
          waterVmr: top.vmr.H2O,
          ozoneVmr: ozoneVmr ? top.vmr.O3 : undefined,
          surfaceHeightM: baseHeight,
        },
        extend.climatology,
        {
          topPressurePa,
          levelSpacingLnP: extend.levelSpacingLnP,
          relaxationScaleHeights: extend.relaxationScaleHeights,
          gravity,
          saturationPhase: phase,
        },
      )
      for (let k = 0; k < added.pressurePa.length; k++) {
        levels.push({
          pressurePa: added.pressurePa[k],
          temperatureK: added.temperatureK[k],
          heightM: added.heightM[k],
          vmr: { H2O: added.waterVmr[k], O3: added.ozoneVmr[k] },
        })
        levelLines.push(null)
      }
      report.extendedAbove = {
        fromPressurePa: top.pressurePa,
        topPressurePa,
        climatology: extend.climatology,
        addedLevels: added.pressurePa.length,
      }
    } catch (error) {
      if (!(error instanceof PhysicsError)) throw error
      issues.add({
        code: 'EXTENSION_FAILED',
        lineNumber: null,
        column: null,
        field: 'levels',
        value: null,
        expected: 'a climatology extension within the physical limits',
        message: `The profile could not be extended with the climatology: ${error.message}.`,
      })
      return failed(issues, report)
    }
  }

  // ---- 8. Final checks ----------------------------------------------------------------------
  const describeLevel = (i: number) => {
    const line = levelLines[i]
    return line === null
      ? `Climatology level at ${formatNumber(levels[i].pressurePa / 100)} hPa`
      : `Line ${line}`
  }
  const checked = checkLevels(levels, {
    saturationPhase: phase,
    maxLevels,
    displayUnits: { pressure: unitOf('pressure') },
    describeLevel,
  })
  const toRowError = (issue: (typeof checked.errors)[number]): RowError => {
    const line = issue.levelIndex === null ? null : levelLines[issue.levelIndex]
    const field = soundingFieldOf(issue.field, humidity)
    const column = line !== null && field ? columnName(field) : null
    return {
      code: rowErrorCode(issue.code, issue.field),
      lineNumber: line,
      column,
      field: field ?? issue.field,
      value: issue.value === null ? null : String(issue.value),
      expected: issue.expected,
      message: issue.message,
    }
  }
  for (const warning of checked.warnings) report.warnings.push(toRowError(warning))
  if (checked.errors.length > 0) {
    for (const error of checked.errors) issues.add(toRowError(error))
    return failed(issues, report)
  }
  report.levelLineNumbers = levelLines
  return { levels, report, errors: [], errorCount: 0 }
}

function humidityRangeText(quantity: HumidityQuantity): string {
  switch (quantity) {
    case 'dewPoint':
      return 'a dew point from −150 to 59 °C (123–332 K, the range of the saturation formula)'
    case 'relativeHumidity':
      return 'a relative humidity from 0 to 110 % at a temperature of 123–332 K'
    default:
      return `a ${FIELD_NAMES[quantity]} giving a vapour pressure below the total pressure`
  }
}

function sameValues(a: RowRecord, b: RowRecord): boolean {
  return (
    a.pressurePa === b.pressurePa &&
    a.temperatureK === b.temperatureK &&
    a.heightM === b.heightM &&
    a.humiditySi === b.humiditySi &&
    a.ozoneVmr === b.ozoneVmr
  )
}

function listLines(lines: readonly number[]): string {
  const shown = lines.slice(0, 10).join(', ')
  return lines.length > 10 ? `${shown} and ${lines.length - 10} more` : shown
}

function soundingFieldOf(
  field: LevelField,
  humidity: HumidityQuantity | undefined,
): SoundingField | null {
  switch (field) {
    case 'pressurePa':
      return 'pressure'
    case 'temperatureK':
      return 'temperature'
    case 'heightM':
      return 'height'
    case 'vmr.H2O':
      return humidity ?? 'waterVmr'
    case 'vmr.O3':
      return 'ozone'
    default:
      return null
  }
}

function rowErrorCode(code: LevelIssueCode, field: LevelField): RowError['code'] {
  switch (code) {
    case 'DUPLICATE_LEVEL':
      return 'DUPLICATE_PRESSURE'
    case 'SUPERSATURATED':
      return 'HUMIDITY_TOO_HIGH'
    case 'NEGATIVE_AMOUNT':
      return field === 'vmr.O3' ? 'NEGATIVE_OZONE' : 'NEGATIVE_HUMIDITY'
    case 'AMOUNT_TOO_LARGE':
      return field === 'vmr.O3' ? 'OZONE_TOO_HIGH' : 'HUMIDITY_OUT_OF_RANGE'
    case 'NOT_A_NUMBER':
      return 'NOT_A_NUMBER'
    default:
      return code
  }
}

/**
 * Fills null entries: ln x linear in ln p between the nearest known neighbours (x linear when
 * one of them is 0), the nearest known value beyond them. Returns null when nothing is known.
 */
function fillGaps(
  pressurePa: Float64Array,
  values: readonly (number | null)[],
): { values: Float64Array; filledIndexes: number[] } | null {
  const n = values.length
  const out = new Float64Array(n)
  const filledIndexes: number[] = []
  let lastKnown = -1
  for (let i = 0; i < n; i++) if (values[i] !== null) lastKnown = i
  if (lastKnown < 0) return null
  let below = -1
  for (let i = 0; i < n; i++) {
    const v = values[i]
    if (v !== null) {
      out[i] = v
      below = i
      continue
    }
    filledIndexes.push(i)
    let above = -1
    for (let j = i + 1; j < n; j++) {
      if (values[j] !== null) {
        above = j
        break
      }
    }
    if (below < 0) out[i] = values[above] as number
    else if (above < 0) out[i] = values[below] as number
    else {
      const v0 = values[below] as number
      const v1 = values[above] as number
      const f =
        Math.log(pressurePa[below] / pressurePa[i]) /
        Math.log(pressurePa[below] / pressurePa[above])
      out[i] =
        v0 > 0 && v1 > 0 ? Math.exp(Math.log(v0) + f * Math.log(v1 / v0)) : v0 + f * (v1 - v0)
    }
  }
  return { values: out, filledIndexes }
}

/**
 * Indexes of levels kept when thinning to at most `budget` levels: the lowest and the highest
 * always, and in between each level at least Δ = ln(p₀/p_top)/(budget − 2) in ln p above the
 * last kept one (so at most budget levels are kept).
 */
function thinIndexes(pressurePa: Float64Array, budget: number): number[] {
  const n = pressurePa.length
  const step = Math.log(pressurePa[0] / pressurePa[n - 1]) / Math.max(1, budget - 2)
  const kept = [0]
  for (let i = 1; i < n - 1; i++) {
    if (Math.log(pressurePa[kept[kept.length - 1]] / pressurePa[i]) >= step) kept.push(i)
  }
  kept.push(n - 1)
  return kept
}
