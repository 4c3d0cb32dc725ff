/**
 * Guessing what each column of a sounding holds, and in which unit, from the header names, an
 * optional units line, and the magnitudes of the values. The guess is a suggestion the analyst
 * confirms or corrects in the upload preview; `describeGuess` explains it in words.
 */
import { formatNumber } from '../format'
import {
  LEVEL_UNITS,
  unitSymbol,
  type HumidityQuantity,
  type LevelQuantity,
  type LevelUnitIds,
  type LevelUnits,
} from '../units'
import { readCell } from './cells'

/** The fields a sounding column can be mapped to (the quantities of the level table). */
export type SoundingField = LevelQuantity

/** Column index (0-based, in header order) for each mapped field. */
export type ColumnMapping = { [F in SoundingField]?: number }

/** Where a unit guess came from, strongest first. */
export type GuessBasis = 'header' | 'units-row' | 'values' | 'default'

/** A guessed unit with the reason, for the preview. */
export interface UnitGuess {
  unit: string
  basis: GuessBasis
  reason: string
  /** Set when the header's unit disagrees with what the values look like. */
  conflict?: string
}

/** A column that is not used, with the reason. */
export interface IgnoredColumn {
  columnIndex: number
  column: string
  reason: string
}

/** Result of `guessColumnMapping`. */
export interface ColumnGuess {
  mapping: ColumnMapping
  units: LevelUnits
  unitGuesses: { [F in SoundingField]?: UnitGuess }
  ignored: IgnoredColumn[]
}

/** Options of `guessColumnMapping`. */
export interface GuessColumnsOptions {
  /** The line of units below the header, if the file has one (ParsedSounding.unitsRow). */
  unitsRow?: readonly string[]
  /** Decimal separator of the numbers (ParsedSounding.decimalSeparator), default '.'. */
  decimalSeparator?: '.' | ','
}

/**
 * Which humidity column is used when several are mapped, best first. A volume mixing ratio is
 * taken as given; the dew point is usually reported to 0.1 °C (≈ 1.5 % in vapour pressure) at
 * every level, while mixing ratios to 0.01 g/kg and relative humidity to 1 % lose precision in
 * dry upper air, and relative humidity also depends on the saturation convention (common
 * practice of radiosonde reports).
 */
export const HUMIDITY_PRIORITY: readonly HumidityQuantity[] = [
  'waterVmr',
  'dewPoint',
  'mixingRatio',
  'specificHumidity',
  'relativeHumidity',
]

/** The humidity field used for a mapping: the first of HUMIDITY_PRIORITY that is mapped. */
export function pickHumiditySource(mapping: ColumnMapping): HumidityQuantity | undefined {
  return HUMIDITY_PRIORITY.find((field) => mapping[field] !== undefined)
}

const FIELD_NAMES: Readonly<Record<string, SoundingField>> = Object.fromEntries([
  ...['pres', 'pressure', 'p', 'press', 'prs', 'pr', 'airpressure', 'prespa'].map(
    (n) => [n, 'pressure'] as const,
  ),
  ...[
    'hght',
    'height',
    'z',
    'alt',
    'altitude',
    'hgt',
    'gph',
    'geopotentialheight',
    'geopotential',
    'geopot',
    'zg',
    'h',
    'elevation',
  ].map((n) => [n, 'height'] as const),
  ...['temp', 't', 'temperature', 'ta', 'airtemperature', 'airtemp', 'tdry', 'tt'].map(
    (n) => [n, 'temperature'] as const,
  ),
  ...['dwpt', 'td', 'dewpoint', 'dew', 'dewpointtemperature', 'tdew', 'dp', 'dpt', 'dwpk'].map(
    (n) => [n, 'dewPoint'] as const,
  ),
  ...['relh', 'rh', 'relativehumidity', 'humidity', 'hum', 'rhum'].map(
    (n) => [n, 'relativeHumidity'] as const,
  ),
  ...['mixr', 'mixingratio', 'w', 'r', 'mr', 'wvmr', 'watervapourmixingratio'].map(
    (n) => [n, 'mixingRatio'] as const,
  ),
  ...['q', 'spfh', 'shum', 'specifichumidity', 'sh', 'qv'].map(
    (n) => [n, 'specificHumidity'] as const,
  ),
  ...['h2o', 'h2ovmr', 'vmrh2o', 'wv', 'watervapour', 'watervapor', 'xh2o'].map(
    (n) => [n, 'waterVmr'] as const,
  ),
  ...['o3', 'ozone', 'o3mr', 'o3vmr', 'ozonemixingratio', 'xo3'].map((n) => [n, 'ozone'] as const),
])

/** Names that say both the field and the unit. */
const NAMES_WITH_UNIT: Readonly<Record<string, { field: SoundingField; unit: string }>> = {
  hpa: { field: 'pressure', unit: 'hPa' },
  mb: { field: 'pressure', unit: 'hPa' },
  mbar: { field: 'pressure', unit: 'hPa' },
  pa: { field: 'pressure', unit: 'Pa' },
  kpa: { field: 'pressure', unit: 'kPa' },
  tc: { field: 'temperature', unit: 'degC' },
  tk: { field: 'temperature', unit: 'K' },
  tdc: { field: 'dewPoint', unit: 'degC' },
  tdk: { field: 'dewPoint', unit: 'K' },
  gpm: { field: 'height', unit: 'm' },
}

const WIND = 'wind is not used in clear-sky radiative transfer'
const POTENTIAL = 'potential temperature is derived from pressure and temperature; not needed'
const TIME = 'the time of observation is not part of the level table'
const POSITION = 'the position of the balloon is not part of the level table'
const BOOKKEEPING = 'not a physical quantity of the profile'

const IGNORED_NAMES: Readonly<Record<string, string>> = Object.fromEntries([
  ...[
    'drct',
    'sknt',
    'wdir',
    'wspd',
    'winddirection',
    'windspeed',
    'wind',
    'dir',
    'speed',
    'ws',
    'wd',
    'ff',
    'dd',
    'u',
    'v',
    'uwind',
    'vwind',
  ].map((n) => [n, WIND] as const),
  ...['thta', 'thte', 'thtv', 'theta', 'thetae', 'thetav', 'thetaw'].map(
    (n) => [n, POTENTIAL] as const,
  ),
  ...['tv', 'tvirt', 'virtualtemperature'].map(
    (n) => [n, 'virtual temperature is derived; the temperature column is used'] as const,
  ),
  ...['frostpoint', 'tf', 'tfp', 'frostpointtemperature'].map(
    (n) =>
      [
        n,
        'frost point is not supported; give dew point, relative humidity or mixing ratio',
      ] as const,
  ),
  ...['ozonepartialpressure', 'o3partialpressure', 'o3pp', 'po3'].map(
    (n) => [n, 'ozone partial pressure is not supported; give ozone in ppmv or ppbv'] as const,
  ),
  ...['time', 'elapsedtime', 'elapsed', 'sec', 'seconds', 'timestamp', 'date', 'hhmmss'].map(
    (n) => [n, TIME] as const,
  ),
  ...['lat', 'lon', 'long', 'latitude', 'longitude'].map((n) => [n, POSITION] as const),
  ...['flag', 'flags', 'quality', 'qc', 'level', 'lvl', 'index', 'no', 'id', 'n'].map(
    (n) => [n, BOOKKEEPING] as const,
  ),
])

const NOT_RECOGNISED =
  'not recognised; expected names such as PRES, HGHT, TEMP, DWPT, RELH, MIXR or O3'

interface UnitPattern {
  unit: string
  pattern: RegExp
}

const TEMPERATURE_PATTERNS: readonly UnitPattern[] = [
  { unit: 'degC', pattern: /\b(deg ?c|c|celsius|degrees? c)\b/ },
  { unit: 'K', pattern: /\b(k|kelvin|deg ?k)\b/ },
]
const MASS_RATIO_PATTERNS: readonly UnitPattern[] = [
  { unit: 'kgPerKg', pattern: /\bkg ?(\/|per)? ?kg\b|\bkgkg\b/ },
  { unit: 'gPerKg', pattern: /\bg ?(\/|per)? ?kg\b|\bgkg\b/ },
]

const UNIT_PATTERNS: { readonly [F in SoundingField]: readonly UnitPattern[] } = {
  pressure: [
    { unit: 'hPa', pattern: /\b(hpa|mb|mbar|millibars?|hectopascals?)\b/ },
    { unit: 'kPa', pattern: /\bkpa\b/ },
    { unit: 'Pa', pattern: /\b(pa|pascals?)\b/ },
  ],
  temperature: TEMPERATURE_PATTERNS,
  dewPoint: TEMPERATURE_PATTERNS,
  height: [
    { unit: 'km', pattern: /\bkm\b/ },
    { unit: 'm', pattern: /\b(m|gpm|metres?|meters?|masl|m asl)\b/ },
  ],
  relativeHumidity: [
    { unit: 'percent', pattern: /%|\bpercent\b|\bpct\b/ },
    { unit: 'fraction', pattern: /\b(fraction|frac|0-1)\b/ },
  ],
  mixingRatio: MASS_RATIO_PATTERNS,
  specificHumidity: MASS_RATIO_PATTERNS,
  waterVmr: [
    { unit: 'ppmv', pattern: /\bppmv?\b/ },
    { unit: 'molPerMol', pattern: /\bmol ?(\/|per)? ?mol\b/ },
  ],
  ozone: [
    { unit: 'ppbv', pattern: /\bppbv?\b/ },
    { unit: 'ppmv', pattern: /\bppmv?\b/ },
    { unit: 'molPerMol', pattern: /\bmol ?(\/|per)? ?mol\b/ },
  ],
}

function normaliseUnitText(text: string): string {
  return text.toLowerCase().replace(/°/g, 'deg').replace(/⁻¹/g, '-1').replace(/\s+/g, ' ').trim()
}

/** What a header cell names: a field (with an optional unit text) or an ignored column. */
type HeaderMeaning =
  | { kind: 'field'; field: SoundingField; impliedUnit?: string; unitText: string }
  | { kind: 'ignored'; reason: string }

/** Reads a header cell such as 'TEMP', 'Pressure (hPa)', 'T_K', 'MIXR g/kg', 'RH%'. */
function readHeader(cell: string): HeaderMeaning {
  const bracketed: string[] = []
  const name = cell.replace(/[([{]([^)\]}]*)[)\]}]/g, (_, inner: string) => {
    bracketed.push(inner)
    return ' '
  })
  const tokens = name
    .toLowerCase()
    .replace(/°/g, ' deg')
    .replace(/%/g, ' % ')
    .split(/[^a-z0-9%]+/)
    .filter(Boolean)
  for (let k = tokens.length; k >= 1; k--) {
    const key = tokens.slice(0, k).join('')
    const unitText = normaliseUnitText([...tokens.slice(k), ...bracketed].join(' '))
    const withUnit = NAMES_WITH_UNIT[key]
    if (withUnit)
      return { kind: 'field', field: withUnit.field, impliedUnit: withUnit.unit, unitText }
    const field = FIELD_NAMES[key]
    if (field) return { kind: 'field', field, unitText }
    const reason = IGNORED_NAMES[key]
    if (reason) return { kind: 'ignored', reason }
  }
  return { kind: 'ignored', reason: NOT_RECOGNISED }
}

function unitFromText(field: SoundingField, text: string): string | undefined {
  if (!text) return undefined
  return UNIT_PATTERNS[field].find((p) => p.pattern.test(text))?.unit
}

interface ColumnStats {
  count: number
  min: number
  max: number
}

function columnStats(
  rows: readonly (readonly string[])[],
  column: number,
  decimalSeparator: '.' | ',',
): ColumnStats {
  let count = 0
  let min = Infinity
  let max = -Infinity
  for (const row of rows) {
    const cell = readCell(row[column] ?? '', decimalSeparator)
    if (cell.kind !== 'number') continue
    count++
    if (cell.value < min) min = cell.value
    if (cell.value > max) max = cell.value
  }
  return { count, min, max }
}

/** Unit suggested by the magnitudes of the values, with the reason. */
function unitFromValues(
  field: SoundingField,
  stats: ColumnStats,
): { unit: string; reason: string } | undefined {
  if (stats.count === 0) return undefined
  const max = formatNumber(stats.max)
  const min = formatNumber(stats.min)
  switch (field) {
    case 'pressure':
      if (stats.max > 2000)
        return { unit: 'Pa', reason: `the largest value, ${max}, is above 2000: too large for hPa` }
      if (stats.max > 120)
        return { unit: 'hPa', reason: `values up to ${max} fit hPa (about 1000 hPa at sea level)` }
      return {
        unit: 'kPa',
        reason: `the largest value, ${max}, is at most 120: it fits kPa (about 100 kPa at sea level)`,
      }
    case 'temperature':
    case 'dewPoint':
      if (stats.max < 100)
        return {
          unit: 'degC',
          reason: `values up to ${max} are below 100: too cold for kelvin (air is above 150 K)`,
        }
      return { unit: 'K', reason: `values from ${min} to ${max} fit kelvin` }
    case 'height':
      if (stats.max > 100) return { unit: 'm', reason: `values up to ${max} fit metres` }
      return {
        unit: 'km',
        reason: `the highest value, ${max}, is at most 100: it fits km (a sounding in metres reaches thousands)`,
      }
    case 'relativeHumidity':
      if (stats.max <= 1.5)
        return {
          unit: 'fraction',
          reason: `values up to ${max} are at most 1.5: a fraction, not percent`,
        }
      return { unit: 'percent', reason: `values up to ${max} fit percent` }
    case 'mixingRatio':
    case 'specificHumidity':
      if (stats.max > 0.05)
        return { unit: 'gPerKg', reason: `values up to ${max} are above 0.05: too moist for kg/kg` }
      return { unit: 'kgPerKg', reason: `values up to ${max} are at most 0.05: they fit kg/kg` }
    case 'waterVmr':
      if (stats.max >= 1) return { unit: 'ppmv', reason: `values up to ${max} fit ppmv` }
      return { unit: 'molPerMol', reason: `values below 1 fit mol/mol rather than ppmv` }
    case 'ozone':
      if (stats.max < 1e-3) return { unit: 'molPerMol', reason: `values below 0.001 fit mol/mol` }
      if (stats.max > 20)
        return { unit: 'ppbv', reason: `values up to ${max} are above 20: too large for ppmv` }
      return { unit: 'ppmv', reason: `values up to ${max} fit ppmv (ozone peaks near 10 ppmv)` }
  }
}

function symbolOf(field: SoundingField, unit: string): string {
  return unitSymbol(field, unit as LevelUnitIds[typeof field])
}

/**
 * Guesses which column holds which quantity and in which unit.
 *
 * Names are matched case-insensitively, ignoring punctuation and a trailing unit
 * ('Pressure (hPa)', 'PRES', 'p_hpa', 'TEMP', 'T', 'TC', 'DWPT', 'Td', 'RELH', 'RH%', 'MIXR',
 * 'w', 'q' — specific humidity —, 'HGHT', 'Z', 'alt', 'O3', 'H2O'). Units come from the header,
 * then the units line, then the magnitudes of the values: pressure above 2000 ⇒ Pa, above 120 ⇒
 * hPa, else kPa; temperature and dew point below 100 ⇒ °C, else K; height up to 100 ⇒ km, else
 * m; relative humidity up to 1.5 ⇒ fraction, else %; mixing ratio above 0.05 ⇒ g/kg, else kg/kg;
 * ozone above 20 ⇒ ppbv, below 0.001 ⇒ mol/mol, else ppmv. When the header's unit disagrees with
 * the values, the header wins and `conflict` says so. A second column for a field already mapped,
 * wind, potential temperatures, time and position columns are listed in `ignored`, with reasons.
 *
 * @param header header cells
 * @param sampleRows some data rows (all of them is fine) for the value magnitudes
 * @param options units line and decimal separator from the parsed file
 * @returns mapping (column indexes), units, the reasons, and the ignored columns
 */
export function guessColumnMapping(
  header: readonly string[],
  sampleRows: readonly (readonly string[])[],
  options: GuessColumnsOptions = {},
): ColumnGuess {
  const decimalSeparator = options.decimalSeparator ?? '.'
  const mapping: ColumnMapping = {}
  const units: LevelUnits = {}
  const unitGuesses: ColumnGuess['unitGuesses'] = {}
  const ignored: IgnoredColumn[] = []
  header.forEach((column, columnIndex) => {
    const meaning = readHeader(column)
    if (meaning.kind === 'ignored') {
      ignored.push({
        columnIndex,
        column,
        reason: column.trim() === '' ? 'the column has no name' : meaning.reason,
      })
      return
    }
    const { field } = meaning
    const taken = mapping[field]
    if (taken !== undefined) {
      ignored.push({
        columnIndex,
        column,
        reason: `a second ${LEVEL_UNITS[field].label.toLowerCase()} column; column ${taken + 1} '${header[taken]}' is used`,
      })
      return
    }
    mapping[field] = columnIndex
    const stats = columnStats(sampleRows, columnIndex, decimalSeparator)
    const fromValues = unitFromValues(field, stats)
    const headerUnit = meaning.impliedUnit ?? unitFromText(field, meaning.unitText)
    const unitsRowCell = options.unitsRow?.[columnIndex]
    const rowUnit = unitsRowCell ? unitFromText(field, normaliseUnitText(unitsRowCell)) : undefined
    let guess: UnitGuess
    if (headerUnit) {
      guess = {
        unit: headerUnit,
        basis: 'header',
        reason: `the header '${column}' says ${symbolOf(field, headerUnit)}`,
      }
    } else if (rowUnit) {
      guess = { unit: rowUnit, basis: 'units-row', reason: `the units line says '${unitsRowCell}'` }
    } else if (fromValues) {
      guess = { unit: fromValues.unit, basis: 'values', reason: fromValues.reason }
    } else {
      const unit = LEVEL_UNITS[field].defaultUnit
      guess = {
        unit,
        basis: 'default',
        reason: `no numbers to judge from; assumed ${symbolOf(field, unit)}`,
      }
    }
    if (guess.basis !== 'values' && fromValues && fromValues.unit !== guess.unit) {
      guess.conflict = `but ${fromValues.reason}, which suggests ${symbolOf(field, fromValues.unit)}`
    }
    unitGuesses[field] = guess
    ;(units as Record<string, string>)[field] = guess.unit
  })
  return { mapping, units, unitGuesses, ignored }
}

/** One line of the explanation of a guess, per column in header order. */
export interface GuessDescription {
  columnIndex: number
  column: string
  field: SoundingField | null
  unit: string | null
  text: string
}

/**
 * Explains a guess column by column, for the upload preview: what each column was taken for, in
 * which unit and why, which humidity column is used, and why other columns are not used.
 *
 * @param guess result of `guessColumnMapping` (possibly edited by the analyst)
 * @param header header cells
 * @returns one description per header column
 */
export function describeGuess(guess: ColumnGuess, header: readonly string[]): GuessDescription[] {
  const humidity = pickHumiditySource(guess.mapping)
  return header.map((column, columnIndex) => {
    const name = `Column ${columnIndex + 1} '${column}'`
    const field = (Object.keys(guess.mapping) as SoundingField[]).find(
      (f) => guess.mapping[f] === columnIndex,
    )
    if (field) {
      const unit = guess.units[field] ?? null
      const label = LEVEL_UNITS[field].label.toLowerCase()
      const unitText = unit ? ` in ${symbolOf(field, unit)}` : ' (no unit chosen)'
      const unitGuess = guess.unitGuesses[field]
      const why = unitGuess && unitGuess.unit === unit ? `: ${unitGuess.reason}` : ''
      const conflict =
        unitGuess?.conflict && unitGuess.unit === unit ? ` (${unitGuess.conflict})` : ''
      const isHumidity = (HUMIDITY_PRIORITY as readonly string[]).includes(field)
      const humidityNote =
        isHumidity && humidity && humidity !== field
          ? ` Not used for water vapour while the ${LEVEL_UNITS[humidity].label.toLowerCase()} column is mapped.`
          : ''
      return {
        columnIndex,
        column,
        field,
        unit,
        text: `${name}: ${label}${unitText}${why}${conflict}.${humidityNote}`,
      }
    }
    const ignored = guess.ignored.find((c) => c.columnIndex === columnIndex)
    return {
      columnIndex,
      column,
      field: null,
      unit: null,
      text: `${name}: not used — ${ignored?.reason ?? 'not mapped'}.`,
    }
  })
}
