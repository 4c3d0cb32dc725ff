/**
 * The catalogue file format: compact, versioned, deterministic JSON written by
 * scripts/generate-catalogue.ts into data/ and read back by the server and client.
 *
 * Layout (the whole file is valid JSON; line 1 is the header, line 2 onward the body):
 *
 *   {"header":{"format":"tauline-catalogue","formatVersion":1,"generatorVersion":"…",
 *     "createdFrom":"…","lineCount":N,"bandCount":M,"checksum":"sha256:<64 hex>"},
 *   "body":{"bands":[…],"quantaLabels":[…],"columns":{"bandIndex":[…],"moleculeId":[…],…}}}
 *
 * The header is one line. The checksum is the SHA-256 of the exact body text (UTF-8), from the
 * character after `"body":` up to (not including) the final `}` of the file. Columns are arrays of
 * length N in a fixed order with fixed decimal formatting per column, so building the same
 * catalogue twice gives the same bytes. Quantum-number labels are stored once in `quantaLabels`
 * and referenced by index (−1 = absent); statistical weight 0 = absent.
 */
import { PhysicsError } from '../physics/errors'
import { validateSpectralLine, type SpectralLine } from '../physics/spectroscopy/line'
import type { ConfidenceTag } from './constants/confidence'
import type { BuiltInCatalogue, CatalogueBandSummary } from './registry'
import { sha256Hex } from './sha256'

/** Format name written into every catalogue file header. */
export const CATALOGUE_FORMAT = 'tauline-catalogue'
/** Current (and only supported) format version. */
export const CATALOGUE_FORMAT_VERSION = 1
/** Default `createdFrom` text. */
export const DEFAULT_CATALOGUE_CREATED_FROM =
  'Tauline built-in generators: lines synthesised from published molecular constants (shared/catalogue)'

/** Header of a catalogue file. */
export interface CatalogueFileHeader {
  format: string
  formatVersion: number
  generatorVersion: string
  createdFrom: string
  lineCount: number
  bandCount: number
  /** 'sha256:' + 64 lower-case hex characters of the body text. */
  checksum: string
}

/** A parsed catalogue file. */
export interface ParsedCatalogue {
  header: CatalogueFileHeader
  lines: SpectralLine[]
  lineBandIndex: number[]
  bands: CatalogueBandSummary[]
}

/** Hash function: text → lower-case hex digest (default: SHA-256 of the UTF-8 bytes). */
export type TextHash = (text: string) => string

type Format = { kind: 'int' } | { kind: 'fixed'; digits: number } | { kind: 'exp'; digits: number }

type NumericField =
  | 'moleculeId'
  | 'isotopologueId'
  | 'wavenumberCm'
  | 'intensityCmPerMolecule'
  | 'einsteinAPerS'
  | 'airHalfWidthCmPerAtm'
  | 'selfHalfWidthCmPerAtm'
  | 'lowerStateEnergyCm'
  | 'temperatureExponentAir'
  | 'pressureShiftCmPerAtm'
  | 'upperStatisticalWeight'
  | 'lowerStatisticalWeight'
type QuantaField =
  'upperGlobalQuanta' | 'lowerGlobalQuanta' | 'upperLocalQuanta' | 'lowerLocalQuanta'

const INT: Format = { kind: 'int' }

/** Numeric columns in file order with their formatting. */
const NUMERIC_COLUMNS: readonly { field: NumericField; format: Format }[] = [
  { field: 'moleculeId', format: INT },
  { field: 'isotopologueId', format: INT },
  { field: 'wavenumberCm', format: { kind: 'fixed', digits: 6 } },
  { field: 'intensityCmPerMolecule', format: { kind: 'exp', digits: 9 } },
  { field: 'einsteinAPerS', format: { kind: 'exp', digits: 6 } },
  { field: 'airHalfWidthCmPerAtm', format: { kind: 'fixed', digits: 5 } },
  { field: 'selfHalfWidthCmPerAtm', format: { kind: 'fixed', digits: 5 } },
  { field: 'lowerStateEnergyCm', format: { kind: 'fixed', digits: 4 } },
  { field: 'temperatureExponentAir', format: { kind: 'fixed', digits: 3 } },
  { field: 'pressureShiftCmPerAtm', format: { kind: 'fixed', digits: 5 } },
  { field: 'upperStatisticalWeight', format: INT },
  { field: 'lowerStatisticalWeight', format: INT },
]
const QUANTA_COLUMNS: readonly QuantaField[] = [
  'upperGlobalQuanta',
  'lowerGlobalQuanta',
  'upperLocalQuanta',
  'lowerLocalQuanta',
]

function formatNumber(value: number, format: Format, what: string): string {
  if (!Number.isFinite(value)) {
    throw new PhysicsError('INVALID_ARGUMENT', `${what} is not finite`, { what, value })
  }
  let text: string
  if (format.kind === 'int') {
    if (!Number.isInteger(value)) {
      throw new PhysicsError('INVALID_ARGUMENT', `${what} must be an integer`, { what, value })
    }
    text = String(value)
  } else if (format.kind === 'fixed') text = value.toFixed(format.digits)
  else text = value.toExponential(format.digits)
  // Negative zero after rounding prints as "-0.000…"; write it without the sign.
  return /^-0(\.0*)?(e[+-]\d+)?$/.test(text) ? text.slice(1) : text
}

const SUMMARY_NUMBER = { kind: 'exp', digits: 9 } as const
const SUMMARY_WAVENUMBER = { kind: 'fixed', digits: 6 } as const

function formatBand(band: CatalogueBandSummary): string {
  const fields: string[] = [
    `"id":${JSON.stringify(band.id)}`,
    `"molecule":${JSON.stringify(band.molecule)}`,
    `"moleculeId":${formatNumber(band.moleculeId, INT, 'moleculeId')}`,
    `"isotopologueId":${band.isotopologueId === null ? 'null' : formatNumber(band.isotopologueId, INT, 'isotopologueId')}`,
    `"description":${JSON.stringify(band.description)}`,
    `"lineCount":${formatNumber(band.lineCount, INT, 'lineCount')}`,
    `"minWavenumberCm":${formatNumber(band.minWavenumberCm, SUMMARY_WAVENUMBER, 'minWavenumberCm')}`,
    `"maxWavenumberCm":${formatNumber(band.maxWavenumberCm, SUMMARY_WAVENUMBER, 'maxWavenumberCm')}`,
    `"intensitySumCmPerMolecule":${formatNumber(band.intensitySumCmPerMolecule, SUMMARY_NUMBER, 'intensitySum')}`,
    `"publishedBandIntensityCmPerMolecule":${band.publishedBandIntensityCmPerMolecule === null ? 'null' : formatNumber(band.publishedBandIntensityCmPerMolecule, SUMMARY_NUMBER, 'published')}`,
    `"source":${JSON.stringify(band.source)}`,
    `"confidence":${band.confidence === null ? 'null' : JSON.stringify(band.confidence)}`,
  ]
  return `{${fields.join(',')}}`
}

/**
 * Serialises a built catalogue to the catalogue file text (deterministic).
 *
 * Method: canonical body text (fixed key order, fixed decimals per column), checksum = SHA-256 of
 * the body's UTF-8 bytes, one-line header, then the body; ends with a newline.
 * Notes: rounding: wavenumber 1e-6 cm⁻¹, intensity 10 significant digits (so band sums survive to
 * ~1e-9 relative), Einstein A 7 significant digits, half widths 1e-5 cm⁻¹ atm⁻¹, E″ 1e-4 cm⁻¹,
 * n 1e-3, shift 1e-5 cm⁻¹ atm⁻¹.
 * Source: format of our own design (this module); SHA-256 per FIPS 180-4.
 * @param catalogue built catalogue (lines sorted as by `buildBuiltInCatalogue`)
 * @param options createdFrom text and hash function (default pure-TS SHA-256)
 */
export function serialiseCatalogue(
  catalogue: BuiltInCatalogue,
  options: { createdFrom?: string; hash?: TextHash } = {},
): string {
  const hash = options.hash ?? sha256Hex
  const { lines, lineBandIndex, bands } = catalogue
  if (lineBandIndex.length !== lines.length) {
    throw new PhysicsError('INVALID_ARGUMENT', 'lineBandIndex length differs from lines length')
  }
  const labels: string[] = []
  const labelIndex = new Map<string, number>()
  const indexOf = (label: string | undefined): number => {
    if (label === undefined) return -1
    let index = labelIndex.get(label)
    if (index === undefined) {
      index = labels.length
      labels.push(label)
      labelIndex.set(label, index)
    }
    return index
  }
  const quantaColumns = QUANTA_COLUMNS.map((field) => lines.map((line) => indexOf(line[field])))

  const columnTexts: string[] = []
  columnTexts.push(
    `"bandIndex":[${lineBandIndex
      .map((b, i) => {
        if (b < 0 || b >= bands.length) {
          throw new PhysicsError('INVALID_ARGUMENT', `line ${i}: band index out of range`, { b })
        }
        return formatNumber(b, INT, 'bandIndex')
      })
      .join(',')}]`,
  )
  for (const { field, format } of NUMERIC_COLUMNS) {
    const values = lines.map((line, i) =>
      formatNumber(line[field] ?? 0, format, `line ${i} ${field}`),
    )
    columnTexts.push(`${JSON.stringify(field)}:[${values.join(',')}]`)
  }
  QUANTA_COLUMNS.forEach((field, c) => {
    columnTexts.push(`${JSON.stringify(field)}:[${quantaColumns[c].join(',')}]`)
  })
  const body =
    `{"bands":[\n${bands.map(formatBand).join(',\n')}\n],\n` +
    `"quantaLabels":${JSON.stringify(labels)},\n` +
    `"columns":{\n${columnTexts.join(',\n')}\n}}`
  const header: CatalogueFileHeader = {
    format: CATALOGUE_FORMAT,
    formatVersion: CATALOGUE_FORMAT_VERSION,
    generatorVersion: catalogue.generatorVersion,
    createdFrom: options.createdFrom ?? DEFAULT_CATALOGUE_CREATED_FROM,
    lineCount: lines.length,
    bandCount: bands.length,
    checksum: `sha256:${hash(body)}`,
  }
  return `{"header":${JSON.stringify(header)},\n"body":${body}}\n`
}

const BODY_MARKER = '\n"body":'

function parseError(message: string, details?: Record<string, unknown>): PhysicsError {
  return new PhysicsError('PARSE_ERROR', `catalogue file: ${message}`, details)
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value)
}

function numberArray(columns: Record<string, unknown>, name: string, length: number): number[] {
  const column = columns[name]
  if (!Array.isArray(column) || column.length !== length) {
    throw parseError(`column ${name} missing or not of length ${length}`)
  }
  for (const value of column) {
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      throw parseError(`column ${name} holds a non-numeric value`)
    }
  }
  return column as number[]
}

function parseBand(value: unknown, index: number): CatalogueBandSummary {
  if (!isRecord(value)) throw parseError(`band ${index} is not an object`)
  const text = (key: string) => {
    if (typeof value[key] !== 'string') throw parseError(`band ${index}: ${key} is not a string`)
    return value[key] as string
  }
  const num = (key: string) => {
    if (typeof value[key] !== 'number') throw parseError(`band ${index}: ${key} is not a number`)
    return value[key] as number
  }
  const nullable = <T>(key: string, get: (k: string) => T): T | null =>
    value[key] === null ? null : get(key)
  return {
    id: text('id'),
    molecule: text('molecule'),
    moleculeId: num('moleculeId'),
    isotopologueId: nullable('isotopologueId', num),
    description: text('description'),
    lineCount: num('lineCount'),
    minWavenumberCm: num('minWavenumberCm'),
    maxWavenumberCm: num('maxWavenumberCm'),
    intensitySumCmPerMolecule: num('intensitySumCmPerMolecule'),
    publishedBandIntensityCmPerMolecule: nullable('publishedBandIntensityCmPerMolecule', num),
    source: text('source'),
    confidence: nullable('confidence', text) as ConfidenceTag | null,
  }
}

/**
 * Parses and verifies a catalogue file.
 *
 * Method: JSON-parse the whole text; locate the body text after the header line; recompute its
 * SHA-256 and compare with the header checksum; check format name and version, column lengths,
 * band indices and label indices; rebuild the line records and validate each one.
 * Notes: throws PhysicsError PARSE_ERROR on any mismatch (a modified file fails the checksum),
 * UNSUPPORTED for another format version. Units as in `SpectralLine`.
 * Source: format of our own design (`serialiseCatalogue`).
 * @param text file text
 * @param options hash function (default pure-TS SHA-256)
 */
export function parseCatalogue(text: string, options: { hash?: TextHash } = {}): ParsedCatalogue {
  const hash = options.hash ?? sha256Hex
  let document: unknown
  try {
    document = JSON.parse(text)
  } catch (error) {
    throw parseError('not valid JSON', { reason: String(error) })
  }
  if (!isRecord(document) || !isRecord(document.header) || !isRecord(document.body)) {
    throw parseError('expected an object with "header" and "body"')
  }
  const header = document.header
  if (header.format !== CATALOGUE_FORMAT) {
    throw parseError(`unknown format ${JSON.stringify(header.format)}`)
  }
  if (header.formatVersion !== CATALOGUE_FORMAT_VERSION) {
    throw new PhysicsError('UNSUPPORTED', `catalogue format version ${header.formatVersion}`, {
      formatVersion: header.formatVersion,
    })
  }
  const markerAt = text.indexOf(BODY_MARKER)
  const end = text.lastIndexOf('}')
  if (markerAt < 0 || end <= markerAt) throw parseError('body not found after the header line')
  const bodyText = text.slice(markerAt + BODY_MARKER.length, end)
  const checksum = `sha256:${hash(bodyText)}`
  if (checksum !== header.checksum) {
    throw parseError('checksum mismatch (file modified or corrupted)', {
      expected: header.checksum,
      actual: checksum,
    })
  }
  for (const key of ['generatorVersion', 'createdFrom'] as const) {
    if (typeof header[key] !== 'string') throw parseError(`header ${key} is not a string`)
  }
  const lineCount = header.lineCount
  const bandCount = header.bandCount
  if (typeof lineCount !== 'number' || !Number.isInteger(lineCount) || lineCount < 0) {
    throw parseError('header lineCount is not a non-negative integer')
  }
  const body = document.body
  if (!Array.isArray(body.bands) || body.bands.length !== bandCount) {
    throw parseError('band list missing or not of length bandCount')
  }
  const bands = body.bands.map(parseBand)
  const labels = body.quantaLabels
  if (!Array.isArray(labels) || labels.some((label) => typeof label !== 'string')) {
    throw parseError('quantaLabels is not a list of strings')
  }
  if (!isRecord(body.columns)) throw parseError('columns missing')
  const columns = body.columns
  const bandIndex = numberArray(columns, 'bandIndex', lineCount)
  const numeric = NUMERIC_COLUMNS.map(({ field }) => numberArray(columns, field, lineCount))
  const quanta = QUANTA_COLUMNS.map((field) => numberArray(columns, field, lineCount))
  const lines: SpectralLine[] = []
  for (let i = 0; i < lineCount; i++) {
    if (!Number.isInteger(bandIndex[i]) || bandIndex[i] < 0 || bandIndex[i] >= bands.length) {
      throw parseError(`line ${i}: band index out of range`)
    }
    const line = {} as Record<string, unknown>
    NUMERIC_COLUMNS.forEach(({ field }, c) => {
      line[field] = numeric[c][i]
    })
    if (line.upperStatisticalWeight === 0) delete line.upperStatisticalWeight
    if (line.lowerStatisticalWeight === 0) delete line.lowerStatisticalWeight
    QUANTA_COLUMNS.forEach((field, c) => {
      const index = quanta[c][i]
      if (index === -1) return
      if (!Number.isInteger(index) || index < 0 || index >= labels.length) {
        throw parseError(`line ${i}: ${field} label index out of range`)
      }
      line[field] = labels[index]
    })
    const spectralLine = line as unknown as SpectralLine
    try {
      validateSpectralLine(spectralLine, i)
    } catch (error) {
      throw parseError(`line ${i} invalid: ${(error as Error).message}`)
    }
    lines.push(spectralLine)
  }
  return {
    header: {
      format: CATALOGUE_FORMAT,
      formatVersion: CATALOGUE_FORMAT_VERSION,
      generatorVersion: header.generatorVersion as string,
      createdFrom: header.createdFrom as string,
      lineCount,
      bandCount: bands.length,
      checksum: header.checksum as string,
    },
    lines,
    lineBandIndex: bandIndex.slice(),
    bands,
  }
}
