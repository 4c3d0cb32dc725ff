/**
 * Cells of a delimited text line: splitting (with double-quoted fields), missing-value markers
 * and strict number parsing.
 */

/** How the cells of a line are separated. */
export type SoundingDelimiter = 'comma' | 'semicolon' | 'tab' | 'whitespace'

/** Names of the delimiters for messages. */
export const DELIMITER_NAMES: Record<SoundingDelimiter, string> = {
  comma: 'commas',
  semicolon: 'semicolons',
  tab: 'tabs',
  whitespace: 'spaces',
}

const DELIMITER_CHARS: Record<Exclude<SoundingDelimiter, 'whitespace'>, string> = {
  comma: ',',
  semicolon: ';',
  tab: '\t',
}

/** Cells of one line, or `unterminatedQuote` when a quoted field is not closed. */
export interface SplitLine {
  cells: string[]
  unterminatedQuote: boolean
}

/**
 * Splits one line into trimmed cells. Fields may be enclosed in double quotes, with "" for a
 * literal quote (RFC 4180). With 'whitespace', any run of spaces and tabs separates cells and
 * leading/trailing blanks are ignored.
 */
export function splitLine(line: string, delimiter: SoundingDelimiter): SplitLine {
  const cells: string[] = []
  const isSeparator =
    delimiter === 'whitespace'
      ? (c: string) => c === ' ' || c === '\t'
      : (c: string) => c === DELIMITER_CHARS[delimiter]
  const text = delimiter === 'whitespace' ? line.trim() : line
  let i = 0
  const n = text.length
  if (n === 0) return { cells: [''], unterminatedQuote: false }
  for (;;) {
    // skip blanks before a field (quoted fields may be indented)
    let j = i
    while (j < n && (text[j] === ' ' || (text[j] === '\t' && delimiter !== 'tab'))) j++
    let cell = ''
    if (text[j] === '"') {
      j++
      let closed = false
      while (j < n) {
        if (text[j] === '"') {
          if (text[j + 1] === '"') {
            cell += '"'
            j += 2
            continue
          }
          closed = true
          j++
          break
        }
        cell += text[j]
        j++
      }
      if (!closed) return { cells: [...cells, cell], unterminatedQuote: true }
      // anything between the closing quote and the separator is kept (trimmed)
      while (j < n && !isSeparator(text[j])) cell += text[j++]
      cells.push(cell.trim())
    } else {
      const start = i
      while (j < n && !isSeparator(text[j])) j++
      cells.push(text.slice(start, j).trim())
    }
    if (j >= n) break
    // consume the separator (a run of blanks for whitespace)
    j++
    if (delimiter === 'whitespace') while (j < n && isSeparator(text[j])) j++
    i = j
    if (i >= n) {
      if (delimiter !== 'whitespace') cells.push('')
      break
    }
  }
  return { cells, unterminatedQuote: false }
}

/**
 * Missing-value markers common in sounding files (case-insensitive): empty cells, NA, N/A,
 * NaN, null, none, missing, M, runs of slashes ('////'), runs of dashes ('-', '---'), and the
 * sentinel numbers −9999, −999, −99999, −9999.9 and −999.9 (common practice of radiosonde
 * archives; no atmospheric quantity takes these values). Positive sentinels such as 99999 are
 * NOT treated as missing: 99999 Pa is a valid surface pressure.
 */
export const MISSING_VALUE_MARKERS: readonly string[] = [
  '',
  'na',
  'n/a',
  'nan',
  'null',
  'none',
  'missing',
  'm',
  '-9999',
  '-999',
  '-99999',
  '-9999.9',
  '-999.9',
]

const NUMBER_PATTERN = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/
const COMMA_DECIMAL_PATTERN = /^[+-]?(?:\d+,\d*|,\d+)(?:[eE][+-]?\d+)?$/

/** The value of a cell: a number, a missing-value marker, or text that is neither. */
export type CellValue =
  { kind: 'number'; value: number } | { kind: 'missing' } | { kind: 'invalid' }

/** True when a cell is a missing-value marker (see MISSING_VALUE_MARKERS). */
export function isMissingCell(cell: string, extraMarkers: readonly string[] = []): boolean {
  const text = cell.trim().toLowerCase()
  if (/^\/+$/.test(text) || /^-+$/.test(text)) return true
  if (MISSING_VALUE_MARKERS.includes(text)) return true
  if (extraMarkers.some((m) => m.trim().toLowerCase() === text)) return true
  // numeric sentinels written with extra zeros, e.g. -9999.00
  if (NUMBER_PATTERN.test(text) || COMMA_DECIMAL_PATTERN.test(text)) {
    const v = Number(text.replace(',', '.'))
    return v === -9999 || v === -999 || v === -99999 || v === -9999.9 || v === -999.9
  }
  return false
}

/**
 * Reads a cell strictly: a decimal number (optionally with exponent), a missing-value marker, or
 * invalid. With decimalSeparator ',' a single comma is read as the decimal point ('15,2' → 15.2).
 * Thousands separators, units and trailing text are invalid ('1,013.2', '15 C').
 */
export function readCell(
  cell: string,
  decimalSeparator: '.' | ',' = '.',
  extraMarkers: readonly string[] = [],
): CellValue {
  const text = cell.trim()
  if (isMissingCell(text, extraMarkers)) return { kind: 'missing' }
  if (NUMBER_PATTERN.test(text)) return { kind: 'number', value: Number(text) }
  if (decimalSeparator === ',' && COMMA_DECIMAL_PATTERN.test(text)) {
    return { kind: 'number', value: Number(text.replace(',', '.')) }
  }
  return { kind: 'invalid' }
}

/** True for a cell that reads as a number with either decimal separator. */
export function looksNumeric(cell: string): boolean {
  const text = cell.trim()
  return NUMBER_PATTERN.test(text) || COMMA_DECIMAL_PATTERN.test(text)
}

/** True for a number written with a decimal comma ('15,2'), false for '15.2' or '15'. */
export function hasDecimalComma(cell: string): boolean {
  return COMMA_DECIMAL_PATTERN.test(cell.trim())
}

/** True for a number written with a decimal point ('15.2'). */
export function hasDecimalPoint(cell: string): boolean {
  const text = cell.trim()
  return NUMBER_PATTERN.test(text) && text.includes('.')
}
