import type { ChunkResult } from '../../shared/physics/engine/compute-chunk'
import { DETAIL_FIELDS, type DetailSpectrum } from '../../shared/physics/engine/detail-spectrum'

/**
 * Chunk results are stored with their float arrays as base64 of the raw IEEE-754 bytes, so a
 * stored chunk reads back bit for bit (JSON numbers would too, but at three times the size).
 */
export type StoredChunkResult = Record<string, number | string>

const ARRAY_FIELDS = [
  'fluxUpWPerM2',
  'fluxDownWPerM2',
  'fluxUpBinned',
  'fluxDownBinned',
  'toaNadirRadianceBinned',
  'surfaceZenithRadianceBinned',
  'transmittanceToSpaceBinned',
] as const satisfies readonly (keyof ChunkResult)[]

const SCALAR_FIELDS = ['chunkIndex', 'startCm', 'endCm', 'firstBin', 'binCount', 'gridPointCount'] as const satisfies readonly (keyof ChunkResult)[]

/** Key of a detail-window array in the stored form. */
const detailKey = (field: string) => `detail.${field}`

const encodeArray = (a: Float64Array) => Buffer.from(a.buffer, a.byteOffset, a.byteLength).toString('base64')

function decodeArray(text: string): Float64Array {
  const bytes = Buffer.from(text, 'base64')
  // Copy into a fresh, aligned buffer.
  return new Float64Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength))
}

export function encodeChunkResult(result: ChunkResult): StoredChunkResult {
  const out: StoredChunkResult = {}
  for (const f of SCALAR_FIELDS) out[f] = result[f]
  for (const f of ARRAY_FIELDS) out[f] = encodeArray(result[f])
  if (result.detail) {
    for (const f of DETAIL_FIELDS) out[detailKey(f)] = encodeArray(result.detail[f])
  }
  return out
}

export function decodeChunkResult(stored: StoredChunkResult): ChunkResult {
  const out: Record<string, unknown> = {}
  for (const f of SCALAR_FIELDS) out[f] = stored[f]
  for (const f of ARRAY_FIELDS) out[f] = decodeArray(stored[f] as string)
  if (typeof stored[detailKey('wavenumberCm')] === 'string') {
    const detail: Record<string, Float64Array> = {}
    for (const f of DETAIL_FIELDS) detail[f] = decodeArray(stored[detailKey(f)] as string)
    out.detail = detail as unknown as DetailSpectrum
  }
  return out as unknown as ChunkResult
}
