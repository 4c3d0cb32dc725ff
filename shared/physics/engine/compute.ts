/**
 * A whole line-by-line calculation in one call: prepare, every chunk in order, merge. The run
 * queue does the same with chunks spread over workers; this is the single-thread path used by
 * the command line, the browser and the tests.
 */
import type { LineTable } from '../spectroscopy/line'
import type { AtmosphereProfile } from '../types'
import { radiativeForcing, type ForcingResult } from '../diagnostics/forcing'
import { computeChunk, type ChunkResult } from './compute-chunk'
import { mergeChunkResults, type RadiationResult } from './merge'
import { prepareComputation } from './prepare'
import type { ComputeSettings } from './settings'

export interface ComputeProgress {
  chunksDone: number
  chunkCount: number
}

export function computeRadiation(
  profile: AtmosphereProfile,
  lines: LineTable,
  settings: Partial<ComputeSettings> = {},
  onProgress?: (p: ComputeProgress) => void,
): RadiationResult {
  const prepared = prepareComputation(profile, lines, settings)
  const results: ChunkResult[] = []
  for (const chunk of prepared.chunks) {
    results.push(computeChunk(prepared, chunk))
    onProgress?.({ chunksDone: results.length, chunkCount: prepared.chunks.length })
  }
  return mergeChunkResults(prepared, results)
}

export interface ForcingComparison extends ForcingResult {
  /** Spectral forcing at the top (reduction of spectral OLR), W m⁻² (cm⁻¹)⁻¹ per bin. */
  toaSpectral: Float64Array
  /** Spectral forcing at the tropopause level (reduction of net upward spectral flux). */
  tropopauseSpectral: Float64Array
  /** Spectral forcing at the surface (reduction of net upward spectral flux). */
  surfaceSpectral: Float64Array
  tropopauseLevelIndex: number
}

/**
 * Instantaneous forcing between two runs on the same levels and bins: the reduction of net upward
 * flux from `before` to `after` at the top, the tropopause of `before`, and the surface.
 */
export function compareRuns(before: RadiationResult, after: RadiationResult): ForcingComparison {
  const t = before.tropopause.levelIndex
  const forcing = radiativeForcing(before.fluxNetUpWPerM2, after.fluxNetUpWPerM2, t)
  const nLevels = before.levelPressurePa.length
  const nBins = before.wavenumberCm.length
  const spectralAt = (level: number) => {
    const out = new Float64Array(nBins)
    for (let b = 0; b < nBins; b++) {
      const i = b * nLevels + level
      const netBefore = before.fluxUpBinned[i] - before.fluxDownBinned[i]
      const netAfter = after.fluxUpBinned[i] - after.fluxDownBinned[i]
      out[b] = netBefore - netAfter
    }
    return out
  }
  return {
    ...forcing,
    toaSpectral: spectralAt(nLevels - 1),
    tropopauseSpectral: spectralAt(t),
    surfaceSpectral: spectralAt(0),
    tropopauseLevelIndex: t,
  }
}
