/**
 * Reading an uploaded sounding text into a header and rows of cells, with the delimiter
 * detected and every problem located by its line number. No units or physics here: see
 * `columns.ts` (which column is what) and `to-levels.ts` (values to levels).
 *
 * Accepted layout: optional comment lines starting with '#', blank lines and decoration lines
 * ('-----', '=====') anywhere; one header line naming the columns; optionally one line of units
 * right below it ('hPa  m  C  %'); then one data row per level. Cells are separated by commas,
 * semicolons, tabs or runs of spaces; double-quoted cells are allowed (RFC 4180).
 */
import {
  DELIMITER_NAMES,
  hasDecimalComma,
  hasDecimalPoint,
  looksNumeric,
  splitLine,
  type SoundingDelimiter,
} from './cells'
import { createIssueList, SoundingError, type RowError } from './issues'
import { quoteText } from '../format'

/**
 * Limits of an uploaded sounding.
 * - maxBytes 2 MiB (UTF-8): a 1-second radiosonde ascent to 35 km with 15 columns is ≈ 1 MB;
 *   the server should enforce the same limit on the raw upload before decoding it.
 * - maxRows 20 000 data rows: more than any ascent (≈ 7 000 s at 1 Hz).
 * - minLevels 3: the fewest levels that make a profile (two layers).
 */
export const SOUNDING_LIMITS = Object.freeze({
  maxBytes: 2 * 1024 * 1024,
  maxRows: 20_000,
  minLevels: 3,
})

/** Options of `parseSoundingText`. */
export interface ParseSoundingOptions {
  /** Default SOUNDING_LIMITS.maxBytes. */
  maxBytes?: number
  /** Default SOUNDING_LIMITS.maxRows. */
  maxRows?: number
  /** Fewest data rows accepted, default SOUNDING_LIMITS.minLevels. */
  minLevels?: number
  /** Use this delimiter instead of detecting one. */
  delimiter?: SoundingDelimiter
}

/** A sounding file split into cells. Line numbers are 1-based and count every line. */
export interface ParsedSounding {
  delimiter: SoundingDelimiter
  /** ',' when numbers are written with a decimal comma ('15,2'; only without comma delimiter). */
  decimalSeparator: '.' | ','
  header: string[]
  headerLineNumber: number
  /** Units written on the line below the header, if there is such a line. */
  unitsRow?: string[]
  unitsLineNumber?: number
  /** Data rows, each with as many cells as the header. */
  rows: string[][]
  /** Line number of each data row. */
  lineNumbers: number[]
  /** Text of the comment lines (after '#'), in order, at most 200 (station notes, dates…). */
  comments: string[]
}

const DETECTION_ORDER: readonly SoundingDelimiter[] = ['tab', 'semicolon', 'comma', 'whitespace']
const SAMPLE_LINES = 50
const MAX_COMMENTS = 200
/** Share of control or undecodable characters above which a file is taken for binary. */
const BINARY_CHARACTER_SHARE = 0.1

const UNIT_WORD =
  /^[([{]?\s*(hpa|pa|kpa|mb|mbar|m|km|gpm|c|°c|degc|deg c|deg|k|°k|%|g\/kg|kg\/kg|ppmv?|ppbv?|mol\/mol|knots?|kts?|m\/s|ms-1|s|sec|hh:mm:ss|-)\s*[)\]}]?$/i

/** UTF-8 length of a string in bytes, without TextEncoder (not available in shared/). */
function utf8ByteLength(text: string, stopAbove: number): number {
  let bytes = 0
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i)
    if (c < 0x80) bytes += 1
    else if (c < 0x800) bytes += 2
    else if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length) {
      bytes += 4
      i++
    } else bytes += 3
    if (bytes > stopAbove) return bytes
  }
  return bytes
}

function isControlOrUndecodable(code: number): boolean {
  return (
    (code < 0x20 && code !== 0x09 && code !== 0x0a && code !== 0x0d) ||
    code === 0x7f ||
    code === 0xfffd
  )
}

function lineNumberAt(text: string, index: number): number {
  let line = 1
  for (let i = 0; i < index; i++) {
    const c = text.charCodeAt(i)
    if (c === 0x0a) line++
    else if (c === 0x0d && text.charCodeAt(i + 1) !== 0x0a) line++
  }
  return line
}

function fileError(
  code: RowError['code'],
  field: string,
  expected: string,
  message: string,
  lineNumber: number | null = null,
  value: string | null = null,
): SoundingError {
  return new SoundingError([{ code, lineNumber, column: null, field, value, expected, message }])
}

type LineKind = 'blank' | 'comment' | 'decoration' | 'content'

function classify(line: string): LineKind {
  const trimmed = line.trim()
  if (trimmed === '') return 'blank'
  if (trimmed.startsWith('#')) return 'comment'
  if (/^[-=_*+|\s]{3,}$/.test(trimmed)) return 'decoration'
  return 'content'
}

function countCells(line: string, delimiter: SoundingDelimiter): number {
  return splitLine(line, delimiter).cells.length
}

/** Picks the delimiter giving the header ≥ 2 cells and the most sample lines of that width. */
function detectDelimiter(header: string, samples: readonly string[]): SoundingDelimiter | null {
  let best: SoundingDelimiter | null = null
  let bestScore = -1
  for (const delimiter of DETECTION_ORDER) {
    const width = countCells(header, delimiter)
    if (width < 2) continue
    let score = 0
    for (const line of samples) if (countCells(line, delimiter) === width) score++
    if (score > bestScore) {
      best = delimiter
      bestScore = score
    }
  }
  return best
}

function looksLikeUnitsRow(cells: readonly string[]): boolean {
  if (cells.some((c) => looksNumeric(c))) return false
  const unitLike = cells.filter((c) => UNIT_WORD.test(c.trim())).length
  return unitLike * 2 >= cells.length
}

/**
 * Splits a sounding text into header and rows, detecting the delimiter.
 *
 * Rejects, with a SoundingError listing every problem found (each with its line number): an
 * empty file; binary content (a NUL character, or more than 10 % control or undecodable
 * characters); a file above `maxBytes`; a first content line that is all numbers (no header);
 * a header without a recognisable delimiter; rows whose cell count differs from the header's
 * (each row named, with a hint when the row uses another delimiter); unterminated quotes; more
 * than `maxRows` data rows; fewer than `minLevels` data rows.
 *
 * Delimiter detection: among tab, semicolon, comma and runs of spaces (preferred in that order
 * when equally good), the one that splits the header into at least 2 cells and the most of the
 * first 50 data lines into the same number of cells. With a non-comma delimiter, a decimal comma
 * is recognised when numbers are written '15,2' and never '15.2'.
 *
 * @param text the decoded file (UTF-8); a leading byte-order mark is ignored
 * @param options limits and an optional forced delimiter
 * @returns header, rows of trimmed cells and the line number of each row
 */
export function parseSoundingText(
  text: string,
  options: ParseSoundingOptions = {},
): ParsedSounding {
  const maxBytes = options.maxBytes ?? SOUNDING_LIMITS.maxBytes
  const maxRows = options.maxRows ?? SOUNDING_LIMITS.maxRows
  const minLevels = options.minLevels ?? SOUNDING_LIMITS.minLevels

  const bytes = text.length > maxBytes ? text.length : utf8ByteLength(text, maxBytes)
  if (bytes > maxBytes) {
    throw fileError(
      'FILE_TOO_LARGE',
      'file',
      `a file of at most ${maxBytes} bytes`,
      `The file is larger than ${formatBytes(maxBytes)} (at least ${bytes} bytes); ` +
        'upload at most ' +
        formatBytes(maxBytes) +
        ', e.g. by thinning the sounding.',
    )
  }
  if (text.trim() === '') {
    throw fileError('EMPTY_FILE', 'file', 'a header line and data rows', 'The file is empty.')
  }
  const nul = text.indexOf('\u0000')
  if (nul >= 0) {
    const line = lineNumberAt(text, nul)
    throw fileError(
      'BINARY_FILE',
      'file',
      'a text file (CSV or space-separated columns)',
      `Line ${line}: the file contains a NUL byte, so it is binary, not text; ` +
        'expected a text file (CSV or space-separated columns).',
      line,
    )
  }
  let bad = 0
  let firstBad = -1
  for (let i = 0; i < text.length; i++) {
    if (isControlOrUndecodable(text.charCodeAt(i))) {
      bad++
      if (firstBad < 0) firstBad = i
    }
  }
  if (bad > BINARY_CHARACTER_SHARE * text.length) {
    const line = lineNumberAt(text, firstBad)
    throw fileError(
      'BINARY_FILE',
      'file',
      'a text file (CSV or space-separated columns)',
      `The file looks binary: ${Math.round((100 * bad) / text.length)} % of its characters are ` +
        `control or undecodable characters (first on line ${line}); expected a UTF-8 text file.`,
      line,
    )
  }

  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text
  const lines = body.split(/\r\n|\n|\r/)
  const comments: string[] = []
  const content: { line: string; lineNumber: number }[] = []
  for (let i = 0; i < lines.length; i++) {
    const kind = classify(lines[i])
    if (kind === 'comment') {
      if (comments.length < MAX_COMMENTS) comments.push(lines[i].trim().replace(/^#+\s?/, ''))
    } else if (kind === 'content') {
      content.push({ line: lines[i], lineNumber: i + 1 })
      // header + units row + maxRows data rows + one to detect the overflow
      if (content.length > maxRows + 2) break
    }
  }
  if (content.length === 0) {
    throw fileError(
      'EMPTY_FILE',
      'file',
      'a header line and data rows',
      'The file has no data: it contains only comments or blank lines.',
    )
  }

  const headerLine = content[0]
  const samples = content.slice(1, 1 + SAMPLE_LINES).map((c) => c.line)
  const delimiter = options.delimiter ?? detectDelimiter(headerLine.line, samples)
  if (!delimiter) {
    throw fileError(
      'NO_DELIMITER',
      'header',
      'column names separated by commas, semicolons, tabs or spaces',
      `Line ${headerLine.lineNumber}: could not find how the columns are separated: the header ` +
        `${quoteText(headerLine.line.trim())} is a single column; expected column names ` +
        'separated by commas, semicolons, tabs or spaces.',
      headerLine.lineNumber,
      headerLine.line,
    )
  }
  const headerSplit = splitLine(headerLine.line, delimiter)
  const header = headerSplit.cells
  if (headerSplit.unterminatedQuote) {
    throw fileError(
      'UNTERMINATED_QUOTE',
      'header',
      'a closing double quote',
      `Line ${headerLine.lineNumber}: a quoted column name is not closed; expected a closing '"'.`,
      headerLine.lineNumber,
      headerLine.line,
    )
  }
  if (header.every((cell) => looksNumeric(cell))) {
    throw fileError(
      'NO_HEADER',
      'header',
      'a header line naming the columns, e.g. pressure, temperature, dewpoint',
      `Line ${headerLine.lineNumber}: expected a header line naming the columns ` +
        '(e.g. pressure, temperature, dewpoint) before the data, found only numbers.',
      headerLine.lineNumber,
      headerLine.line,
    )
  }
  if (header.length < 2) {
    throw fileError(
      'NO_DELIMITER',
      'header',
      'at least two columns',
      `Line ${headerLine.lineNumber}: the header has a single column when split by ` +
        `${DELIMITER_NAMES[delimiter]}; expected at least pressure and temperature columns.`,
      headerLine.lineNumber,
      headerLine.line,
    )
  }

  const issues = createIssueList()
  const rows: string[][] = []
  const lineNumbers: number[] = []
  let unitsRow: string[] | undefined
  let unitsLineNumber: number | undefined
  const width = header.length
  for (let k = 1; k < content.length; k++) {
    const { line, lineNumber } = content[k]
    const split = splitLine(line, delimiter)
    if (split.unterminatedQuote) {
      issues.add({
        code: 'UNTERMINATED_QUOTE',
        lineNumber,
        column: null,
        field: 'row',
        value: line,
        expected: 'a closing double quote',
        message: `Line ${lineNumber}: a quoted cell is not closed; expected a closing '"'.`,
      })
      continue
    }
    if (k === 1 && split.cells.length === width && looksLikeUnitsRow(split.cells)) {
      unitsRow = split.cells
      unitsLineNumber = lineNumber
      continue
    }
    if (rows.length >= maxRows) {
      issues.add({
        code: 'TOO_MANY_ROWS',
        lineNumber,
        column: null,
        field: 'file',
        value: null,
        expected: `at most ${maxRows} data rows`,
        message:
          `Line ${lineNumber}: the file has more than ${maxRows} data rows; ` +
          `expected at most ${maxRows} — thin the sounding before uploading.`,
      })
      break
    }
    if (split.cells.length !== width) {
      const other = DETECTION_ORDER.find((d) => d !== delimiter && countCells(line, d) === width)
      const hint = other ? ` This line seems to be separated by ${DELIMITER_NAMES[other]}.` : ''
      issues.add({
        code: 'CELL_COUNT_MISMATCH',
        lineNumber,
        column: null,
        field: 'row',
        value: line,
        expected: `${width} cells separated by ${DELIMITER_NAMES[delimiter]}`,
        message:
          `Line ${lineNumber}: found ${split.cells.length} cell${split.cells.length === 1 ? '' : 's'} ` +
          `but the header (line ${headerLine.lineNumber}) has ${width} columns separated by ` +
          `${DELIMITER_NAMES[delimiter]}.${hint}`,
      })
      continue
    }
    rows.push(split.cells)
    lineNumbers.push(lineNumber)
  }
  if (issues.total > 0) throw new SoundingError(issues.items, issues.total)
  if (rows.length < minLevels) {
    const last = content[content.length - 1].lineNumber
    throw fileError(
      'TOO_FEW_ROWS',
      'file',
      `at least ${minLevels} data rows`,
      `The file has ${rows.length} data row${rows.length === 1 ? '' : 's'} after the header ` +
        `(line ${headerLine.lineNumber}); at least ${minLevels} levels are needed.`,
      last,
    )
  }

  let decimalSeparator: '.' | ',' = '.'
  if (delimiter !== 'comma') {
    let commaDecimals = 0
    let pointDecimals = 0
    for (const row of rows) {
      for (const cell of row) {
        if (hasDecimalComma(cell)) commaDecimals++
        else if (hasDecimalPoint(cell)) pointDecimals++
      }
    }
    if (commaDecimals > 0 && pointDecimals === 0) decimalSeparator = ','
  }

  return {
    delimiter,
    decimalSeparator,
    header,
    headerLineNumber: headerLine.lineNumber,
    ...(unitsRow ? { unitsRow, unitsLineNumber } : {}),
    rows,
    lineNumbers,
    comments,
  }
}

function formatBytes(bytes: number): string {
  if (bytes >= 1024 * 1024 && bytes % (1024 * 1024) === 0) return `${bytes / (1024 * 1024)} MiB`
  if (bytes >= 1024 && bytes % 1024 === 0) return `${bytes / 1024} KiB`
  return `${bytes} bytes`
}
