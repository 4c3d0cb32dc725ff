/**
 * Streams a line-list file (160-character records, one per line) from disk: every record is
 * parsed and checked, the running summary updated, and the first IMPORT_ERRORS_LISTED problems
 * kept with their line number and field. Memory stays bounded whatever the file size: one line
 * at a time, the summary, the listed errors, and whatever the caller's `onLine` keeps.
 */
import { createHash } from 'node:crypto'
import { createReadStream } from 'node:fs'
import { createInterface } from 'node:readline'
import { Transform, type TransformCallback } from 'node:stream'
import { PhysicsError } from '../../../shared/physics/errors'
import {
  LINE_RECORD_LENGTH,
  parseLineRecord,
  type LineRecordError,
} from '../../../shared/physics/spectroscopy/line-record-parser'
import type { SpectralLine } from '../../../shared/physics/spectroscopy/line'
import {
  IMPORT_ERRORS_BEFORE_STOP,
  IMPORT_ERRORS_LISTED,
  type LineListError,
  type LineListSummary,
} from '../../../shared/schemas/catalogues'
import { LineListSummaryBuilder } from './line-list-summary'

/** A line longer than this (bytes, before its line break) stops the reading: not a line list. */
export const MAX_LINE_BYTES = 4096

export interface LineListScan {
  summary: LineListSummary
  /** The first IMPORT_ERRORS_LISTED problems in file order. */
  errors: LineListError[]
  errorCount: number
  /** Non-blank lines read. */
  recordCount: number
  /** True when reading stopped before the end of the file (too many errors, an overlong line, or stopAtFirstError). */
  stoppedEarly: boolean
  /** SHA-256 (hex) and size of the bytes read; the whole file unless stoppedEarly. */
  fileSha256: string
  byteSize: number
}

export interface ScanOptions {
  /** Called with every good record in file order; awaited when it returns a promise. */
  onLine?: (line: SpectralLine, lineNumber: number) => void | Promise<void>
  /** Stop at the first bad record (a commit needs the whole file good anyway). */
  stopAtFirstError?: boolean
}

class LineTooLongError extends Error {
  constructor(readonly lineNumber: number) {
    super(`line ${lineNumber} is longer than ${MAX_LINE_BYTES} bytes`)
  }
}

/** Passes bytes through while hashing and counting them, and refuses overlong lines. */
function hashingGuard() {
  const hash = createHash('sha256')
  let byteSize = 0
  let sinceBreak = 0
  let breaks = 0
  const stream = new Transform({
    transform(chunk: Buffer, _encoding, callback: TransformCallback) {
      hash.update(chunk)
      byteSize += chunk.length
      let pos = 0
      for (;;) {
        const nl = chunk.indexOf(10, pos)
        const segment = (nl === -1 ? chunk.length : nl) - pos
        if (sinceBreak + segment > MAX_LINE_BYTES) return callback(new LineTooLongError(breaks + 1))
        if (nl === -1) {
          sinceBreak += segment
          break
        }
        sinceBreak = 0
        breaks++
        pos = nl + 1
      }
      callback(null, chunk)
    },
  })
  return { stream, digest: () => hash.digest('hex'), byteSize: () => byteSize }
}

function toListed(e: LineRecordError): LineListError {
  return {
    lineNumber: e.lineNumber,
    field: e.field,
    columnRange: [e.columnRange[0], e.columnRange[1]],
    value: e.value,
    expected: e.expected,
  }
}

/** One problem in words: where (line, columns, field) and what was expected instead. */
export function describeLineListError(e: LineListError): string {
  const where = `line ${e.lineNumber}, columns ${e.columnRange[0]}–${e.columnRange[1]} (${e.field})`
  return e.field === 'record'
    ? `${where}: expected ${e.expected}`
    : `${where}: expected ${e.expected}, got '${e.value}'`
}

/** Reads a line-list file once from start to end (see the module comment). */
export async function scanLineList(path: string, options: ScanOptions = {}): Promise<LineListScan> {
  const file = createReadStream(path, { highWaterMark: 256 * 1024 })
  const guard = hashingGuard()
  file.on('error', (err) => guard.stream.destroy(err))
  const input = file.pipe(guard.stream)
  const lines = createInterface({ input, crlfDelay: Infinity })
  const builder = new LineListSummaryBuilder()
  const errors: LineListError[] = []
  let errorCount = 0
  let recordCount = 0
  let lineNumber = 0
  let stoppedEarly = false

  const note = (recordErrors: readonly LineRecordError[]) => {
    for (const e of recordErrors) if (errors.length < IMPORT_ERRORS_LISTED) errors.push(toListed(e))
    errorCount += recordErrors.length
  }

  try {
    for await (const raw of lines) {
      lineNumber++
      const text = lineNumber === 1 && raw.charCodeAt(0) === 0xfeff ? raw.slice(1) : raw
      if (text.trim() === '') {
        builder.addBlankLine()
        continue
      }
      recordCount++
      let line: SpectralLine
      try {
        line = parseLineRecord(text, lineNumber)
      } catch (err) {
        if (!(err instanceof PhysicsError) || err.code !== 'PARSE_ERROR') throw err
        note((err.details?.errors as LineRecordError[] | undefined) ?? [])
        if (options.stopAtFirstError || errorCount >= IMPORT_ERRORS_BEFORE_STOP) {
          stoppedEarly = true
          break
        }
        continue
      }
      builder.add(line)
      if (options.onLine) {
        const pending = options.onLine(line, lineNumber)
        if (pending) await pending
      }
    }
  } catch (err) {
    if (!(err instanceof LineTooLongError)) throw err
    note([
      {
        lineNumber: err.lineNumber,
        field: 'record',
        columnRange: [1, MAX_LINE_BYTES],
        value: '',
        expected: `${LINE_RECORD_LENGTH} characters per line; this line runs past ${MAX_LINE_BYTES} bytes without a line break (is it a line list?)`,
      },
    ])
    stoppedEarly = true
  } finally {
    lines.close()
    file.destroy()
  }
  const byteSize = guard.byteSize()
  return {
    summary: builder.summary(),
    errors,
    errorCount,
    recordCount,
    stoppedEarly,
    fileSha256: guard.digest(),
    byteSize,
  }
}
