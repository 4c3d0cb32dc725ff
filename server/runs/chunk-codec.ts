import type { ChunkResult } from '../../shared/physics/engine/compute-chunk'

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

export function encodeChunkResult(result: ChunkResult): StoredChunkResult {
  const out: StoredChunkResult = {}
  for (const f of SCALAR_FIELDS) out[f] = result[f]
  for (const f of ARRAY_FIELDS) {
    const a = result[f]
    out[f] = Buffer.from(a.buffer, a.byteOffset, a.byteLength).toString('base64')
  }
  return out
}

export function decodeChunkResult(stored: StoredChunkResult): ChunkResult {
  const out: Record<string, unknown> = {}
  for (const f of SCALAR_FIELDS) out[f] = stored[f]
  for (const f of ARRAY_FIELDS) {
    const bytes = Buffer.from(stored[f] as string, 'base64')
    // Copy into a fresh, aligned buffer.
    out[f] = new Float64Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength))
  }
  return out as unknown as ChunkResult
}
