/**
 * Binary blocks of spectral lines, the storage unit of imported catalogues (table
 * catalogue_line_blocks). One block holds up to BLOCK_LINE_CAPACITY lines as struct-of-arrays
 * columns, so a reader copies whole columns with one memcpy each instead of parsing numbers.
 *
 * Layout (little-endian, byte offsets):
 *   0   4 bytes  magic 'TLB1'
 *   4   uint32   line count n
 *   8   uint32   column count (10)
 *   12  uint32   reserved (0)
 *   16  8 Float64 columns of n values, in FLOAT_COLUMNS order (8-byte aligned)
 *   …   2 Int32 columns of n values, in INT_COLUMNS order
 * Size: 16 + 72 n bytes (3.6 MB for 50 000 lines). Quantum labels, uncertainty and reference
 * indices and statistical weights are not stored: the engine does not use them, and the import
 * summary keeps what the catalogue page shows about them.
 */
import { LINE_FLOAT_COLUMNS, type LineTable, type SpectralLine } from '../../shared/physics/spectroscopy/line'

/** Lines per stored block. */
export const BLOCK_LINE_CAPACITY = 50_000

/** Float columns in stored order (the line table's own column order). */
export const FLOAT_COLUMNS = LINE_FLOAT_COLUMNS
export const INT_COLUMNS = ['moleculeId', 'isotopologueId'] as const

type FloatColumn = (typeof FLOAT_COLUMNS)[number]
type IntColumn = (typeof INT_COLUMNS)[number]

const MAGIC = 0x31424c54 // 'TLB1' read as a little-endian uint32
const HEADER_BYTES = 16
const BYTES_PER_LINE = FLOAT_COLUMNS.length * 8 + INT_COLUMNS.length * 4

// Typed arrays use the machine's byte order; the stored format is little-endian.
if (new Uint8Array(new Uint16Array([1]).buffer)[0] !== 1) {
  throw new Error('line blocks need a little-endian machine')
}

/** Size in bytes of a block of n lines. */
export function blockByteLength(lineCount: number): number {
  return HEADER_BYTES + BYTES_PER_LINE * lineCount
}

/** One encoded block and what the block table records about it. */
export interface EncodedBlock {
  lineCount: number
  minWavenumberCm: number
  maxWavenumberCm: number
  data: Buffer
}

/** Collects lines into one block; `finish()` returns the encoded bytes. */
export class LineBlockBuilder {
  private readonly floats: Record<FloatColumn, Float64Array>
  private readonly ints: Record<IntColumn, Int32Array>
  private count = 0
  private minCm = Infinity
  private maxCm = -Infinity

  constructor(readonly capacity = BLOCK_LINE_CAPACITY) {
    this.floats = Object.fromEntries(
      FLOAT_COLUMNS.map((c) => [c, new Float64Array(capacity)]),
    ) as Record<FloatColumn, Float64Array>
    this.ints = Object.fromEntries(INT_COLUMNS.map((c) => [c, new Int32Array(capacity)])) as Record<
      IntColumn,
      Int32Array
    >
  }

  get length(): number {
    return this.count
  }

  get full(): boolean {
    return this.count === this.capacity
  }

  add(line: SpectralLine): void {
    if (this.count === this.capacity) throw new Error('line block is full')
    const i = this.count++
    for (const c of FLOAT_COLUMNS) this.floats[c][i] = line[c]
    for (const c of INT_COLUMNS) this.ints[c][i] = line[c]
    if (line.wavenumberCm < this.minCm) this.minCm = line.wavenumberCm
    if (line.wavenumberCm > this.maxCm) this.maxCm = line.wavenumberCm
  }

  /** The encoded block of the lines added so far; the builder is empty afterwards. */
  finish(): EncodedBlock {
    const n = this.count
    const data = Buffer.alloc(blockByteLength(n))
    data.writeUInt32LE(MAGIC, 0)
    data.writeUInt32LE(n, 4)
    data.writeUInt32LE(FLOAT_COLUMNS.length + INT_COLUMNS.length, 8)
    let offset = HEADER_BYTES
    for (const c of FLOAT_COLUMNS) {
      data.set(new Uint8Array(this.floats[c].buffer, 0, n * 8), offset)
      offset += n * 8
    }
    for (const c of INT_COLUMNS) {
      data.set(new Uint8Array(this.ints[c].buffer, 0, n * 4), offset)
      offset += n * 4
    }
    const block = { lineCount: n, minWavenumberCm: this.minCm, maxWavenumberCm: this.maxCm, data }
    this.count = 0
    this.minCm = Infinity
    this.maxCm = -Infinity
    return block
  }
}

/** Reads and checks a block header; returns its line count. */
export function blockLineCount(data: Uint8Array): number {
  if (data.byteLength < HEADER_BYTES) throw new Error('line block shorter than its header')
  const view = new DataView(data.buffer, data.byteOffset, data.byteLength)
  if (view.getUint32(0, true) !== MAGIC) throw new Error('not a line block (bad magic)')
  const n = view.getUint32(4, true)
  if (view.getUint32(8, true) !== FLOAT_COLUMNS.length + INT_COLUMNS.length)
    throw new Error('line block has an unknown column count')
  if (data.byteLength !== blockByteLength(n))
    throw new Error(
      `line block of ${n} lines has ${data.byteLength} bytes, expected ${blockByteLength(n)}`,
    )
  return n
}

/**
 * Copies a block's columns into `table` from row `row` on (the table needs room for them).
 * Returns the number of lines copied. Columns are copied byte for byte, so the values are the
 * stored ones exactly.
 */
export function decodeBlockInto(data: Uint8Array, table: LineTable, row: number): number {
  const n = blockLineCount(data)
  let offset = HEADER_BYTES
  for (const c of FLOAT_COLUMNS) {
    new Uint8Array(table[c].buffer, table[c].byteOffset + row * 8, n * 8).set(
      data.subarray(offset, offset + n * 8),
    )
    offset += n * 8
  }
  for (const c of INT_COLUMNS) {
    new Uint8Array(table[c].buffer, table[c].byteOffset + row * 4, n * 4).set(
      data.subarray(offset, offset + n * 4),
    )
    offset += n * 4
  }
  for (let i = 0; i < n; i++) table.sourceIndex[row + i] = row + i
  return n
}
