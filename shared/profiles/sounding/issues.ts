/**
 * Problems found in an uploaded sounding: each names the line of the file (1-based, counting
 * every line including comments and blanks), the column as written in the header, the field,
 * the offending text, and what was expected.
 */
import { PhysicsError } from '../../physics/errors'

export type SoundingIssueCode =
  // the file as a whole
  | 'EMPTY_FILE'
  | 'BINARY_FILE'
  | 'FILE_TOO_LARGE'
  | 'TOO_MANY_ROWS'
  | 'NO_HEADER'
  | 'NO_DELIMITER'
  | 'CELL_COUNT_MISMATCH'
  | 'UNTERMINATED_QUOTE'
  | 'TOO_FEW_ROWS'
  // the column mapping
  | 'MISSING_COLUMN'
  | 'INVALID_MAPPING'
  | 'MISSING_UNIT'
  // values
  | 'NOT_A_NUMBER'
  | 'PRESSURE_NOT_POSITIVE'
  | 'PRESSURE_NOT_DECREASING'
  | 'DUPLICATE_PRESSURE'
  | 'TEMPERATURE_OUT_OF_RANGE'
  | 'HEIGHT_NOT_INCREASING'
  | 'NEGATIVE_HUMIDITY'
  | 'HUMIDITY_TOO_HIGH'
  | 'HUMIDITY_OUT_OF_RANGE'
  | 'NEGATIVE_OZONE'
  | 'OZONE_TOO_HIGH'
  | 'TOO_FEW_LEVELS'
  | 'TOO_MANY_LEVELS'
  | 'EXTENSION_FAILED'
  // warnings
  | 'SUPERSATURATION'
  | 'NO_HUMIDITY'
  | 'NO_OZONE'

/** One problem in an uploaded sounding (errors and warnings share this shape). */
export interface RowError {
  code: SoundingIssueCode
  /** 1-based line number in the file; null when the problem concerns the whole file. */
  lineNumber: number | null
  /** Column name as written in the header; null when no single column is concerned. */
  column: string | null
  /** Level-table field ('pressure', 'temperature', …) or 'file' | 'header' | 'row' | 'levels'. */
  field: string
  /** The offending cell or line text; null when there is none. */
  value: string | null
  /** What was expected instead. */
  expected: string
  /** Full sentence for analysts. */
  message: string
}

/** Errors reported at most per upload; the total is still counted. */
export const MAX_REPORTED_ERRORS = 50

/** Collects issues up to a cap and counts all of them. */
export interface IssueList {
  readonly items: RowError[]
  total: number
  add(issue: RowError): void
}

/** Creates an empty issue list that keeps the first `cap` issues. */
export function createIssueList(cap = MAX_REPORTED_ERRORS): IssueList {
  const list: IssueList = {
    items: [],
    total: 0,
    add(issue) {
      list.total++
      if (list.items.length < cap) list.items.push(issue)
    },
  }
  return list
}

/**
 * Thrown by `parseSoundingText` when a file cannot be read as a sounding. `issues` holds every
 * problem found (up to MAX_REPORTED_ERRORS); `details` carries the same list for API errors.
 */
export class SoundingError extends PhysicsError {
  readonly issues: RowError[]
  readonly issueCount: number

  constructor(issues: RowError[], issueCount = issues.length) {
    const first = issues[0]?.message ?? 'the sounding could not be read'
    const more =
      issueCount > 1 ? ` (and ${issueCount - 1} more problem${issueCount > 2 ? 's' : ''})` : ''
    super('PARSE_ERROR', `${first}${more}`, { issues, issueCount })
    this.name = 'SoundingError'
    this.issues = issues
    this.issueCount = issueCount
  }
}
