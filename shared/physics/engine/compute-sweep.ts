/**
 * Concentration sweeps: several runs that differ only in the amount of one gas, computed chunk by
 * chunk together so that what does not depend on that gas is done once (the grid, the other
 * gases' optical depths, the line setup; optics/adaptive-sweep-optical-depth.ts). Each member is
 * then solved and merged exactly as a run of its own, and agrees with one within the adaptive
 * method's tolerances. Forcing pairs are two-member sweeps.
 *
 * Members are computed independently (same numbers as `computeRadiation`, no sharing) when the
 * spectral method is not 'adaptive', or when changing the gas changes the layers in other ways —
 * water vapour changes the air column of every layer, and so every other gas's column.
 */
import { PhysicsError } from '../errors'
import {
  computeAdaptiveSweepOpticalDepth,
  sweepLayersDifference,
} from '../optics/adaptive-sweep-optical-depth'
import type { LineTable } from '../spectroscopy/line'
import { levelPlanckTable } from '../transfer/column-transfer'
import { GAS_IDS, type AtmosphereProfile, type GasId } from '../types'
import {
  adaptiveOpticsOptionsOf,
  adaptiveWorkStats,
  computeChunk,
  solveAdaptiveChunk,
  type ChunkResult,
} from './compute-chunk'
import type { ComputeProgress } from './compute'
import { mergeChunkResults, type RadiationResult } from './merge'
import { prepareComputation, type ChunkBounds, type PreparedComputation } from './prepare'
import type { ComputeSettings } from './settings'

export interface PreparedSweep {
  sweptGas: GasId
  members: PreparedComputation[]
  /** The chunk plan (the same for every member). */
  chunks: ChunkBounds[]
  /** Why the members are computed independently, or null when their optics are shared. */
  independentReason: string | null
}

/**
 * Where two profiles differ other than in the swept gas, or null.
 * Method: exact comparison of the surface and of every level's pressure, temperature, height and
 * mixing ratios. Source: — (bookkeeping).
 */
function profileDifference(a: AtmosphereProfile, b: AtmosphereProfile, gas: GasId): string | null {
  if (a.surfaceTemperatureK !== b.surfaceTemperatureK) return 'surfaceTemperatureK'
  if (a.surfaceEmissivity !== b.surfaceEmissivity) return 'surfaceEmissivity'
  if (a.levels.length !== b.levels.length) return 'the number of levels'
  for (let i = 0; i < a.levels.length; i++) {
    const x = a.levels[i]
    const y = b.levels[i]
    for (const field of ['pressurePa', 'temperatureK', 'heightM'] as const) {
      if (x[field] !== y[field]) return `levels[${i}].${field}`
    }
    for (const other of GAS_IDS) {
      if (other !== gas && (x.vmr[other] ?? 0) !== (y.vmr[other] ?? 0))
        return `levels[${i}].vmr.${other}`
    }
  }
  return null
}

/**
 * Prepares every member of a sweep with the same settings and decides whether their optics can
 * be shared.
 * @param profiles one profile per member (≥ 1), identical except for `sweptGas`
 * @throws PhysicsError INVALID_ARGUMENT naming the member and field when profiles differ otherwise
 */
export function prepareSweep(
  profiles: readonly AtmosphereProfile[],
  lines: LineTable,
  settings: Partial<ComputeSettings>,
  sweptGas: GasId,
): PreparedSweep {
  if (!GAS_IDS.includes(sweptGas)) {
    throw new PhysicsError('INVALID_ARGUMENT', `unknown swept gas "${String(sweptGas)}"`, {
      field: 'sweptGas',
    })
  }
  if (profiles.length === 0)
    throw new PhysicsError('INVALID_ARGUMENT', 'a sweep needs at least one member')
  profiles.forEach((profile, m) => {
    const difference = profileDifference(profiles[0], profile, sweptGas)
    if (difference) {
      throw new PhysicsError(
        'INVALID_ARGUMENT',
        `sweep member ${m} differs from member 0 in ${difference}, not only in ${sweptGas}`,
        {
          member: m,
          field: difference,
        },
      )
    }
  })
  const members = profiles.map((profile) => prepareComputation(profile, lines, settings))
  const method = members[0].settings.spectralMethod ?? 'adaptive'
  const independentReason =
    method !== 'adaptive'
      ? `the ${method} method computes every member on its own`
      : sweepLayersDifference(
          members.map((m) => m.layers),
          sweptGas,
        )
  return { sweptGas, members, chunks: members[0].chunks, independentReason }
}

/** One chunk of every member, in member order. Pure and deterministic. */
export function computeSweepChunk(sweep: PreparedSweep, chunk: ChunkBounds): ChunkResult[] {
  const { members } = sweep
  if (sweep.independentReason !== null || members.length === 1) {
    return members.map((prepared) => computeChunk(prepared, chunk))
  }
  const results: ChunkResult[] = new Array(members.length)
  const first = members[0]
  let planck: Float64Array | undefined
  computeAdaptiveSweepOpticalDepth(
    {
      lines: first.lines,
      memberLayers: members.map((m) => m.layers),
      sweptGas: sweep.sweptGas,
      startCm: chunk.startCm,
      endCm: chunk.endCm,
      options: adaptiveOpticsOptionsOf(first),
    },
    (m, opticalDepth, { grid, stats }) => {
      // Members share temperatures, so they share the Planck radiances of the grid.
      planck ??= levelPlanckTable(
        grid.wavenumberCm,
        first.levelTemperatureK,
        first.profile.surfaceTemperatureK,
      )
      // Every member reports the shared optics' work.
      results[m] = solveAdaptiveChunk(
        members[m],
        chunk,
        grid,
        opticalDepth,
        adaptiveWorkStats(stats),
        planck,
      )
    },
  )
  return results
}

/** Results of a sweep, one per member, and whether their optics were shared. */
export interface SweepResult {
  members: RadiationResult[]
  /** Why the members were computed independently, or null when their optics were shared. */
  independentReason: string | null
}

/**
 * A whole sweep in one call on one thread: prepare, every chunk of every member, merge each member.
 * Progress counts chunks of the sweep (each covers every member).
 */
export function computeSweep(
  profiles: readonly AtmosphereProfile[],
  lines: LineTable,
  settings: Partial<ComputeSettings>,
  sweptGas: GasId,
  onProgress?: (p: ComputeProgress) => void,
): SweepResult {
  const sweep = prepareSweep(profiles, lines, settings, sweptGas)
  const perMember: ChunkResult[][] = sweep.members.map(() => [])
  sweep.chunks.forEach((chunk, done) => {
    computeSweepChunk(sweep, chunk).forEach((result, m) => perMember[m].push(result))
    onProgress?.({ chunksDone: done + 1, chunkCount: sweep.chunks.length })
  })
  return {
    members: sweep.members.map((prepared, m) => mergeChunkResults(prepared, perMember[m])),
    independentReason: sweep.independentReason,
  }
}
