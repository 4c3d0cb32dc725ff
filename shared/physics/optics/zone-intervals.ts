/**
 * Per-line zone bookkeeping shared by the multigrid optics paths: the grid-index intervals where a
 * line is evaluated exactly on each level, clipped to the level's range, sorted and merged.
 */
import { PhysicsError } from '../errors'

/**
 * Merged zone intervals stored per level and line: the core, two cutoff edges, two per wing-weight
 * kink, and the stencils of the level below.
 */
export const MAX_ZONES = 16

/** The scratch and per-level zone arrays a workspace keeps (allocated once per chunk). */
export interface ZoneWorkspace {
  zoneLo: Float64Array
  zoneHi: Float64Array
  zoneCount: Int32Array
  scratchLo: Float64Array
  scratchHi: Float64Array
}

/** Appends [lo, hi] ∩ [first, last] to the scratch list when not empty; returns the new count. */
export function pushInterval(
  ws: ZoneWorkspace,
  count: number,
  lo: number,
  hi: number,
  first: number,
  last: number,
): number {
  const a = lo > first ? lo : first
  const b = hi < last ? hi : last
  if (a > b) return count
  ws.scratchLo[count] = a
  ws.scratchHi[count] = b
  return count + 1
}

/** Sorts the scratch intervals, merges overlapping/adjacent ones and stores them for `level`. */
export function storeMergedZones(ws: ZoneWorkspace, level: number, count: number): void {
  const lo = ws.scratchLo
  const hi = ws.scratchHi
  for (let i = 1; i < count; i++) {
    const a = lo[i]
    const b = hi[i]
    let j = i - 1
    while (j >= 0 && lo[j] > a) {
      lo[j + 1] = lo[j]
      hi[j + 1] = hi[j]
      j--
    }
    lo[j + 1] = a
    hi[j + 1] = b
  }
  const base = level * MAX_ZONES
  let stored = 0
  for (let i = 0; i < count; i++) {
    if (stored > 0 && lo[i] <= ws.zoneHi[base + stored - 1] + 1) {
      if (hi[i] > ws.zoneHi[base + stored - 1]) ws.zoneHi[base + stored - 1] = hi[i]
      continue
    }
    if (stored === MAX_ZONES) {
      throw new PhysicsError('UNSUPPORTED', 'too many zone intervals for a line (internal limit)')
    }
    ws.zoneLo[base + stored] = lo[i]
    ws.zoneHi[base + stored] = hi[i]
    stored++
  }
  ws.zoneCount[level] = stored
}

/** Where and how wide a line's zones are on one level (positions in the level's index units × step). */
export interface LevelZoneSpec {
  /** The line centre relative to the origin of the level's node indices, cm⁻¹. */
  positionCm: number
  /** Node spacing of the level, cm⁻¹. */
  stepCm: number
  /** The whole line out to its cutoff on the coarsest level. */
  isTop: boolean
  cutoffCm: number
  /** Half width of the exact zone round the centre, cm⁻¹; NaN where the level has none. */
  coreRadiusCm: number
  /** Half width of the zones round the cutoffs and wing-weight kinks, cm⁻¹; NaN for none. */
  edgeHalfWidthCm: number
  /** Distances of the wing-weight kinks from the centre, ascending (none: empty). */
  kinksCm: readonly number[]
  /** Also cover the stencils of the zones stored for level − 1. */
  coverLevelBelow: boolean
  /** Fine nodes per coarse node. */
  ratio: number
  first: number
  last: number
}

const NO_KINKS: readonly number[] = []

/**
 * Collects a line's zones on one level — the whole line on the top level; elsewhere the core,
 * the two cutoff edges and the kink edges, plus the stencils of the level below — and stores them
 * merged for `level`. Shared by the uniform and the masked multigrid paths (same arithmetic, so
 * the same intervals bit for bit).
 */
export function storeLevelZones(ws: ZoneWorkspace, level: number, z: LevelZoneSpec): void {
  const { positionCm: c, stepCm: step, cutoffCm, first, last } = z
  let count = 0
  if (z.isTop) {
    count = pushInterval(
      ws,
      count,
      Math.ceil((c - cutoffCm) / step) - 1,
      Math.floor((c + cutoffCm) / step) + 1,
      first,
      last,
    )
  } else {
    const radius = z.coreRadiusCm
    if (radius === radius) {
      count = pushInterval(
        ws,
        count,
        Math.ceil((c - radius) / step),
        Math.floor((c + radius) / step),
        first,
        last,
      )
    }
    const edge = z.edgeHalfWidthCm
    if (edge === edge) {
      count = pushInterval(
        ws,
        count,
        Math.ceil((c - cutoffCm - edge) / step),
        Math.floor((c - cutoffCm + edge) / step),
        first,
        last,
      )
      count = pushInterval(
        ws,
        count,
        Math.ceil((c + cutoffCm - edge) / step),
        Math.floor((c + cutoffCm + edge) / step),
        first,
        last,
      )
      for (const kink of z.kinksCm) {
        if (!(kink < cutoffCm)) break
        count = pushInterval(
          ws,
          count,
          Math.ceil((c - kink - edge) / step),
          Math.floor((c - kink + edge) / step),
          first,
          last,
        )
        count = pushInterval(
          ws,
          count,
          Math.ceil((c + kink - edge) / step),
          Math.floor((c + kink + edge) / step),
          first,
          last,
        )
      }
    }
  }
  if (z.coverLevelBelow) {
    const below = (level - 1) * MAX_ZONES
    for (let k = 0; k < ws.zoneCount[level - 1]; k++) {
      count = pushInterval(
        ws,
        count,
        Math.floor(ws.zoneLo[below + k] / z.ratio) - 1,
        Math.floor(ws.zoneHi[below + k] / z.ratio) + 2,
        first,
        last,
      )
    }
  }
  storeMergedZones(ws, level, count)
}

/** The kink list of an optional wing weight. */
export const kinksOf = (weight: { kinksCm: readonly number[] } | undefined): readonly number[] =>
  weight === undefined ? NO_KINKS : weight.kinksCm
