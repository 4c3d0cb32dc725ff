/**
 * One spectral chunk of a run: optical depths of every layer (Beer–Lambert, line by line), the
 * Schwarzschild solution through the layers, and the chunk's share of every output — fluxes
 * integrated over the chunk and spectra averaged into output bins.
 *
 * Three spectral methods (settings.spectralMethod):
 * - 'adaptive' (default): adaptive grid per chunk (fine only near the centres of lines that are
 *   optically significant in some layer, see optics/adaptive-optical-depth.ts), masked multi-level
 *   optics, point-by-point column solver (transfer/column-transfer.ts), outputs binned in blocks.
 * - 'uniform': one uniform grid per chunk with the step tied to the narrowest line of any layer,
 *   multi-level optics on that grid, layer-by-layer solver (the engine's first fast path).
 * - 'reference': the brute-force yardstick — the same uniform grid with direct summation of every
 *   line at every point (`computeReferenceOpticalDepth`) and the layer-by-layer solver.
 *
 * A chunk depends only on the prepared inputs and its bounds, so it gives bit-identical numbers
 * on any thread or machine; band fluxes of a run are sums of chunk fluxes in chunk order.
 */
import {
  computeAdaptiveChunkOpticalDepth,
  type AdaptiveOpticalDepthStats,
  type AdaptiveOpticsOptions,
} from '../optics/adaptive-optical-depth'
import type { AdaptiveSpectralGrid } from '../optics/adaptive-grid'
import { chooseUniformStepCm, computeChunkOpticalDepth } from '../optics/optical-depth'
import { computeReferenceOpticalDepth } from '../optics/reference-optical-depth'
import { createColumnTransferBlock, solveColumnTransfer } from '../transfer/column-transfer'
import { endCorrectedTrapezoidWeights } from '../transfer/end-corrected-trapezoid'
import { solveSchwarzschild } from '../transfer/schwarzschild'
import { trapezoidWeightsCm } from '../transfer/spectral-integration'
import { createDetailSpectrum, detailPointRange, type DetailSpectrum } from './detail-spectrum'
import type { ChunkBounds, PreparedComputation } from './prepare'

/** Work done for one chunk (for benchmarks and logs; not needed to merge results). */
export interface ChunkWorkStats {
  spectralMethod: 'adaptive' | 'uniform' | 'reference'
  /** (line, layer) pairs with a positive integrated optical depth in the chunk's line slice. */
  lineLayerCount: number
  /** Voigt-function evaluations of the optics. */
  voigtEvaluations: number
  /** Finest grid step, cm⁻¹. */
  finestStepCm: number
  /** Pairs dropped as negligible (adaptive method only). */
  droppedLineLayerCount: number
}

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
  /** The chunk's share of the full-resolution window (absent when the window misses the chunk). */
  detail?: DetailSpectrum
  /** Work done (optional; not stored with the run). */
  work?: ChunkWorkStats
}

/** An empty detail share for the grid points [first, end), or undefined when there are none. */
function detailShare(range: { first: number; end: number }): DetailSpectrum | undefined {
  return range.end > range.first ? createDetailSpectrum(range.end - range.first) : undefined
}

/** Points solved per block of the column solver (bounds the scratch to ≈ 3 MB for 61 levels). */
const BLOCK_POINTS = 2048

/** Computes one chunk. Pure and deterministic. */
export function computeChunk(prepared: PreparedComputation, chunk: ChunkBounds): ChunkResult {
  const method = prepared.settings.spectralMethod ?? 'adaptive'
  return method === 'adaptive'
    ? computeAdaptiveChunk(prepared, chunk)
    : computeUniformChunk(prepared, chunk, method)
}

/** Warmest of the levels and the surface, K (temperature of the negligible-pair flux bound). */
function warmestTemperatureK(prepared: PreparedComputation): number {
  let t = prepared.profile.surfaceTemperatureK
  for (const level of prepared.levelTemperatureK) if (level > t) t = level
  return t
}

/** The adaptive optics options of a run's settings. */
export function adaptiveOpticsOptionsOf(prepared: PreparedComputation): AdaptiveOpticsOptions {
  const { settings } = prepared
  const adaptive = settings.adaptive ?? {}
  return {
    wingCutoffCm: settings.wingCutoffCm,
    continuum: prepared.continuum,
    partitionFunctionLookup: prepared.partitionFunctionLookup,
    lineWingWeights: prepared.lineWingWeights,
    unitCm: settings.outputResolutionCm,
    referenceTemperatureK: warmestTemperatureK(prepared),
    significantPeakOpticalDepth: adaptive.significantPeakOpticalDepth,
    pointsPerHalfWidth: adaptive.pointsPerHalfWidth,
    gradingHalfWidths: adaptive.gradingHalfWidths,
    maxCoarseStepCm: adaptive.maxCoarseStepCm,
    negligibleFluxWPerM2PerCm: adaptive.negligibleFluxWPerM2PerCm,
    negligibleHeatingKPerDayPerCm: adaptive.negligibleHeatingKPerDayPerCm,
  }
}

/** The work counters of an adaptive chunk. */
export function adaptiveWorkStats(stats: AdaptiveOpticalDepthStats): ChunkWorkStats {
  return {
    spectralMethod: 'adaptive',
    lineLayerCount: stats.activeLineLayerCount,
    voigtEvaluations: stats.voigtEvaluations,
    finestStepCm: stats.finestStepCm,
    droppedLineLayerCount: stats.droppedLineLayerCount,
  }
}

function computeAdaptiveChunk(prepared: PreparedComputation, chunk: ChunkBounds): ChunkResult {
  const optics = computeAdaptiveChunkOpticalDepth({
    lines: prepared.lines,
    layers: prepared.layers,
    startCm: chunk.startCm,
    endCm: chunk.endCm,
    options: adaptiveOpticsOptionsOf(prepared),
  })
  return solveAdaptiveChunk(prepared, chunk, optics.grid, optics.opticalDepth, adaptiveWorkStats(optics.stats))
}

/**
 * The transfer of one chunk on an adaptive grid and the chunk's share of every output: the
 * point-by-point column solver in blocks, outputs integrated with end-corrected trapezoid weights
 * into the output bins, and the full-resolution window when it overlaps the chunk.
 */
export function solveAdaptiveChunk(
  prepared: PreparedComputation,
  chunk: ChunkBounds,
  grid: AdaptiveSpectralGrid,
  opticalDepth: readonly Float64Array[],
  work: ChunkWorkStats,
  levelPlanckTable?: Float64Array,
): ChunkResult {
  const { settings, levelTemperatureK, profile } = prepared
  const nLevels = levelTemperatureK.length
  const nu = grid.wavenumberCm
  const node = grid.nodeIndex
  const nGrid = nu.length
  // Output-bin edges are grid nodes: bin b spans nodes [b·E, (b + 1)·E].
  const nodesPerBin = Math.round(settings.outputResolutionCm / grid.baseStepCm)
  const binCount = chunk.binCount
  // End-corrected trapezoid weights: the grid changes its step by factors of two.
  const weights = endCorrectedTrapezoidWeights(node, nu, nodesPerBin, {
    left: new Float64Array(nGrid),
    right: new Float64Array(nGrid),
  })

  const bins = createBinnedOutputs(binCount, nLevels)
  const {
    fluxUpBinned,
    fluxDownBinned,
    transmittanceToSpaceBinned,
    toaNadirRadianceBinned,
    surfaceZenithRadianceBinned,
    binWidth,
  } = bins

  const input = {
    wavenumberCm: nu,
    layerOpticalDepth: opticalDepth,
    levelTemperatureK,
    surfaceTemperatureK: profile.surfaceTemperatureK,
    surfaceEmissivity: profile.surfaceEmissivity,
    quadrature: prepared.quadrature,
    layerSource: settings.layerSource,
    levelPlanckTable,
  }
  const addToBin = (bin: number, w: number, j: number): void => {
    binWidth[bin] += w
    toaNadirRadianceBinned[bin] += w * block.toaNadirRadiance[j]
    surfaceZenithRadianceBinned[bin] += w * block.surfaceZenithRadiance[j]
    const base = bin * nLevels
    const at = j * nLevels
    for (let l = 0; l < nLevels; l++) {
      fluxUpBinned[base + l] += w * block.fluxUp[at + l]
      fluxDownBinned[base + l] += w * block.fluxDown[at + l]
      transmittanceToSpaceBinned[base + l] += w * block.transmittanceToSpace[at + l]
    }
  }
  const block = createColumnTransferBlock(
    Math.min(BLOCK_POINTS, nGrid),
    nLevels,
    prepared.quadrature.mu.length,
  )
  const detailRange = detailPointRange(nu, chunk, settings.detailWindow)
  const detail = detailShare(detailRange)
  for (let first = 0; first < nGrid; first += block.capacity) {
    const count = Math.min(block.capacity, nGrid - first)
    solveColumnTransfer(input, first, count, block)
    for (let j = 0; j < count; j++) {
      const i = first + j
      if (detail && i >= detailRange.first && i < detailRange.end) {
        const k = i - detailRange.first
        detail.wavenumberCm[k] = nu[i]
        detail.olrSpectral[k] = block.fluxUp[j * nLevels + nLevels - 1]
        detail.surfaceDownSpectral[k] = block.fluxDown[j * nLevels]
        detail.toaNadirRadiance[k] = block.toaNadirRadiance[j]
        detail.surfaceZenithRadiance[k] = block.surfaceZenithRadiance[j]
        detail.columnTransmittance[k] = block.transmittanceToSpace[j * nLevels]
      }
      // Each point counts towards the bin of the interval on its left and on its right (bin edges
      // are grid points, so no interval straddles one).
      const binLeft = i > 0 ? Math.floor(node[i - 1] / nodesPerBin) : -1
      const binRight = i < nGrid - 1 ? Math.floor(node[i] / nodesPerBin) : -1
      if (binLeft === binRight) {
        if (binLeft >= 0) addToBin(binLeft, weights.left[i] + weights.right[i], j)
      } else {
        if (binLeft >= 0) addToBin(binLeft, weights.left[i], j)
        if (binRight >= 0) addToBin(binRight, weights.right[i], j)
      }
    }
  }

  // Band fluxes are the sums of the bin integrals; then bin integrals become bin means (the
  // weights of a bin add up to its width: the end corrections sum to zero).
  const fluxUpWPerM2 = new Float64Array(nLevels)
  const fluxDownWPerM2 = new Float64Array(nLevels)
  for (let bin = 0; bin < binCount; bin++) {
    const base = bin * nLevels
    for (let l = 0; l < nLevels; l++) {
      fluxUpWPerM2[l] += fluxUpBinned[base + l]
      fluxDownWPerM2[l] += fluxDownBinned[base + l]
    }
  }
  return finishChunk(chunk, nGrid, bins, fluxUpWPerM2, fluxDownWPerM2, detail, work)
}

/** A chunk's outputs per output bin while they are summed: weighted sums, then bin means. */
interface BinnedOutputs {
  nLevels: number
  fluxUpBinned: Float64Array
  fluxDownBinned: Float64Array
  transmittanceToSpaceBinned: Float64Array
  toaNadirRadianceBinned: Float64Array
  surfaceZenithRadianceBinned: Float64Array
  /** Sum of the integration weights of each bin (its width once every point is in), cm⁻¹. */
  binWidth: Float64Array
}

function createBinnedOutputs(binCount: number, nLevels: number): BinnedOutputs {
  return {
    nLevels,
    fluxUpBinned: new Float64Array(binCount * nLevels),
    fluxDownBinned: new Float64Array(binCount * nLevels),
    transmittanceToSpaceBinned: new Float64Array(binCount * nLevels),
    toaNadirRadianceBinned: new Float64Array(binCount),
    surfaceZenithRadianceBinned: new Float64Array(binCount),
    binWidth: new Float64Array(binCount),
  }
}

/** Turns bin integrals into bin means (bins without points stay 0) and assembles the result. */
function finishChunk(
  chunk: ChunkBounds,
  gridPointCount: number,
  bins: BinnedOutputs,
  fluxUpWPerM2: Float64Array,
  fluxDownWPerM2: Float64Array,
  detail: DetailSpectrum | undefined,
  work: ChunkWorkStats,
): ChunkResult {
  const { binWidth, nLevels } = bins
  for (let bin = 0; bin < binWidth.length; bin++) {
    const inv = binWidth[bin] > 0 ? 1 / binWidth[bin] : 0
    bins.toaNadirRadianceBinned[bin] *= inv
    bins.surfaceZenithRadianceBinned[bin] *= inv
    const base = bin * nLevels
    for (let l = 0; l < nLevels; l++) {
      bins.fluxUpBinned[base + l] *= inv
      bins.fluxDownBinned[base + l] *= inv
      bins.transmittanceToSpaceBinned[base + l] *= inv
    }
  }
  return {
    chunkIndex: chunk.index,
    startCm: chunk.startCm,
    endCm: chunk.endCm,
    firstBin: chunk.firstBin,
    binCount: chunk.binCount,
    gridPointCount,
    fluxUpWPerM2,
    fluxDownWPerM2,
    fluxUpBinned: bins.fluxUpBinned,
    fluxDownBinned: bins.fluxDownBinned,
    toaNadirRadianceBinned: bins.toaNadirRadianceBinned,
    surfaceZenithRadianceBinned: bins.surfaceZenithRadianceBinned,
    transmittanceToSpaceBinned: bins.transmittanceToSpaceBinned,
    ...(detail ? { detail } : {}),
    work,
  }
}

function computeUniformChunk(
  prepared: PreparedComputation,
  chunk: ChunkBounds,
  method: 'uniform' | 'reference',
): ChunkResult {
  const { settings, layers, levelTemperatureK, profile } = prepared
  const nLevels = levelTemperatureK.length
  const nLayers = nLevels - 1
  const opticsOptions = {
    wingCutoffCm: settings.wingCutoffCm,
    pointsPerHalfWidth: settings.pointsPerHalfWidth,
    continuum: prepared.continuum,
    partitionFunctionLookup: prepared.partitionFunctionLookup,
    lineWingWeights: prepared.lineWingWeights,
  }
  let grid: Float64Array
  let opticalDepth: Float64Array[]
  let work: ChunkWorkStats
  if (method === 'uniform') {
    const optics = computeChunkOpticalDepth({
      lines: prepared.lines,
      layers,
      startCm: chunk.startCm,
      endCm: chunk.endCm,
      options: opticsOptions,
    })
    grid = optics.wavenumberCm
    opticalDepth = optics.opticalDepth
    work = {
      spectralMethod: method,
      lineLayerCount: optics.stats.activeLineLayerCount,
      voigtEvaluations: optics.stats.voigtEvaluations,
      finestStepCm: optics.stats.stepCm,
      droppedLineLayerCount: 0,
    }
  } else {
    const stepCm = chooseUniformStepCm({
      lines: prepared.lines,
      layers,
      startCm: chunk.startCm,
      endCm: chunk.endCm,
      options: opticsOptions,
    })
    const optics = computeReferenceOpticalDepth({
      lines: prepared.lines,
      layers,
      startCm: chunk.startCm,
      endCm: chunk.endCm,
      stepCm,
      options: { wingCutoffCm: settings.wingCutoffCm, continuum: prepared.continuum, partitionFunctionLookup: prepared.partitionFunctionLookup, lineWingWeights: prepared.lineWingWeights },
    })
    grid = optics.wavenumberCm
    opticalDepth = optics.opticalDepth
    work = {
      spectralMethod: method,
      lineLayerCount: 0,
      voigtEvaluations: optics.voigtEvaluations,
      finestStepCm: stepCm,
      droppedLineLayerCount: 0,
    }
  }
  const nGrid = grid.length
  const weights = new Float64Array(nGrid)
  trapezoidWeightsCm(grid, weights)

  const solution = solveSchwarzschild({
    wavenumberCm: grid,
    layerOpticalDepth: opticalDepth,
    levelTemperatureK,
    surfaceTemperatureK: profile.surfaceTemperatureK,
    surfaceEmissivity: profile.surfaceEmissivity,
    quadrature: prepared.quadrature,
    layerSource: settings.layerSource,
    integrationWeightsCm: weights,
    viewingMu: [1],
  })

  const binCount = chunk.binCount
  const bins = createBinnedOutputs(binCount, nLevels)
  const {
    fluxUpBinned,
    fluxDownBinned,
    transmittanceToSpaceBinned,
    toaNadirRadianceBinned,
    surfaceZenithRadianceBinned,
    binWidth: binWeight,
  } = bins
  const transmittance = new Float64Array(nLevels)

  const detailRange = detailPointRange(grid, chunk, settings.detailWindow)
  const detail = detailShare(detailRange)
  const binWidth = settings.outputResolutionCm
  for (let i = 0; i < nGrid; i++) {
    // Trapezoid rule per bin: a point on a bin edge belongs half to each neighbouring bin.
    const position = (grid[i] - chunk.startCm) / binWidth
    const nearest = Math.round(position)
    const onEdge = Math.abs(position - nearest) < 1e-9
    // An interior edge point is shared by two bins; a chunk's end point belongs to its one bin.
    const shared = onEdge && nearest > 0 && nearest < binCount
    const firstBin = shared
      ? nearest - 1
      : onEdge
        ? Math.min(nearest, binCount - 1)
        : Math.floor(position)
    const partCount = shared ? 2 : 1
    const share = shared ? 0.5 : 1
    // Vertical transmittance from each level to space.
    let tau = 0
    transmittance[nLevels - 1] = 1
    for (let layer = nLayers - 1; layer >= 0; layer--) {
      tau += opticalDepth[layer][i]
      transmittance[layer] = Math.exp(-tau)
    }
    if (detail && i >= detailRange.first && i < detailRange.end) {
      const k = i - detailRange.first
      detail.wavenumberCm[k] = grid[i]
      detail.olrSpectral[k] = solution.fluxUpSpectral[nLevels - 1][i]
      detail.surfaceDownSpectral[k] = solution.fluxDownSpectral[0][i]
      detail.toaNadirRadiance[k] = solution.toaRadianceUp[0][i]
      detail.surfaceZenithRadiance[k] = solution.surfaceRadianceDown[0][i]
      detail.columnTransmittance[k] = transmittance[0]
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
  return finishChunk(
    chunk,
    nGrid,
    bins,
    Float64Array.from(solution.fluxUpWPerM2),
    Float64Array.from(solution.fluxDownWPerM2),
    detail,
    work,
  )
}
