/**
 * The adaptive spectral grid of a chunk: a coarse uniform grid refined by halving the step near
 * the centres of lines that are narrow and optically significant in some layer.
 *
 * Every point is ν = a + n·h₀ with a the chunk start (the anchor), h₀ the finest step and n an
 * integer, and the steps are h_c/2^j (h_c the coarse step, a power-of-two fraction of the
 * chunk's output bins). The chunk ends and every output-bin edge are therefore grid points, and
 * the grid is a union of uniform pieces whose steps change by factors of two.
 *
 * Why this is enough: fluxes, heating rates and bin-mean spectra are integrals over ν, and the
 * trapezoid rule on a uniform grid integrates a function that is analytic in a strip |Im ν| < w
 * with an error ∝ e^{−2πw/h}; for a Voigt line w is about its Lorentz half width, and the Gauss
 * part adds a factor e^{−π²α_D²/(ln2 h²)} (Trefethen & Weideman 2014, SIAM Rev. 56, 385, §3; from
 * memory). Two points per Voigt HWHM therefore integrate a line to ≈ 1e-5 (pure Lorentz worst
 * case 2e^{−4π}), so a line needs its fine step only near its centre; away from it the profile
 * varies on the scale of the distance d and the step may grow like d/R.
 */
import { PhysicsError, assertFiniteInRange } from '../errors'

/** Per-line refinement requests, sorted or not (the planner sorts its intervals). */
export interface GridRequirements {
  count: number
  /** Line centre (mid-point of its shifted centres over the layers that count), cm⁻¹. */
  centreCm: Float64Array
  /** Half of the spread of those shifted centres, cm⁻¹ (≥ 0). */
  spreadCm: Float64Array
  /** Narrowest Voigt HWHM of the line over the layers where it is significant, cm⁻¹ (> 0). */
  halfWidthCm: Float64Array
}

/** Parameters of `planAdaptiveGrid`. */
export interface AdaptiveGridParameters {
  /** Chunk start a (the anchor of the grid), cm⁻¹. */
  startCm: number
  /** Chunk end b, cm⁻¹; (b − a)/coarseStepCm must be a whole number. */
  endCm: number
  /** Coarse step h_c, cm⁻¹ (> 0). */
  coarseStepCm: number
  /** No step finer than this, cm⁻¹ (> 0). */
  minStepCm: number
  /** Points per Voigt HWHM at a line centre, P (≥ 1). */
  pointsPerHalfWidth: number
  /** Half widths over which the fine step is kept before it grows like d/R, R (≥ 1). */
  gradingHalfWidths: number
}

/** An adaptive grid: ν_i = startCm + nodeIndex_i · baseStepCm, strictly increasing. */
export interface AdaptiveSpectralGrid {
  startCm: number
  endCm: number
  /** Finest step h₀ = coarseStepCm / 2^refinementLevels, cm⁻¹. */
  baseStepCm: number
  coarseStepCm: number
  /** Number of halvings J of the coarse step. */
  refinementLevels: number
  /** Integer node indices n_i (exact in double precision). */
  nodeIndex: Float64Array
  /** ν_i, cm⁻¹. */
  wavenumberCm: Float64Array
}

/** Largest number of halvings of the coarse step. */
const MAX_REFINEMENT_LEVELS = 30

/**
 * The step the grid keeps near a line, as a function of the distance d from its centre.
 *
 * Method: s(d) = max(α, (d − δ)/R)/P, with α the line's narrowest significant Voigt HWHM, δ the
 * spread of its shifted centres, P points per HWHM and R the grading in half widths: P points per
 * HWHM within R half widths of the centre, then a step that grows in proportion to the distance
 * (the local scale of a Lorentz wing). Notes: used by `planAdaptiveGrid`; the grid step at ν is
 * at most min over lines of s, to within a factor 2. Units: cm⁻¹.
 * Source: trapezoid-rule accuracy for analytic integrands (Trefethen & Weideman 2014, SIAM Rev. 56,
 * 385; from memory); grading with distance: common practice.
 */
export function requiredStepCm(
  distanceCm: number,
  halfWidthCm: number,
  spreadCm: number,
  pointsPerHalfWidth: number,
  gradingHalfWidths: number,
): number {
  return (
    Math.max(halfWidthCm, (Math.abs(distanceCm) - spreadCm) / gradingHalfWidths) /
    pointsPerHalfWidth
  )
}

/**
 * Plans the adaptive grid of a chunk from the lines that need fine steps.
 *
 * Method: level 0 is the coarse grid a + m·h_c over [a, b]. Level j ≥ 1 (step h_j = h_c/2^j)
 * covers the union over lines with α < 2P·h_j of [ν* − δ − 2RP·h_j, ν* + δ + 2RP·h_j] (where
 * s(d) < 2h_j, see `requiredStepCm`), widened outward to nodes of level j − 1 and clipped to
 * [a, b]; levels are added while any line asks for them and h_j ≥ minStepCm. The grid is the
 * union of the nodes of all levels inside their regions. Regions nest (level j's lies inside level
 * j − 1's), so the step between neighbours is h_j inside region j and outside region j + 1.
 * Notes: points per line ≈ 4RP within the finest region plus ≈ 2RP per coarser level; lines with
 * α ≥ 2P·h_c add nothing. Deterministic (integer node indices, sorted). Units: cm⁻¹.
 * Source: see the module comment.
 * @param requirements lines that need fine steps (centre, spread, half width)
 * @param parameters chunk bounds, coarse and minimum step, P, R
 * @returns the grid (always contains a and b)
 */
export function planAdaptiveGrid(
  requirements: GridRequirements,
  parameters: AdaptiveGridParameters,
): AdaptiveSpectralGrid {
  const { startCm, endCm, coarseStepCm, minStepCm, pointsPerHalfWidth, gradingHalfWidths } =
    parameters
  assertFiniteInRange('startCm', startCm, -Infinity, Infinity)
  assertFiniteInRange('endCm', endCm, startCm, Infinity)
  assertFiniteInRange('coarseStepCm', coarseStepCm, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('minStepCm', minStepCm, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('pointsPerHalfWidth', pointsPerHalfWidth, 1, 1e3)
  assertFiniteInRange('gradingHalfWidths', gradingHalfWidths, 1, 1e4)
  const coarseCount = Math.round((endCm - startCm) / coarseStepCm)
  if (
    !(coarseCount >= 1) ||
    Math.abs(coarseCount * coarseStepCm - (endCm - startCm)) > 1e-9 * coarseStepCm * coarseCount
  ) {
    throw new PhysicsError(
      'INVALID_ARGUMENT',
      'the chunk must be a whole number (≥ 1) of coarse steps',
      {
        startCm,
        endCm,
        coarseStepCm,
      },
    )
  }
  const m = requirements.count
  for (let i = 0; i < m; i++) {
    if (!(requirements.halfWidthCm[i] > 0 && requirements.halfWidthCm[i] < Infinity)) {
      throw new PhysicsError('OUT_OF_RANGE', 'requirement half widths must be finite and > 0', {
        row: i,
      })
    }
    if (!(requirements.spreadCm[i] >= 0 && requirements.spreadCm[i] < Infinity)) {
      throw new PhysicsError('OUT_OF_RANGE', 'requirement spreads must be finite and ≥ 0', {
        row: i,
      })
    }
    assertFiniteInRange('centreCm', requirements.centreCm[i], -Infinity, Infinity)
  }

  // Regions per level in cm⁻¹ (before snapping): lists of [lo, hi].
  const regions: Float64Array[] = []
  const lo = new Float64Array(m)
  const hi = new Float64Array(m)
  const order = new Int32Array(m)
  for (let j = 1; j <= MAX_REFINEMENT_LEVELS; j++) {
    const step = coarseStepCm / 2 ** j
    if (step < minStepCm) break
    const widthLimit = 2 * pointsPerHalfWidth * step
    const radius = 2 * gradingHalfWidths * pointsPerHalfWidth * step
    let count = 0
    for (let i = 0; i < m; i++) {
      if (!(requirements.halfWidthCm[i] < widthLimit)) continue
      const reach = requirements.spreadCm[i] + radius
      const a = requirements.centreCm[i] - reach
      const b = requirements.centreCm[i] + reach
      if (b < startCm || a > endCm) continue
      lo[count] = a
      hi[count] = b
      order[count] = count
      count++
    }
    if (count === 0) break
    const sorted = order.subarray(0, count).sort((x, y) => lo[x] - lo[y] || x - y)
    const merged: number[] = []
    for (const index of sorted) {
      const a = lo[index]
      const b = hi[index]
      if (merged.length > 0 && a <= merged[merged.length - 1]) {
        if (b > merged[merged.length - 1]) merged[merged.length - 1] = b
      } else {
        merged.push(a, b)
      }
    }
    regions.push(Float64Array.from(merged))
  }
  const levels = regions.length
  const baseStepCm = coarseStepCm / 2 ** levels
  const lastIndex = coarseCount * 2 ** levels

  // Node indices of every level inside its (snapped) region.
  const chunks: Float64Array[] = []
  let total = 0
  const coarseStride = 2 ** levels
  const coarse = new Float64Array(coarseCount + 1)
  for (let c = 0; c <= coarseCount; c++) coarse[c] = c * coarseStride
  chunks.push(coarse)
  total += coarse.length
  for (let j = 1; j <= levels; j++) {
    const stride = 2 ** (levels - j)
    const parentStride = 2 * stride
    const parentStepCm = coarseStepCm / 2 ** (j - 1)
    const list = regions[j - 1]
    const indices: number[] = []
    let previousHi = -1
    for (let r = 0; r < list.length; r += 2) {
      // Widen to nodes of the parent level, so a fine run starts and ends on coarser points.
      let first = Math.floor((list[r] - startCm) / parentStepCm) * parentStride
      let last = Math.ceil((list[r + 1] - startCm) / parentStepCm) * parentStride
      if (first < 0) first = 0
      if (last > lastIndex) last = lastIndex
      if (first <= previousHi) first = previousHi + stride
      for (let n = first; n <= last; n += stride) {
        // Points of the parent level are already in the grid.
        if (n % parentStride !== 0) indices.push(n)
      }
      if (last > previousHi) previousHi = last
    }
    const run = Float64Array.from(indices)
    chunks.push(run)
    total += run.length
  }
  const all = new Float64Array(total)
  let offset = 0
  for (const c of chunks) {
    all.set(c, offset)
    offset += c.length
  }
  all.sort()
  const nodeIndex = new Float64Array(total)
  let count = 0
  for (let i = 0; i < total; i++) {
    if (count > 0 && all[i] === nodeIndex[count - 1]) continue
    nodeIndex[count++] = all[i]
  }
  const indices = nodeIndex.slice(0, count)
  const wavenumberCm = new Float64Array(count)
  for (let i = 0; i < count; i++) wavenumberCm[i] = startCm + indices[i] * baseStepCm
  // The end is exact: a + N·h₀ might round differently from b.
  wavenumberCm[count - 1] = endCm
  return {
    startCm,
    endCm,
    baseStepCm,
    coarseStepCm,
    refinementLevels: levels,
    nodeIndex: indices,
    wavenumberCm,
  }
}
