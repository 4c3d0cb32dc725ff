// Runs one line-by-line calculation the way computeRadiation does (prepare → every chunk in
// order → merge), and measures it: wall and CPU time, resident memory sampled after every chunk,
// and the work the chunks report (line-layer pairs, Voigt evaluations, grid points).
import {
  computeChunk,
  computeSweepChunk,
  mergeChunkResults,
  prepareComputation,
  prepareSweep,
  type ChunkBounds,
  type ChunkResult,
  type ComputeSettings,
  type RadiationResult,
} from '../../shared/physics/engine'
import type { LineTable } from '../../shared/physics/spectroscopy/line'
import type { AtmosphereProfile, GasId } from '../../shared/physics/types'

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

/**
 * Runs `compute` on every chunk in order and measures it; `compute` returns the chunk's result
 * for every member (one for a run), and the work counters are those of the first (shared by the
 * members of a sweep), the grid points those of all members (each is solved).
 */
function measureChunks(
  chunks: readonly ChunkBounds[],
  memberCount: number,
  compute: (chunk: ChunkBounds) => ChunkResult[],
) {
  const cpuStart = process.cpuUsage()
  const wallStart = performance.now()
  let peak = rssMiB()
  const perMember: ChunkResult[][] = Array.from({ length: memberCount }, () => [])
  let gridPointCount = 0
  let lineLayerPairs = 0
  let voigtEvaluations = 0
  const slowestChunk = { startCm: NaN, cpuS: 0 }
  for (const chunk of chunks) {
    const chunkCpu = process.cpuUsage()
    const results = compute(chunk)
    const seconds = cpuSeconds(chunkCpu)
    if (seconds > slowestChunk.cpuS) {
      slowestChunk.cpuS = seconds
      slowestChunk.startCm = chunk.startCm
    }
    results.forEach((result, m) => {
      perMember[m].push(result)
      gridPointCount += result.gridPointCount
    })
    lineLayerPairs += results[0].work?.lineLayerCount ?? 0
    voigtEvaluations += results[0].work?.voigtEvaluations ?? 0
    peak = Math.max(peak, rssMiB())
  }
  return {
    perMember,
    finish(): RunMeasurement {
      const wallS = (performance.now() - wallStart) / 1000
      return {
        wallS,
        cpuS: cpuSeconds(cpuStart),
        peakRssMiB: Math.max(peak, rssMiB()),
        chunkCount: chunks.length,
        gridPointCount,
        lineLayerPairs,
        voigtEvaluations,
        lineLayerPairsPerS: lineLayerPairs / wallS,
        gridPointsPerS: gridPointCount / wallS,
        slowestChunk,
      }
    },
  }
}

/** Computes and measures one run (single thread, chunks in order). */
export function measureRun(
  profile: AtmosphereProfile,
  lines: LineTable,
  settings: Partial<ComputeSettings>,
): MeasuredRun {
  const prepared = prepareComputation(profile, lines, settings)
  const run = measureChunks(prepared.chunks, 1, (chunk) => [computeChunk(prepared, chunk)])
  const result = mergeChunkResults(prepared, run.perMember[0])
  return { result, measurement: run.finish() }
}

export interface MeasuredSweep {
  results: RadiationResult[]
  independentReason: string | null
  measurement: RunMeasurement
}

/** Computes and measures a sweep with its members together (single thread, chunks in order). */
export function measureSweep(
  profiles: readonly AtmosphereProfile[],
  lines: LineTable,
  settings: Partial<ComputeSettings>,
  sweptGas: GasId,
): MeasuredSweep {
  const sweep = prepareSweep(profiles, lines, settings, sweptGas)
  const run = measureChunks(sweep.chunks, profiles.length, (chunk) => computeSweepChunk(sweep, chunk))
  const results = sweep.members.map((prepared, m) => mergeChunkResults(prepared, run.perMember[m]))
  return { results, independentReason: sweep.independentReason, measurement: run.finish() }
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
