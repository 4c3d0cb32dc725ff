// Runs one line-by-line calculation the way computeRadiation does (prepare → every chunk in
// order → merge), and measures it: wall and CPU time, resident memory sampled after every chunk,
// and the work the chunks report (line-layer pairs, Voigt evaluations, grid points).
import {
  computeChunk,
  mergeChunkResults,
  prepareComputation,
  type ChunkResult,
  type ComputeSettings,
  type RadiationResult,
} from '../../shared/physics/engine'
import type { LineTable } from '../../shared/physics/spectroscopy/line'
import type { AtmosphereProfile } from '../../shared/physics/types'

export interface RunMeasurement {
  wallS: number
  cpuS: number
  /** Largest resident set size sampled after any chunk, MiB. */
  peakRssMiB: number
  chunkCount: number
  gridPointCount: number
  /** (line, layer) pairs the optics processed, summed over chunks (lines of each chunk's slice). */
  lineLayerPairs: number
  voigtEvaluations: number
  lineLayerPairsPerS: number
  gridPointsPerS: number
  /** Slowest chunk: start wavenumber and CPU seconds. */
  slowestChunk: { startCm: number; cpuS: number }
}

export interface MeasuredRun {
  result: RadiationResult
  measurement: RunMeasurement
}

function rssMiB(): number {
  return process.memoryUsage().rss / 2 ** 20
}

function cpuSeconds(since: NodeJS.CpuUsage): number {
  const used = process.cpuUsage(since)
  return (used.user + used.system) / 1e6
}

/** Computes and measures one run (single thread, chunks in order). */
export function measureRun(
  profile: AtmosphereProfile,
  lines: LineTable,
  settings: Partial<ComputeSettings>,
): MeasuredRun {
  const cpuStart = process.cpuUsage()
  const wallStart = performance.now()
  let peak = rssMiB()
  const prepared = prepareComputation(profile, lines, settings)
  const results: ChunkResult[] = []
  let gridPointCount = 0
  let lineLayerPairs = 0
  let voigtEvaluations = 0
  const slowestChunk = { startCm: NaN, cpuS: 0 }
  for (const chunk of prepared.chunks) {
    const chunkCpu = process.cpuUsage()
    const result = computeChunk(prepared, chunk)
    const seconds = cpuSeconds(chunkCpu)
    if (seconds > slowestChunk.cpuS) {
      slowestChunk.cpuS = seconds
      slowestChunk.startCm = chunk.startCm
    }
    results.push(result)
    gridPointCount += result.gridPointCount
    lineLayerPairs += result.work?.lineLayerCount ?? 0
    voigtEvaluations += result.work?.voigtEvaluations ?? 0
    peak = Math.max(peak, rssMiB())
  }
  const result = mergeChunkResults(prepared, results)
  const wallS = (performance.now() - wallStart) / 1000
  const cpuS = cpuSeconds(cpuStart)
  peak = Math.max(peak, rssMiB())
  return {
    result,
    measurement: {
      wallS,
      cpuS,
      peakRssMiB: peak,
      chunkCount: prepared.chunks.length,
      gridPointCount,
      lineLayerPairs,
      voigtEvaluations,
      lineLayerPairsPerS: lineLayerPairs / wallS,
      gridPointsPerS: gridPointCount / wallS,
      slowestChunk,
    },
  }
}

/** Largest |a − b| over two arrays of equal length. */
export function maxAbsoluteDifference(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let worst = 0
  for (let i = 0; i < a.length; i++) worst = Math.max(worst, Math.abs(a[i] - b[i]))
  return worst
}

/** Flux and heating-rate differences of two runs on the same levels. */
export function compareResults(run: RadiationResult, reference: RadiationResult) {
  return {
    maxFluxErrorWPerM2: Math.max(
      maxAbsoluteDifference(run.fluxUpWPerM2, reference.fluxUpWPerM2),
      maxAbsoluteDifference(run.fluxDownWPerM2, reference.fluxDownWPerM2),
    ),
    olrErrorWPerM2: run.olrWPerM2 - reference.olrWPerM2,
    maxHeatingErrorKPerDay: maxAbsoluteDifference(
      run.heatingRateKPerDay,
      reference.heatingRateKPerDay,
    ),
    maxOlrSpectralError: maxAbsoluteDifference(run.olrSpectral, reference.olrSpectral),
  }
}
