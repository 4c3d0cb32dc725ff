/**
 * The fine/coarse (multi-level) line summation of the optics, evaluated only on the nodes that an
 * adaptive output grid needs ("masks"). Used by `computeAdaptiveChunkOpticalDepth`; the recursion
 * and the zones are those of the uniform fast path (see optical-depth.ts, DESIGN):
 *
 *   T_ℓ = A_ℓ + P_ℓ₊₁ T_ℓ₊₁,  T_L = A_L,  A_ℓ = Σ_lines (f − P_ℓ₊₁[f]) on each line's zone Z_ℓ,
 *
 * with grids G_ℓ = {a + n·h₀rˡ} anchored at the chunk start a and 4-point Lagrange interpolation
 * P. At a node shared with G_ℓ₊₁ the interpolation is an exact copy, so A_ℓ = 0 there and T_ℓ
 * equals T_ℓ₊₁: the optical depth at a node of G_ℓ can be read from any level that holds the
 * node. An output point is read from the coarsest level whose step does not exceed its own grid
 * spacing; the mask M_ℓ of level ℓ is the set of such points plus the interpolation stencils of
 * M_ℓ₋₁. Lines add A_ℓ only on Z_ℓ ∩ M_ℓ, and since both Z and M contain the stencils of the level
 * below, every coarse value a fine node interpolates from has been computed. Away from narrow
 * lines the fine levels hold no masked nodes and cost nothing. A zone node shared with the coarser
 * level needs no evaluation either (its value is the coarser one, same bits, and A = 0 there),
 * which saves 1/r of the Voigt evaluations. The order of every sum is fixed by the grid and the
 * line order, so the result is bit-identical for the same input.
 */
import { PhysicsError } from '../errors'
import { voigtKUnchecked } from '../spectroscopy'
import type { LayerWingWeight } from './line-wing-weights'
import { lagrangeWeights } from './lagrange-weights'
import { kinksOf, MAX_ZONES, storeLevelZones, type LevelZoneSpec } from './zone-intervals'

/** Most grid levels used. */
const MAX_LEVELS = 40
/** Levels, masks, accumulators and per-line scratch of one chunk. */
export interface MaskedMultigrid {
  levelCount: number
  ratio: number
  anchorCm: number
  baseStepCm: number
  /** rˡ per level. */
  multiplier: Float64Array
  stepCm: Float64Array
  /** Inclusive node index range of each level (arrays are indexed from `first`). */
  first: Float64Array
  last: Float64Array
  edgeHalfWidthCm: Float64Array
  /** Sorted, disjoint inclusive node intervals of each level's mask. */
  maskLo: Float64Array[]
  maskHi: Float64Array[]
  accumulator: Float64Array[]
  lineValues: Float64Array[]
  weights: Float64Array
  zoneLo: Float64Array
  zoneHi: Float64Array
  zoneCount: Int32Array
  scratchLo: Float64Array
  scratchHi: Float64Array
  /** Output point p is T_{pointLevel[p]} at node pointNode[p]. */
  pointLevel: Uint8Array
  pointNode: Float64Array
  voigtEvaluations: number
}

/** Masked intervals closer than this many nodes are joined (fewer, longer loops). */
const MASK_GAP_NODES = 16

/** Sorts interval pairs and merges them into a disjoint list (gaps ≤ MASK_GAP_NODES are filled). */
function mergeIntervals(lo: number[], hi: number[]): { lo: Float64Array; hi: Float64Array } {
  const order = lo.map((_, i) => i).sort((x, y) => lo[x] - lo[y] || x - y)
  const outLo: number[] = []
  const outHi: number[] = []
  for (const i of order) {
    const n = outLo.length
    if (n > 0 && lo[i] <= outHi[n - 1] + MASK_GAP_NODES) {
      if (hi[i] > outHi[n - 1]) outHi[n - 1] = hi[i]
    } else {
      outLo.push(lo[i])
      outHi.push(hi[i])
    }
  }
  return { lo: Float64Array.from(outLo), hi: Float64Array.from(outHi) }
}

/**
 * Builds the levels and masks for output points at anchor + nodeIndex·h₀.
 *
 * Method: levels h_ℓ = h₀ rˡ up to the first with ρ h_ℓ₊₁ ≥ cutoff + 2h_ℓ₊₁ + h_ℓ (the near zone
 * covers the cutoff). Point p with index n and grid spacing 2^e h₀ around it (e = min(J, v₂(n)),
 * v₂ the number of factors 2 of n, J the refinement levels) is read from level ℓ = min(⌊e/log₂r⌋, L)
 * at node n/rˡ. Masks: those nodes (runs closer than MASK_GAP_NODES joined), then upward the
 * union with the stencils [⌊lo/r⌋ − 1, ⌊hi/r⌋ + 2] of the level below.
 * Notes: r must be a power of two. Units: cm⁻¹. Source: — (bookkeeping; see the module comment).
 */
export function createMaskedMultigrid(
  anchorCm: number,
  baseStepCm: number,
  refinementLevels: number,
  nodeIndex: Float64Array,
  ratio: number,
  nearZoneCoarseSteps: number,
  wingCutoffCm: number,
): MaskedMultigrid {
  const log2Ratio = Math.round(Math.log2(ratio))
  if (2 ** log2Ratio !== ratio) {
    throw new PhysicsError(
      'INVALID_ARGUMENT',
      'the coarsening ratio of the adaptive optics must be a power of two',
      {
        ratio,
      },
    )
  }
  const rho = nearZoneCoarseSteps
  let top = MAX_LEVELS - 1
  for (let level = 0; level < MAX_LEVELS; level++) {
    const step = baseStepCm * ratio ** level
    const coarser = step * ratio
    if (rho * coarser >= wingCutoffCm + 2 * coarser + step) {
      top = level
      break
    }
  }
  const levelCount = top + 1
  const pointCount = nodeIndex.length
  const lastIndex = pointCount > 0 ? nodeIndex[pointCount - 1] : 0
  const ws: MaskedMultigrid = {
    levelCount,
    ratio,
    anchorCm,
    baseStepCm,
    multiplier: new Float64Array(levelCount),
    stepCm: new Float64Array(levelCount),
    first: new Float64Array(levelCount),
    last: new Float64Array(levelCount),
    edgeHalfWidthCm: new Float64Array(levelCount),
    maskLo: [],
    maskHi: [],
    accumulator: [],
    lineValues: [],
    weights: lagrangeWeights(ratio),
    zoneLo: new Float64Array(levelCount * MAX_ZONES),
    zoneHi: new Float64Array(levelCount * MAX_ZONES),
    zoneCount: new Int32Array(levelCount),
    scratchLo: new Float64Array(2 * MAX_ZONES),
    scratchHi: new Float64Array(2 * MAX_ZONES),
    pointLevel: new Uint8Array(pointCount),
    pointNode: new Float64Array(pointCount),
    voigtEvaluations: 0,
  }
  let first = 0
  let last = lastIndex
  for (let level = 0; level < levelCount; level++) {
    if (level > 0) {
      first = Math.floor(first / ratio) - 1
      last = Math.floor(last / ratio) + 2
    }
    const multiplier = ratio ** level
    const step = baseStepCm * multiplier
    ws.multiplier[level] = multiplier
    ws.stepCm[level] = step
    ws.first[level] = first
    ws.last[level] = last
    ws.edgeHalfWidthCm[level] = 2 * step * ratio + step
  }

  // Output nodes per level.
  const lo: number[][] = Array.from({ length: levelCount }, () => [])
  const hi: number[][] = Array.from({ length: levelCount }, () => [])
  for (let p = 0; p < pointCount; p++) {
    const n = nodeIndex[p]
    let e = 0
    let rest = n
    while (e < refinementLevels && rest % 2 === 0) {
      rest /= 2
      e++
    }
    const level = Math.min(Math.floor(e / log2Ratio), top)
    const node = n / ratio ** level
    ws.pointLevel[p] = level
    ws.pointNode[p] = node
    const l = lo[level]
    const h = hi[level]
    if (l.length > 0 && node - h[h.length - 1] <= MASK_GAP_NODES) h[h.length - 1] = node
    else {
      l.push(node)
      h.push(node)
    }
  }
  for (let level = 0; level < levelCount; level++) {
    if (level > 0) {
      const belowLo = ws.maskLo[level - 1]
      const belowHi = ws.maskHi[level - 1]
      for (let i = 0; i < belowLo.length; i++) {
        lo[level].push(Math.floor(belowLo[i] / ratio) - 1)
        hi[level].push(Math.floor(belowHi[i] / ratio) + 2)
      }
    }
    const merged = mergeIntervals(lo[level], hi[level])
    ws.maskLo.push(merged.lo)
    ws.maskHi.push(merged.hi)
    const size = ws.last[level] - ws.first[level] + 1
    ws.accumulator.push(new Float64Array(size))
    ws.lineValues.push(new Float64Array(size))
  }
  return ws
}

/** Number of masked nodes over all levels (work per layer of the interpolation passes). */
export function maskedNodeCount(ws: MaskedMultigrid): number {
  let count = 0
  for (let level = 0; level < ws.levelCount; level++) {
    const lo = ws.maskLo[level]
    const hi = ws.maskHi[level]
    for (let i = 0; i < lo.length; i++) count += hi[i] - lo[i] + 1
  }
  return count
}

/** Zeroes the accumulators on the masks (start of a layer). */
export function clearMaskedAccumulators(ws: MaskedMultigrid): void {
  for (let level = 0; level < ws.levelCount; level++) {
    const acc = ws.accumulator[level]
    const first = ws.first[level]
    const lo = ws.maskLo[level]
    const hi = ws.maskHi[level]
    for (let i = 0; i < lo.length; i++) acc.fill(0, lo[i] - first, hi[i] - first + 1)
  }
}



/** |x| + y from which K uses Humlíček's one-pole region I (as `voigtKUnchecked`). */
const REGION_I_MIN = 15
/** |x| + y from which Humlíček's two-pole region II applies. */
const REGION_II_MIN = 5.5
/** |x| + y from which `voigtKUnchecked` switches to its asymptotic series. */
const REGION_I_MAX = 1e6

/**
 * Voigt function K(x, y) = Re w(x + iy) for the hot loops of the masked summation.
 *
 * Method: Humlíček's W4 with regions I and II written out in real arithmetic (t = y − ix):
 * region I (|x| + y ≥ 15) Re[t/(√π(½ + t²))] = y(½ + x² + y²)/(√π((½ + y² − x²)² + 4x²y²));
 * region II (≥ 5.5) Re[t(1.410474 + 0.5641896u)/(0.75 + u(3 + u))], u = t²; regions III–IV and
 * |x| + y ≥ 1e6 by `voigtKUnchecked`.
 * Notes: the same approximation as `voigtKUnchecked` (relative error ≈ 1e-4 for y ≥ 1e-6), equal
 * to it within rounding (tested to 1e-14) with fewer operations; the caller guarantees finite x
 * and y ≥ 0. Dimensionless.
 * Source: J. Humlíček, JQSRT 27, 437–444 (1982), regions I and II.
 * @param x √ln2 (ν − ν*)/α_D
 * @param y √ln2 γ/α_D, ≥ 0
 */
export function voigtKFast(x: number, y: number): number {
  const s = (x < 0 ? -x : x) + y
  if (s >= REGION_I_MIN) {
    if (s >= REGION_I_MAX) return voigtKUnchecked(x, y)
    const x2 = x * x
    const y2 = y * y
    const d = 0.5 + y2 - x2
    return (0.5641896 * y * (0.5 + x2 + y2)) / (d * d + 4 * x2 * y2)
  }
  if (s >= REGION_II_MIN) {
    // t = y − ix, u = t² = (y² − x²) − 2ixy.
    const ur = y * y - x * x
    const ui = -2 * x * y
    const pr = 1.410474 + 0.5641896 * ur
    const pi = 0.5641896 * ui
    const nr = y * pr + x * pi
    const ni = y * pi - x * pr
    const qr = 3 + ur
    const dr = 0.75 + ur * qr - ui * ui
    const di = ur * ui + ui * qr
    return (nr * dr + ni * di) / (dr * dr + di * di)
  }
  return voigtKUnchecked(x, y)
}

/** Index of the first mask interval of `level` whose upper end is ≥ node (binary search). */
function firstMaskInterval(hiList: Float64Array, node: number): number {
  let a = 0
  let b = hiList.length
  while (a < b) {
    const mid = (a + b) >> 1
    if (hiList[mid] < node) a = mid + 1
    else b = mid
  }
  return a
}

/**
 * Adds one line, f(ν) = amplitude·(K(scale·(ν − ν*), y) − pedestal) for |ν − ν*| ≤ cutoff, to
 * the level accumulators on the masked nodes of its zones (see the module comment): the core zone
 * |ν − ν*| ≤ ρ h_ℓ₊₁ on levels from `coreLevel` up (ρ = nearZoneCoarseSteps ≥ 6, at most the
 * value the levels were built with), every node within the cutoff on the top level, and, with
 * `withEdgeZones`, the nodes within 2h_ℓ₊₁ + h_ℓ of ν* ± cutoff on every level, where the
 * truncated profile jumps. Without edge zones the jump of size f(cutoff) is interpolated from the
 * top level: an error of order f(cutoff)·h_top in the line's area, ≲ 1e-4 of the area of a line
 * with γ ≤ 0.1 cm⁻¹ and a 25 cm⁻¹ cutoff (used for weak lines only). With a far-wing `weight`,
 * f is multiplied by χ(ν − ν*) beyond its onset on every level (the caller folds χ(cutoff) into
 * `pedestal`), and with `withEdgeZones` each kink κ < cutoff of χ gets zones like the edges, so no
 * interpolation stencil straddles a slope discontinuity of χ; without them (weak lines) the kink
 * is interpolated, an error ≲ 0.1·h_ℓ₊₁·ΔB of the wing there (ΔB the slope jump of ln χ).
 */
export function depositMaskedLine(
  ws: MaskedMultigrid,
  centreCm: number,
  amplitude: number,
  scale: number,
  y: number,
  pedestal: number,
  cutoffCm: number,
  coreLevel: number,
  nearZoneCoarseSteps: number,
  withEdgeZones: boolean,
  weight?: LayerWingWeight,
): void {
  const top = ws.levelCount - 1
  const onset = weight === undefined ? Infinity : weight.onsetCm
  const ratio = ws.ratio
  const anchorOffset = ws.anchorCm - centreCm
  const relative = centreCm - ws.anchorCm
  // Without edge zones a line has no zone below its core level.
  const startLevel = withEdgeZones ? 0 : Math.min(coreLevel, top)
  for (let level = 0; level < startLevel; level++) ws.zoneCount[level] = 0
  // One spec per line, updated level by level (no allocation per level).
  const zones: LevelZoneSpec = {
    positionCm: relative,
    stepCm: 0,
    isTop: false,
    cutoffCm,
    coreRadiusCm: NaN,
    edgeHalfWidthCm: NaN,
    kinksCm: kinksOf(weight),
    coverLevelBelow: false,
    ratio,
    first: 0,
    last: 0,
  }
  for (let level = startLevel; level <= top; level++) {
    zones.stepCm = ws.stepCm[level]
    zones.isTop = level === top
    zones.coreRadiusCm = level >= coreLevel ? nearZoneCoarseSteps * ws.stepCm[level] * ratio : NaN
    zones.edgeHalfWidthCm = withEdgeZones ? ws.edgeHalfWidthCm[level] : NaN
    zones.coverLevelBelow = level > startLevel
    zones.first = ws.first[level]
    zones.last = ws.last[level]
    storeLevelZones(ws, level, zones)
  }

  const baseStep = ws.baseStepCm
  const weights = ws.weights
  const y2 = y * y
  let evaluations = 0
  for (let level = top; level >= 0; level--) {
    const zones = ws.zoneCount[level]
    if (zones === 0) continue
    const maskLo = ws.maskLo[level]
    const maskHi = ws.maskHi[level]
    const maskCount = maskLo.length
    if (maskCount === 0) continue
    const accumulator = ws.accumulator[level]
    const values = ws.lineValues[level]
    // Node indices are small integers: int32 arithmetic keeps the typed-array accesses cheap.
    const first = ws.first[level] | 0
    const multiplier = ws.multiplier[level]
    const hasCoarser = level < top
    const coarserValues = hasCoarser ? ws.lineValues[level + 1] : values
    const coarserFirst = hasCoarser ? ws.first[level + 1] | 0 : 0
    for (let z = 0; z < zones; z++) {
      const zoneLo = ws.zoneLo[level * MAX_ZONES + z]
      const zoneHi = ws.zoneHi[level * MAX_ZONES + z]
      for (let m = firstMaskInterval(maskHi, zoneLo); m < maskCount; m++) {
        if (maskLo[m] > zoneHi) break
        const lo = (maskLo[m] > zoneLo ? maskLo[m] : zoneLo) | 0
        const hi = (maskHi[m] < zoneHi ? maskHi[m] : zoneHi) | 0
        let q = Math.floor(lo / ratio) | 0
        let j = (lo - q * ratio) | 0
        if (!hasCoarser) {
          for (let n = lo; n <= hi; n++) {
            const offset = n * multiplier * baseStep + anchorOffset
            let value = 0
            if (offset <= cutoffCm && offset >= -cutoffCm) {
              let k = voigtKFast(offset * scale, y)
              if (offset > onset || offset < -onset) k *= (weight as LayerWingWeight).chi(offset)
              value = amplitude * (k - pedestal)
              evaluations++
            }
            values[n - first] = value
            accumulator[n - first] += value
          }
          continue
        }
        // Coarse cell by cell: the four coarse values of a cell serve its r − 1 fine nodes.
        let n = lo
        while (n <= hi) {
          const c = q - 1 - coarserFirst
          const v0 = coarserValues[c]
          const v1 = coarserValues[c + 1]
          const v2 = coarserValues[c + 2]
          const v3 = coarserValues[c + 3]
          const cellLast = q * ratio + ratio - 1 < hi ? q * ratio + ratio - 1 : hi
          if (j === 0) {
            // A node of the coarser level: f is the coarser value (the same product n·h, so the
            // same bits) and A = f − f = 0.
            values[n - first] = v1
            n++
            j = 1
          }
          for (; n <= cellLast; n++, j++) {
            const offset = n * multiplier * baseStep + anchorOffset
            let value = 0
            if (offset <= cutoffCm && offset >= -cutoffCm) {
              const x = offset * scale
              const ax = x < 0 ? -x : x
              let k: number
              if (ax + y >= REGION_I_MIN && ax + y < REGION_I_MAX) {
                // Region I of `voigtKFast`, written out so that the hot loop needs no call.
                const x2 = x * x
                const d = 0.5 + y2 - x2
                k = (0.5641896 * y * (0.5 + x2 + y2)) / (d * d + 4 * x2 * y2)
              } else {
                k = voigtKFast(x, y)
              }
              if (offset > onset || offset < -onset) k *= (weight as LayerWingWeight).chi(offset)
              value = amplitude * (k - pedestal)
              evaluations++
            }
            values[n - first] = value
            const w = 4 * j
            accumulator[n - first] +=
              value -
              (weights[w] * v0 + weights[w + 1] * v1 + weights[w + 2] * v2 + weights[w + 3] * v3)
          }
          j = 0
          q++
        }
      }
    }
  }
  ws.voigtEvaluations += evaluations
}

/** T_ℓ = A_ℓ + P_ℓ₊₁ T_ℓ₊₁ on the masks, from the top level down. */
export function interpolateMaskedLevels(ws: MaskedMultigrid): void {
  const ratio = ws.ratio
  const weights = ws.weights
  for (let level = ws.levelCount - 2; level >= 0; level--) {
    const coarse = ws.accumulator[level + 1]
    const fine = ws.accumulator[level]
    const coarseFirst = ws.first[level + 1] | 0
    const fineFirst = ws.first[level] | 0
    const maskLo = ws.maskLo[level]
    const maskHi = ws.maskHi[level]
    for (let m = 0; m < maskLo.length; m++) {
      const lo = maskLo[m] | 0
      const hi = maskHi[m] | 0
      let q = Math.floor(lo / ratio) | 0
      let j = (lo - q * ratio) | 0
      for (let n = lo; n <= hi; n++) {
        const w = 4 * j
        const c = q - 1 - coarseFirst
        fine[n - fineFirst] +=
          weights[w] * coarse[c] +
          weights[w + 1] * coarse[c + 1] +
          weights[w + 2] * coarse[c + 2] +
          weights[w + 3] * coarse[c + 3]
        j++
        if (j === ratio) {
          j = 0
          q++
        }
      }
    }
  }
}

/** Copies T at every output point into `out` (negative rounding residues set to 0). */
export function extractMaskedPoints(ws: MaskedMultigrid, out: Float64Array): void {
  for (let p = 0; p < out.length; p++) {
    const level = ws.pointLevel[p]
    const value = ws.accumulator[level][ws.pointNode[p] - ws.first[level]]
    out[p] = value > 0 ? value : 0
  }
}

/** Level on which a line's core is first evaluated: the coarsest with h ≤ α_V/Q. */
export function maskedCoreLevel(
  ws: MaskedMultigrid,
  voigtHalfWidthCm: number,
  corePointsPerHalfWidth: number,
): number {
  const limit = voigtHalfWidthCm / corePointsPerHalfWidth
  let level = 0
  while (level < ws.levelCount - 1 && ws.stepCm[level + 1] <= limit) level++
  return level
}
