/**
 * One spectral chunk of a run: optical depths of every layer (Beer–Lambert, line by line), the
 * Schwarzschild solution through the layers, and the chunk's share of every output — fluxes
 * integrated over the chunk and spectra averaged into output bins.
 *
 * A chunk depends only on the prepared inputs and its bounds, so it gives bit-identical numbers
 * on any thread or machine; band fluxes of a run are sums of chunk fluxes in chunk order.
 */
import { computeChunkOpticalDepth } from '../optics/optical-depth'
import { solveSchwarzschild } from '../transfer/schwarzschild'
import { trapezoidWeightsCm } from '../transfer/spectral-integration'
import type { ChunkBounds, PreparedComputation } from './prepare'

export interface ChunkResult {
  chunkIndex: number
  startCm: number
  endCm: number
  firstBin: number
  binCount: number
  /** Number of spectral grid points the chunk was solved on. */
  gridPointCount: number
  /** Upward, downward flux integrated over the chunk at each level, W m⁻². */
  fluxUpWPerM2: Float64Array
  fluxDownWPerM2: Float64Array
  /** Bin-mean upward and downward spectral flux at every level, W m⁻² (cm⁻¹)⁻¹, [bin·nLevels + level]. */
  fluxUpBinned: Float64Array
  fluxDownBinned: Float64Array
  /** Bin-mean nadir radiance at the top, W m⁻² sr⁻¹ (cm⁻¹)⁻¹, per bin. */
  toaNadirRadianceBinned: Float64Array
  /** Bin-mean zenith radiance at the surface, W m⁻² sr⁻¹ (cm⁻¹)⁻¹, per bin. */
  surfaceZenithRadianceBinned: Float64Array
  /** Bin-mean vertical transmittance from each level to space, [bin·nLevels + level]. */
  transmittanceToSpaceBinned: Float64Array
}

/** Computes one chunk. Pure and deterministic. */
export function computeChunk(prepared: PreparedComputation, chunk: ChunkBounds): ChunkResult {
  const { settings, layers, levelTemperatureK, profile } = prepared
  const nLevels = levelTemperatureK.length
  const nLayers = nLevels - 1

  const optics = computeChunkOpticalDepth({
    lines: prepared.lines,
    layers,
    startCm: chunk.startCm,
    endCm: chunk.endCm,
    options: {
      wingCutoffCm: settings.wingCutoffCm,
      pointsPerHalfWidth: settings.pointsPerHalfWidth,
    },
  })
  const grid = optics.wavenumberCm
  const nGrid = grid.length
  const weights = new Float64Array(nGrid)
  trapezoidWeightsCm(grid, weights)

  const solution = solveSchwarzschild({
    wavenumberCm: grid,
    layerOpticalDepth: optics.opticalDepth,
    levelTemperatureK,
    surfaceTemperatureK: profile.surfaceTemperatureK,
    surfaceEmissivity: profile.surfaceEmissivity,
    quadrature: prepared.quadrature,
    layerSource: settings.layerSource,
    integrationWeightsCm: weights,
    viewingMu: [1],
  })

  const binCount = chunk.binCount
  const fluxUpBinned = new Float64Array(binCount * nLevels)
  const fluxDownBinned = new Float64Array(binCount * nLevels)
  const transmittanceToSpaceBinned = new Float64Array(binCount * nLevels)
  const toaNadirRadianceBinned = new Float64Array(binCount)
  const surfaceZenithRadianceBinned = new Float64Array(binCount)
  const binWeight = new Float64Array(binCount)
  const transmittance = new Float64Array(nLevels)

  const binWidth = settings.outputResolutionCm
  for (let i = 0; i < nGrid; i++) {
    // Trapezoid rule per bin: a point on a bin edge belongs half to each neighbouring bin.
    const position = (grid[i] - chunk.startCm) / binWidth
    const nearest = Math.round(position)
    const onEdge = Math.abs(position - nearest) < 1e-9
    // An interior edge point is shared by two bins; a chunk's end point belongs to its one bin.
    const shared = onEdge && nearest > 0 && nearest < binCount
    const firstBin = shared ? nearest - 1 : onEdge ? Math.min(nearest, binCount - 1) : Math.floor(position)
    const partCount = shared ? 2 : 1
    const share = shared ? 0.5 : 1
    // Vertical transmittance from each level to space.
    let tau = 0
    transmittance[nLevels - 1] = 1
    for (let layer = nLayers - 1; layer >= 0; layer--) {
      tau += optics.opticalDepth[layer][i]
      transmittance[layer] = Math.exp(-tau)
    }
    for (let part = 0; part < partCount; part++) {
      const bin = firstBin + part
      if (bin < 0 || bin >= binCount) continue
      const w = weights[i] * share
      binWeight[bin] += w
      toaNadirRadianceBinned[bin] += w * solution.toaRadianceUp[0][i]
      surfaceZenithRadianceBinned[bin] += w * solution.surfaceRadianceDown[0][i]
      const base = bin * nLevels
      for (let l = 0; l < nLevels; l++) {
        fluxUpBinned[base + l] += w * solution.fluxUpSpectral[l][i]
        fluxDownBinned[base + l] += w * solution.fluxDownSpectral[l][i]
        transmittanceToSpaceBinned[base + l] += w * transmittance[l]
      }
    }
  }
  for (let bin = 0; bin < binCount; bin++) {
    const inv = binWeight[bin] > 0 ? 1 / binWeight[bin] : 0
    toaNadirRadianceBinned[bin] *= inv
    surfaceZenithRadianceBinned[bin] *= inv
    const base = bin * nLevels
    for (let l = 0; l < nLevels; l++) {
      fluxUpBinned[base + l] *= inv
      fluxDownBinned[base + l] *= inv
      transmittanceToSpaceBinned[base + l] *= inv
    }
  }

  return {
    chunkIndex: chunk.index,
    startCm: chunk.startCm,
    endCm: chunk.endCm,
    firstBin: chunk.firstBin,
    binCount,
    gridPointCount: nGrid,
    fluxUpWPerM2: Float64Array.from(solution.fluxUpWPerM2),
    fluxDownWPerM2: Float64Array.from(solution.fluxDownWPerM2),
    fluxUpBinned,
    fluxDownBinned,
    toaNadirRadianceBinned,
    surfaceZenithRadianceBinned,
    transmittanceToSpaceBinned,
  }
}
