/**
 * Parser for the standard 160-character fixed-width line-parameter record of the public
 * spectroscopic databases (the layout in use since 2004).
 *
 * Columns (1-based, inclusive) and Fortran formats:
 *
 * | columns | format | field                                                   |
 * |---------|--------|---------------------------------------------------------|
 * | 1–2     | I2     | molecule number                                         |
 * | 3       | I1     | isotopologue number ('1'–'9'; '0' = 10; 'A' = 11, 'B' = 12, …) |
 * | 4–15    | F12.6  | wavenumber ν, cm⁻¹                                      |
 * | 16–25   | E10.3  | intensity S at 296 K, cm⁻¹/(molecule cm⁻²)              |
 * | 26–35   | E10.3  | Einstein A, s⁻¹                                         |
 * | 36–40   | F5.4   | γ_air, cm⁻¹ atm⁻¹                                       |
 * | 41–45   | F5.3   | γ_self, cm⁻¹ atm⁻¹                                      |
 * | 46–55   | F10.4  | lower-state energy E″, cm⁻¹                             |
 * | 56–59   | F4.2   | temperature exponent n_air                              |
 * | 60–67   | F8.6   | pressure shift δ_air, cm⁻¹ atm⁻¹                        |
 * | 68–82   | A15    | upper-state global quanta                               |
 * | 83–97   | A15    | lower-state global quanta                               |
 * | 98–112  | A15    | upper-state local quanta                                |
 * | 113–127 | A15    | lower-state local quanta                                |
 * | 128–133 | 6I1    | uncertainty indices                                     |
 * | 134–145 | 6I2    | reference indices                                       |
 * | 146     | A1     | line-mixing flag                                        |
 * | 147–153 | F7.1   | upper-state statistical weight g′                       |
 * | 154–160 | F7.1   | lower-state statistical weight g″                       |
 *
 * Source: Rothman et al. 2005, JQSRT 96, 139–204, Table 1 (the 2004 edition's record; from
 * memory).
 *
 * Strictness (our choices): real fields need an explicit decimal point (a Fortran reader would
 * imply one, which silently changes the value); integer fields allow surrounding blanks; the
 * uncertainty and reference indices and the statistical weights may be blank (read as 0 and
 * "absent"); E″ must be ≥ 0 (records that mark an unknown E″ with a negative value are rejected,
 * because such lines cannot be scaled in temperature).
 */
import { PhysicsError } from '../errors'
import type { SpectralLine } from './line'

/** Length of one record, characters (without the line terminator). */
export const LINE_RECORD_LENGTH = 160

/** One problem found in a record. */
export interface LineRecordError {
  /** 1-based line number in the input. */
  lineNumber: number
  /** Field name (the SpectralLine property, or 'record' for the record as a whole). */
  field: string
  /** 1-based inclusive column range of the field. */
  columnRange: readonly [number, number]
  /** The offending text (the field content; for 'record' the first 40 characters). */
  value: string
  /** What was expected, in words. */
  expected: string
}

/** Options of `parseLineRecords`. */
export interface ParseLineRecordsOptions {
  /** 'throw' (default): throw a PARSE_ERROR at the first bad record; 'collect': keep going. */
  onError?: 'throw' | 'collect'
  /** In 'collect' mode, stop reading after this many errors (default: no limit). */
  maxErrors?: number
}

/** Result of `parseLineRecords`. */
export interface ParseLineRecordsResult {
  /** Records that parsed without error, in input order. */
  lines: SpectralLine[]
  /** Every problem found (empty in 'throw' mode). */
  errors: LineRecordError[]
  /** Number of non-blank records read (good and bad). */
  recordCount: number
  /** True when reading stopped at `maxErrors` with non-blank records left unread. */
  stoppedEarly: boolean
}

type RealField =
  | 'wavenumberCm'
  | 'intensityCmPerMolecule'
  | 'einsteinAPerS'
  | 'airHalfWidthCmPerAtm'
  | 'selfHalfWidthCmPerAtm'
  | 'lowerStateEnergyCm'
  | 'temperatureExponentAir'
  | 'pressureShiftCmPerAtm'

interface RealSpec {
  field: RealField
  start: number
  end: number
  format: string
  example: string
  /** Allowed range: 'positive' (> 0), 'nonNegative' (≥ 0) or 'any' finite value. */
  range: 'positive' | 'nonNegative' | 'any'
}

const REAL_FIELDS: readonly RealSpec[] = [
  {
    field: 'wavenumberCm',
    start: 4,
    end: 15,
    format: 'F12.6',
    example: '667.380000',
    range: 'positive',
  },
  {
    field: 'intensityCmPerMolecule',
    start: 16,
    end: 25,
    format: 'E10.3',
    example: '3.215E-19',
    range: 'nonNegative',
  },
  {
    field: 'einsteinAPerS',
    start: 26,
    end: 35,
    format: 'E10.3',
    example: '1.520E+00',
    range: 'nonNegative',
  },
  {
    field: 'airHalfWidthCmPerAtm',
    start: 36,
    end: 40,
    format: 'F5.4',
    example: '.0720',
    range: 'nonNegative',
  },
  {
    field: 'selfHalfWidthCmPerAtm',
    start: 41,
    end: 45,
    format: 'F5.3',
    example: '0.095',
    range: 'nonNegative',
  },
  {
    field: 'lowerStateEnergyCm',
    start: 46,
    end: 55,
    format: 'F10.4',
    example: '234.1234',
    range: 'nonNegative',
  },
  {
    field: 'temperatureExponentAir',
    start: 56,
    end: 59,
    format: 'F4.2',
    example: '0.75',
    range: 'any',
  },
  {
    field: 'pressureShiftCmPerAtm',
    start: 60,
    end: 67,
    format: 'F8.6',
    example: '-.001234',
    range: 'any',
  },
]

const QUANTA_FIELDS = [
  { field: 'upperGlobalQuanta', start: 68, end: 82 },
  { field: 'lowerGlobalQuanta', start: 83, end: 97 },
  { field: 'upperLocalQuanta', start: 98, end: 112 },
  { field: 'lowerLocalQuanta', start: 113, end: 127 },
] as const

const WEIGHT_FIELDS = [
  { field: 'upperStatisticalWeight', start: 147, end: 153 },
  { field: 'lowerStatisticalWeight', start: 154, end: 160 },
] as const

/** A real number with an explicit decimal point and an optional E/D exponent. */
const REAL_PATTERN = /^[+-]?(\d+\.\d*|\.\d+)([eEdD][+-]?\d{1,3})?$/
const INTEGER_PATTERN = /^[+-]?\d+$/

function slice(text: string, start: number, end: number): string {
  return text.slice(start - 1, end)
}

function readReal(text: string): number | undefined {
  const trimmed = text.trim()
  if (!REAL_PATTERN.test(trimmed)) return undefined
  const value = Number(trimmed.replace(/[dD]/, 'e'))
  return Number.isFinite(value) ? value : undefined
}

function describeRange(range: RealSpec['range']): string {
  if (range === 'positive') return ' > 0'
  if (range === 'nonNegative') return ' ≥ 0'
  return ''
}

/** Isotopologue code: '1'–'9' → 1–9, '0' → 10, 'A' → 11, 'B' → 12, …, 'Z' → 36. */
function readIsotopologue(code: string): number | undefined {
  if (/^[1-9]$/.test(code)) return Number(code)
  if (code === '0') return 10
  if (/^[A-Z]$/.test(code)) return 11 + code.charCodeAt(0) - 65
  return undefined
}

/** Removes one trailing line terminator ('\n', '\r\n' or '\r'). */
function stripTerminator(text: string): string {
  if (text.endsWith('\r\n')) return text.slice(0, -2)
  if (text.endsWith('\n') || text.endsWith('\r')) return text.slice(0, -1)
  return text
}

/**
 * Parses one record, pushing every problem into `errors`. Returns the line, or undefined when
 * at least one error was found.
 */
function parseInto(
  rawText: string,
  lineNumber: number,
  errors: LineRecordError[],
): SpectralLine | undefined {
  const text = stripTerminator(rawText)
  if (text.length !== LINE_RECORD_LENGTH) {
    errors.push({
      lineNumber,
      field: 'record',
      columnRange: [1, text.length],
      value: text.slice(0, 40),
      expected: `${LINE_RECORD_LENGTH} characters, got ${text.length}`,
    })
    return undefined
  }
  const errorCountBefore = errors.length
  const fail = (field: string, start: number, end: number, expected: string): void => {
    errors.push({
      lineNumber,
      field,
      columnRange: [start, end],
      value: slice(text, start, end),
      expected,
    })
  }

  const moleculeText = slice(text, 1, 2).trim()
  const moleculeId = INTEGER_PATTERN.test(moleculeText) ? Number(moleculeText) : NaN
  if (!(moleculeId >= 1)) fail('moleculeId', 1, 2, 'molecule number, an integer 1–99 (I2)')

  const isotopologueId = readIsotopologue(slice(text, 3, 3))
  if (isotopologueId === undefined) {
    fail('isotopologueId', 3, 3, "isotopologue code '1'–'9', '0' (= 10) or 'A'–'Z' (= 11–36)")
  }

  const reals: Partial<Record<RealField, number>> = {}
  for (const spec of REAL_FIELDS) {
    const value = readReal(slice(text, spec.start, spec.end))
    const inRange =
      value !== undefined &&
      (spec.range === 'any' || (spec.range === 'positive' ? value > 0 : value >= 0))
    if (!inRange) {
      fail(
        spec.field,
        spec.start,
        spec.end,
        `a number${describeRange(spec.range)} with a decimal point (${spec.format}, e.g. '${spec.example}')`,
      )
    } else {
      reals[spec.field] = value
    }
  }

  const uncertaintyIndices: number[] = []
  for (let k = 0; k < 6; k++) {
    const column = 128 + k
    const c = slice(text, column, column)
    if (c === ' ') uncertaintyIndices.push(0)
    else if (/^\d$/.test(c)) uncertaintyIndices.push(Number(c))
    else fail('uncertaintyIndices', column, column, 'a digit or blank (6I1)')
  }

  const referenceIndices: number[] = []
  for (let k = 0; k < 6; k++) {
    const start = 134 + 2 * k
    const field = slice(text, start, start + 1).trim()
    if (field === '') referenceIndices.push(0)
    else if (/^\d+$/.test(field)) referenceIndices.push(Number(field))
    else fail('referenceIndices', start, start + 1, 'an integer 0–99 or blank (6I2)')
  }

  const weights: Partial<Record<'upperStatisticalWeight' | 'lowerStatisticalWeight', number>> = {}
  for (const spec of WEIGHT_FIELDS) {
    const fieldText = slice(text, spec.start, spec.end)
    if (fieldText.trim() === '') continue
    const value = readReal(fieldText)
    if (value === undefined || value < 0) {
      fail(
        spec.field,
        spec.start,
        spec.end,
        "blank or a number ≥ 0 with a decimal point (F7.1, e.g. '   25.0')",
      )
    } else {
      weights[spec.field] = value
    }
  }

  if (errors.length > errorCountBefore) return undefined

  const line: SpectralLine = {
    moleculeId,
    isotopologueId: isotopologueId as number,
    wavenumberCm: reals.wavenumberCm as number,
    intensityCmPerMolecule: reals.intensityCmPerMolecule as number,
    einsteinAPerS: reals.einsteinAPerS as number,
    airHalfWidthCmPerAtm: reals.airHalfWidthCmPerAtm as number,
    selfHalfWidthCmPerAtm: reals.selfHalfWidthCmPerAtm as number,
    lowerStateEnergyCm: reals.lowerStateEnergyCm as number,
    temperatureExponentAir: reals.temperatureExponentAir as number,
    pressureShiftCmPerAtm: reals.pressureShiftCmPerAtm as number,
    upperGlobalQuanta: slice(text, QUANTA_FIELDS[0].start, QUANTA_FIELDS[0].end),
    lowerGlobalQuanta: slice(text, QUANTA_FIELDS[1].start, QUANTA_FIELDS[1].end),
    upperLocalQuanta: slice(text, QUANTA_FIELDS[2].start, QUANTA_FIELDS[2].end),
    lowerLocalQuanta: slice(text, QUANTA_FIELDS[3].start, QUANTA_FIELDS[3].end),
    uncertaintyIndices,
    referenceIndices,
    lineMixingFlag: slice(text, 146, 146).trim(),
  }
  if (weights.upperStatisticalWeight !== undefined) {
    line.upperStatisticalWeight = weights.upperStatisticalWeight
  }
  if (weights.lowerStatisticalWeight !== undefined) {
    line.lowerStatisticalWeight = weights.lowerStatisticalWeight
  }
  return line
}

function toPhysicsError(errors: readonly LineRecordError[]): PhysicsError {
  const first = errors[0]
  const [a, b] = first.columnRange
  return new PhysicsError(
    'PARSE_ERROR',
    `line ${first.lineNumber}, columns ${a}–${b} (${first.field}): expected ${first.expected}, got '${first.value}'`,
    { ...first, errors },
  )
}

/**
 * Parses one 160-character line-parameter record (a trailing '\r', '\n' or '\r\n' is allowed).
 * Quantum labels are kept raw (15 characters, blanks included).
 * Throws PhysicsError('PARSE_ERROR') whose details hold the first error's `lineNumber`, `field`,
 * `columnRange`, `value`, `expected`, and `errors` (all problems of the record).
 */
export function parseLineRecord(text: string, lineNumber: number): SpectralLine {
  const errors: LineRecordError[] = []
  const line = parseInto(text, lineNumber, errors)
  if (!line) throw toPhysicsError(errors)
  return line
}

/**
 * Parses a sequence of records (any iterable of lines, e.g. a generator over a stream).
 * Blank lines (empty or whitespace only) are skipped; line numbers count every input line from 1.
 * With onError 'throw' (default) the first bad record throws as `parseLineRecord`; with 'collect'
 * bad records are left out of `lines` and every problem is listed in `errors`.
 */
export function parseLineRecords(
  lines: Iterable<string>,
  options: ParseLineRecordsOptions = {},
): ParseLineRecordsResult {
  const onError = options.onError ?? 'throw'
  const maxErrors = options.maxErrors ?? Infinity
  if (onError !== 'throw' && onError !== 'collect') {
    throw new PhysicsError('INVALID_ARGUMENT', `onError must be 'throw' or 'collect'`, { onError })
  }
  if (!(maxErrors >= 1)) {
    throw new PhysicsError('INVALID_ARGUMENT', 'maxErrors must be ≥ 1', { maxErrors })
  }
  const result: ParseLineRecordsResult = {
    lines: [],
    errors: [],
    recordCount: 0,
    stoppedEarly: false,
  }
  let lineNumber = 0
  let limitReached = false
  for (const text of lines) {
    lineNumber++
    if (text.trim() === '') continue
    if (limitReached) {
      result.stoppedEarly = true
      break
    }
    result.recordCount++
    const recordErrors: LineRecordError[] = []
    const line = parseInto(text, lineNumber, recordErrors)
    if (line) {
      result.lines.push(line)
      continue
    }
    if (onError === 'throw') throw toPhysicsError(recordErrors)
    result.errors.push(...recordErrors)
    if (result.errors.length >= maxErrors) limitReached = true
  }
  return result
}
