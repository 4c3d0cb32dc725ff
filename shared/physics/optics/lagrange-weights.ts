/**
 * Cubic (4-point) Lagrange weights on nodes −1, 0, 1, 2 for t = j/r, j = 0 … r − 1, 4 per fine
 * position, with the exact copy at t = 0 (a fine node on a coarse node takes its value). Used by
 * both multigrid optics paths to interpolate a coarser level onto a finer one.
 * Source: Lagrange interpolation, Abramowitz & Stegun 1964, 25.2.13 (from memory).
 */
export function lagrangeWeights(ratio: number): Float64Array {
  const weights = new Float64Array(4 * ratio)
  for (let j = 0; j < ratio; j++) {
    const t = j / ratio
    weights[4 * j] = (-t * (t - 1) * (t - 2)) / 6
    weights[4 * j + 1] = ((t + 1) * (t - 1) * (t - 2)) / 2
    weights[4 * j + 2] = (-(t + 1) * t * (t - 2)) / 2
    weights[4 * j + 3] = ((t + 1) * t * (t - 1)) / 6
  }
  weights[0] = 0
  weights[1] = 1
  weights[2] = 0
  weights[3] = 0
  return weights
}
