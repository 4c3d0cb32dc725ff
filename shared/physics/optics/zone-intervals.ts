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
