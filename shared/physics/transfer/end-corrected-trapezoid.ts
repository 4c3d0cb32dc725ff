/**
 * Integration weights for spectra on a piecewise-uniform grid (the adaptive grid of the optics):
 * the trapezoid rule on each uniform run with Gregory's first end correction, so that changes of
 * the step and bin edges cost no accuracy.
 *
 * On a uniform run [a, b] of step h the trapezoid rule is exact up to the Euler–Maclaurin end
 * terms −(h²/12)(f′(b) − f′(a)) + O(h⁴). On one uniform grid the end terms of neighbouring pieces
 * cancel; where the step changes from h₁ to h₂ they leave (h₂² − h₁²)f′/12, which for a Lorentz
 * wing sampled with a step graded like the distance amounts to ≈ 4e-4 of a layer's absorption
 * (measured on the synthetic CO₂ band, 719–721 cm⁻¹). Subtracting the end terms with f′ from
 * second-order one-sided differences inside the run removes this: ≈ 1e-5.
 */
import { PhysicsError } from '../errors'

/** Weights of one point towards the bin on its left and the bin on its right. */
export interface SplitWeights {
  /** Weight of point i in the integral of the bin that holds the interval (i − 1, i), cm⁻¹. */
  left: Float64Array
  /** Weight of point i in the integral of the bin that holds the interval (i, i + 1), cm⁻¹. */
  right: Float64Array
}

/**
 * End-corrected trapezoid weights on a grid of integer nodes, split by bins.
 *
 * Method: the grid is cut into runs of intervals with equal node step that do not cross a bin
 * edge (bin b spans nodes [b·E, (b + 1)·E]). Each run i = s … e with step h gets the trapezoid
 * weights h/2 (ends) and h (inside), plus, when it has at least two intervals, the end
 * corrections +(h²/12)f′(a) − (h²/12)f′(b) with f′(a) ≈ (−3f_s + 4f_{s+1} − f_{s+2})/(2h) and
 * f′(b) ≈ (3f_e − 4f_{e−1} + f_{e−2})/(2h), i.e. weights −3h/24, +4h/24, −h/24 at each end.
 * Notes: error O(h⁴f‴) per run end instead of O(h²f′); on a long uniform run the interior weights
 * are the plain trapezoid ones, so its exponential accuracy for smooth integrands is kept. Runs
 * of one interval keep the plain trapezoid rule. Σ(left + right) = ∫ of a linear function
 * exactly. Units: cm⁻¹.
 * Source: trapezoid rule with Gregory end corrections, e.g. Press et al., Numerical Recipes 3rd
 * ed., §4.1 (eq. 4.1.14, from memory); Euler–Maclaurin formula, Abramowitz & Stegun 1964, 23.1.30
 * (from memory).
 * @param nodeIndex strictly increasing integer node indices of the points
 * @param wavenumberCm ν of each point, cm⁻¹ (ν = a + n·h₀)
 * @param nodesPerBin E, nodes per output bin (bin edges are multiples of E)
 * @param out weights to fill (length = number of points each)
 * @returns `out`
 */
export function endCorrectedTrapezoidWeights(
  nodeIndex: Float64Array,
  wavenumberCm: Float64Array,
  nodesPerBin: number,
  out: SplitWeights,
): SplitWeights {
  const n = nodeIndex.length
  if (wavenumberCm.length !== n || out.left.length !== n || out.right.length !== n) {
    throw new PhysicsError(
      'INVALID_ARGUMENT',
      'grid, node indices and weights must have one value per point',
    )
  }
  if (!Number.isInteger(nodesPerBin) || nodesPerBin < 1) {
    throw new PhysicsError(
      'INVALID_ARGUMENT',
      `nodesPerBin = ${nodesPerBin} must be a positive integer`,
    )
  }
  for (let i = 1; i < n; i++) {
    if (!(nodeIndex[i] > nodeIndex[i - 1]) || !(wavenumberCm[i] > wavenumberCm[i - 1])) {
      throw new PhysicsError('NOT_MONOTONIC', 'the grid must be strictly increasing', { index: i })
    }
  }
  const { left, right } = out
  left.fill(0)
  right.fill(0)
  let s = 0
  while (s < n - 1) {
    const step = nodeIndex[s + 1] - nodeIndex[s]
    const bin = Math.floor(nodeIndex[s] / nodesPerBin)
    let e = s + 1
    while (
      e < n - 1 &&
      nodeIndex[e + 1] - nodeIndex[e] === step &&
      Math.floor(nodeIndex[e] / nodesPerBin) === bin
    ) {
      e++
    }
    const intervals = e - s
    const h = (wavenumberCm[e] - wavenumberCm[s]) / intervals
    right[s] += 0.5 * h
    for (let i = s + 1; i < e; i++) left[i] += h
    left[e] += 0.5 * h
    if (intervals >= 2) {
      const c = h / 24
      // Start of the run (weights on s, s + 1, s + 2); point s belongs to the run on its right.
      right[s] -= 3 * c
      left[s + 1] += 4 * c
      left[s + 2] -= c
      // End of the run (e, e − 1, e − 2); e − 2 may be the start point s.
      left[e] -= 3 * c
      left[e - 1] += 4 * c
      if (e - 2 === s) right[s] -= c
      else left[e - 2] -= c
    }
    s = e
  }
  return out
}
