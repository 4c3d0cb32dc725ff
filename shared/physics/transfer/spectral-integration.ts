/**
 * Integration weights over a (possibly nonuniform) wavenumber grid, chosen so that integrals over
 * spectral chunks add up exactly to the integral over the whole grid.
 */
import { PhysicsError } from '../errors'

/**
 * Trapezoid-rule weights of a strictly increasing wavenumber grid, optionally restricted to the
 * points [start, end) of that grid (one spectral chunk).
 *
 * Method: ∫ f dν ≈ Σᵢ wᵢ fᵢ with w₀ = (ν₁ − ν₀)/2, wᵢ = (νᵢ₊₁ − νᵢ₋₁)/2, w_last = (ν_N − ν_{N−1})/2
 * computed on the FULL grid; the chunk receives the full-grid weights of its own points, so the
 * sums over disjoint chunks that cover the grid add to the full-grid trapezoid integral.
 * Notes: a grid of one point gets weight 0. Second-order accurate for smooth integrands. A chunk
 * integrated on its own (start = 0, end = chunk length on the chunk's grid) gives half-weights at
 * its ends; such chunks add up correctly only if neighbouring chunks share their edge point.
 * Source: trapezoid rule, e.g. Press et al., Numerical Recipes 3rd ed. (2007), eq. 4.1.11.
 *
 * @param wavenumberCm strictly increasing grid, cm⁻¹
 * @param out weights, cm⁻¹, length end − start
 * @param start first grid index of the chunk (default 0)
 * @param end one past the last grid index of the chunk (default grid length)
 * @returns `out`
 */
export function trapezoidWeightsCm(
  wavenumberCm: Float64Array,
  out: Float64Array,
  start = 0,
  end = wavenumberCm.length,
): Float64Array {
  const n = wavenumberCm.length
  if (!Number.isInteger(start) || !Number.isInteger(end) || start < 0 || end > n || end < start) {
    throw new PhysicsError('INVALID_ARGUMENT', `chunk [${start}, ${end}) is not within the grid`, {
      start,
      end,
      gridLength: n,
    })
  }
  if (out.length !== end - start) {
    throw new PhysicsError('INVALID_ARGUMENT', 'out must have length end − start', {
      outLength: out.length,
      chunkLength: end - start,
    })
  }
  const lo = Math.max(0, start - 1)
  const hi = Math.min(n - 1, end)
  for (let i = lo; i <= hi; i++) {
    const v = wavenumberCm[i]
    if (!Number.isFinite(v) || (i > lo && !(v > wavenumberCm[i - 1]))) {
      throw new PhysicsError(
        'NOT_MONOTONIC',
        'wavenumberCm must be finite and strictly increasing',
        {
          index: i,
        },
      )
    }
  }
  for (let i = start; i < end; i++) {
    const left = i > 0 ? wavenumberCm[i] - wavenumberCm[i - 1] : 0
    const right = i < n - 1 ? wavenumberCm[i + 1] - wavenumberCm[i] : 0
    out[i - start] = 0.5 * (left + right)
  }
  return out
}

/**
 * Integral of a spectrum with given weights, Σ wᵢ fᵢ.
 *
 * Method: weighted sum (the quadrature defined by `trapezoidWeightsCm` or any other weights).
 * Notes: no validation of finiteness inside the loop; lengths must match.
 * Source: trapezoid rule (Numerical Recipes 3rd ed., eq. 4.1.11).
 *
 * @param values spectrum, any unit per cm⁻¹
 * @param weightsCm integration weights, cm⁻¹
 * @returns integral, the spectrum's unit × cm⁻¹
 */
export function integrateWithWeights(values: Float64Array, weightsCm: Float64Array): number {
  if (values.length !== weightsCm.length) {
    throw new PhysicsError('INVALID_ARGUMENT', 'values and weights must have the same length', {
      valuesLength: values.length,
      weightsLength: weightsCm.length,
    })
  }
  let sum = 0
  for (let i = 0; i < values.length; i++) sum += weightsCm[i] * values[i]
  return sum
}
