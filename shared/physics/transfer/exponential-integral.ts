/**
 * Exponential integrals Eₙ(x) = ∫₁^∞ e^{−xt} t^{−n} dt and the slab flux transmittance 2E₃(τ).
 *
 * Sources: Abramowitz & Stegun 1964, §5.1 (definition 5.1.4, series 5.1.12, recurrence 5.1.14,
 * continued fraction 5.1.22); Press et al., Numerical Recipes 3rd ed. (2007), §6.3 (the same
 * series / modified-Lentz continued-fraction split at x = 1).
 */
import { PhysicsError } from '../errors'

/** Euler–Mascheroni constant γ (A&S 6.1.3). */
const EULER_GAMMA = 0.5772156649015329
/** Largest order accepted. */
export const MAX_EXPONENTIAL_INTEGRAL_ORDER = 20
const EPS = Number.EPSILON
const TINY = 1e-300
const MAX_ITER = 500

/**
 * Exponential integral Eₙ(x) for integer n ≥ 0 and real x ≥ 0.
 *
 * Method: E₀(x) = e^{−x}/x. For x ≤ 1 the power series
 * Eₙ(x) = (−x)^{n−1}/(n−1)! [−ln x + ψ(n)] − Σ_{k≠n−1} (−x)^k/[(k − n + 1) k!]
 * (A&S 5.1.12, ψ(n) = −γ + Σ_{m<n} 1/m); for x > 1 the continued fraction
 * Eₙ(x) = e^{−x} · 1/(x + n − 1·n/(x + n + 2 − 2(n+1)/(x + n + 4 − …)))
 * (A&S 5.1.22 in even form) evaluated by the modified Lentz method (Numerical Recipes §6.3).
 * Notes: relative accuracy ≈ 1e-15 (checked against mpmath); Eₙ(0) = 1/(n − 1) for n ≥ 2;
 * E₀(0) and E₁(0) diverge and throw. Underflows to 0 for x ≳ 740.
 * Source: Abramowitz & Stegun 1964, 5.1.12 and 5.1.22; Numerical Recipes 3rd ed., §6.3.
 *
 * @param n order, integer in [0, 20]
 * @param x argument, dimensionless, ≥ 0 and finite
 * @returns Eₙ(x), dimensionless
 */
export function exponentialIntegralEn(n: number, x: number): number {
  if (!Number.isInteger(n) || n < 0 || n > MAX_EXPONENTIAL_INTEGRAL_ORDER) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `order n = ${n} must be an integer in [0, ${MAX_EXPONENTIAL_INTEGRAL_ORDER}]`,
      { name: 'n', value: n },
    )
  }
  if (!Number.isFinite(x) || x < 0) {
    throw new PhysicsError('OUT_OF_RANGE', `x = ${x} must be finite and ≥ 0`, {
      name: 'x',
      value: x,
    })
  }
  if (x === 0) {
    if (n <= 1) {
      throw new PhysicsError('OUT_OF_RANGE', `E_${n}(0) diverges`, { name: 'x', value: x, n })
    }
    return 1 / (n - 1)
  }
  if (n === 0) return Math.exp(-x) / x
  const nm1 = n - 1
  if (x > 1) {
    // Modified Lentz evaluation of the continued fraction.
    let b = x + n
    let c = 1 / TINY
    let d = 1 / b
    let h = d
    for (let i = 1; i <= MAX_ITER; i++) {
      const an = -i * (nm1 + i)
      b += 2
      d = 1 / (an * d + b)
      c = b + an / c
      const del = c * d
      h *= del
      if (Math.abs(del - 1) <= EPS) return h * Math.exp(-x)
    }
    throw new PhysicsError('OUT_OF_RANGE', 'E_n continued fraction did not converge', { n, x })
  }
  // Power series.
  let ans = nm1 !== 0 ? 1 / nm1 : -Math.log(x) - EULER_GAMMA
  let fact = 1
  for (let i = 1; i <= MAX_ITER; i++) {
    fact *= -x / i
    let del: number
    if (i !== nm1) {
      del = -fact / (i - nm1)
    } else {
      let psi = -EULER_GAMMA
      for (let m = 1; m <= nm1; m++) psi += 1 / m
      del = fact * (-Math.log(x) + psi)
    }
    ans += del
    if (Math.abs(del) < Math.abs(ans) * EPS) return ans
  }
  throw new PhysicsError('OUT_OF_RANGE', 'E_n series did not converge', { n, x })
}

/**
 * Diffuse (flux) transmittance of a homogeneous non-scattering slab, 2E₃(τ).
 *
 * Method: T_F(τ) = 2∫₀¹ e^{−τ/μ} μ dμ = 2E₃(τ) (A&S 5.1.4 with t = 1/μ).
 * Notes: T_F(0) = 1; for large τ it behaves like 2e^{−τ}/τ. The diffusivity approximation
 * replaces it by e^{−1.66τ} (Elsasser 1942, from memory).
 * Source: Goody & Yung 1989, Atmospheric Radiation, §2.4 (slab transmission functions);
 * Abramowitz & Stegun 1964, 5.1.4.
 *
 * @param opticalDepth vertical optical depth τ, dimensionless, ≥ 0
 * @returns flux transmittance, dimensionless, in [0, 1]
 */
export function fluxTransmittance(opticalDepth: number): number {
  return 2 * exponentialIntegralEn(3, opticalDepth)
}
