/**
 * Angular quadrature for hemispheric fluxes, F = 2π ∫₀¹ I(μ) μ dμ.
 *
 * Every scheme is returned in one normalised form: cosines μᵢ and flux weights wᵢ with
 * F = π Σ wᵢ I(μᵢ) and Σ wᵢ = 1, so that an isotropic radiance I = B gives F = πB exactly.
 * - Gauss–Legendre on [0, 1]: wᵢ = 2 gᵢ μᵢ with gᵢ the Gauss–Legendre weights for ∫₀¹ f dμ.
 * - Gauss–Jacobi with weight μ on [0, 1] (the nodes of P_n^(0,1)(2μ − 1)): wᵢ = 2 hᵢ with hᵢ the
 *   weights for ∫₀¹ μ f dμ.
 * - Diffusivity: one stream at μ = 1/r (r = 1.66, Elsasser 1942, Harvard Meteorological Studies
 *   No. 6 — from memory), w = 1, i.e. F ≈ πI(1/r).
 *
 * Nodes are computed (not tabulated) by Newton iteration on the three-term recurrence of the
 * Jacobi polynomials P_n^(α,β) (α = β = 0 is Legendre), with the roots already found divided out
 * ("Newton with suppression"): starting to the right of all remaining roots of a polynomial with
 * real simple roots, Newton's method decreases monotonically to the largest one.
 * Sources: Abramowitz & Stegun 1964, 22.7.1 (Jacobi recurrence), 25.4.29–25.4.33 (Gauss–Legendre
 * and Gauss–Jacobi weights); Press et al., Numerical Recipes 3rd ed. (2007), §4.6.
 */
import { PhysicsError } from '../errors'

/** Diffusivity factor (secant of the effective zenith angle), Elsasser 1942 (from memory). */
export const DIFFUSIVITY_FACTOR = 1.66

/** Largest number of nodes accepted (the recurrence and root finder are verified to 16). */
export const MAX_QUADRATURE_NODES = 16

/** Kinds of angular quadrature. */
export type AngleQuadratureKind = 'gauss-legendre' | 'gauss-jacobi' | 'diffusivity'

/** How to build an angular quadrature. */
export type AngleQuadratureSpec =
  | { kind: 'gauss-legendre'; nodes: number }
  | { kind: 'gauss-jacobi'; nodes: number }
  | { kind: 'diffusivity'; secant?: number }

/** A normalised angular quadrature: F = π Σ fluxWeights[i] · I(mu[i]); Σ fluxWeights = 1. */
export interface AngleQuadrature {
  kind: AngleQuadratureKind
  /** Cosines of the zenith angle of the streams, in (0, 1], increasing. */
  mu: Float64Array
  /** Flux weights, dimensionless, summing to 1. */
  fluxWeights: Float64Array
}

/** Nodes and weights of a rule on [0, 1]. */
export interface QuadratureRule {
  nodes: Float64Array
  weights: Float64Array
}

function assertNodeCount(n: number): void {
  if (!Number.isInteger(n) || n < 1 || n > MAX_QUADRATURE_NODES) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `number of quadrature nodes = ${n} must be an integer in [1, ${MAX_QUADRATURE_NODES}]`,
      { name: 'nodes', value: n },
    )
  }
}

/**
 * Jacobi polynomial P_n^(α,β)(x) and its derivative by the three-term recurrence
 * (A&S 22.7.1) and its x-derivative. Writes [P, P'] into `out`.
 */
function jacobiWithDerivative(
  n: number,
  alpha: number,
  beta: number,
  x: number,
  out: Float64Array,
): void {
  let p0 = 1
  let d0 = 0
  if (n === 0) {
    out[0] = p0
    out[1] = d0
    return
  }
  let p1 = alpha + 1 + 0.5 * (alpha + beta + 2) * (x - 1)
  let d1 = 0.5 * (alpha + beta + 2)
  const ab = alpha + beta
  const a2b2 = alpha * alpha - beta * beta
  for (let k = 2; k <= n; k++) {
    const c = 2 * k * (k + ab) * (2 * k + ab - 2)
    const s = 2 * k + ab - 1
    const slope = s * (2 * k + ab) * (2 * k + ab - 2)
    const lin = slope * x + s * a2b2
    const back = 2 * (k + alpha - 1) * (k + beta - 1) * (2 * k + ab)
    const p2 = (lin * p1 - back * p0) / c
    const d2 = (slope * p1 + lin * d1 - back * d0) / c
    p0 = p1
    d0 = d1
    p1 = p2
    d1 = d2
  }
  out[0] = p1
  out[1] = d1
}

/**
 * Roots of P_n^(α,β) on (−1, 1) in decreasing order, by Newton iteration with suppression of the
 * roots already found, then one to three polishing Newton steps on P itself.
 */
function jacobiRoots(n: number, alpha: number, beta: number): Float64Array {
  const roots = new Float64Array(n)
  const pd = new Float64Array(2)
  for (let k = 0; k < n; k++) {
    let x = 1
    let converged = false
    for (let iter = 0; iter < 200; iter++) {
      jacobiWithDerivative(n, alpha, beta, x, pd)
      let suppress = 0
      for (let j = 0; j < k; j++) suppress += 1 / (x - roots[j])
      const step = 1 / (pd[1] / pd[0] - suppress)
      x -= step
      if (Math.abs(step) <= 1e-15 * Math.max(1, Math.abs(x))) {
        converged = true
        break
      }
    }
    for (let polish = 0; polish < 3; polish++) {
      jacobiWithDerivative(n, alpha, beta, x, pd)
      if (pd[0] === 0) break
      x -= pd[0] / pd[1]
    }
    if (!converged || !(x > -1 && x < 1)) {
      throw new PhysicsError('OUT_OF_RANGE', 'Jacobi root finding did not converge', { n, k })
    }
    roots[k] = x
  }
  return roots
}

/**
 * Gauss–Legendre nodes and weights on [0, 1] (for ∫₀¹ f(μ) dμ ≈ Σ gᵢ f(μᵢ)).
 *
 * Method: roots xᵢ of the Legendre polynomial P_n by Newton iteration on the recurrence
 * (A&S 22.7.10), weights on [−1, 1] 2/[(1 − xᵢ²) P_n′(xᵢ)²] (A&S 25.4.29), mapped by
 * μ = (1 + x)/2, g = w/2.
 * Notes: exact for polynomials of degree ≤ 2n − 1; nodes and weights to ≈1e-15. n in 1…16.
 * Source: Abramowitz & Stegun 1964, 25.4.29; Numerical Recipes 3rd ed. §4.6.1.
 *
 * @param n number of nodes
 * @returns nodes μᵢ (increasing, dimensionless) and weights gᵢ (sum 1)
 */
export function gaussLegendreUnitInterval(n: number): QuadratureRule {
  assertNodeCount(n)
  const roots = jacobiRoots(n, 0, 0)
  const nodes = new Float64Array(n)
  const weights = new Float64Array(n)
  const pd = new Float64Array(2)
  for (let i = 0; i < n; i++) {
    const x = roots[n - 1 - i]
    jacobiWithDerivative(n, 0, 0, x, pd)
    nodes[i] = 0.5 * (1 + x)
    weights[i] = 1 / ((1 - x * x) * pd[1] * pd[1])
  }
  return { nodes, weights }
}

/**
 * Gauss–Jacobi nodes and weights on [0, 1] for the weight function μ
 * (for ∫₀¹ μ f(μ) dμ ≈ Σ hᵢ f(μᵢ)).
 *
 * Method: with x = 2μ − 1 the weight is (1 + x)/2, i.e. Jacobi α = 0, β = 1. Nodes are the roots
 * of P_n^(0,1) (Newton on A&S 22.7.1); weights on [−1, 1] for (1 + x) are
 * 2^{α+β+1} Γ(n+α+1)Γ(n+β+1)/[Γ(n+α+β+1) n!] / [(1 − x²) P′²] = 4/[(1 − x²) P′²]
 * (A&S 25.4.33 form, Numerical Recipes eq. 4.6.6), mapped by h = w/4.
 * Notes: exact for μ·(polynomial of degree ≤ 2n − 1); Σ hᵢ = 1/2. n in 1…16.
 * Source: Abramowitz & Stegun 1964, 22.7.1 and 25.4.33; Numerical Recipes 3rd ed. §4.6.
 *
 * @param n number of nodes
 * @returns nodes μᵢ (increasing) and weights hᵢ (sum 1/2)
 */
export function gaussJacobiMuUnitInterval(n: number): QuadratureRule {
  assertNodeCount(n)
  const roots = jacobiRoots(n, 0, 1)
  const nodes = new Float64Array(n)
  const weights = new Float64Array(n)
  const pd = new Float64Array(2)
  for (let i = 0; i < n; i++) {
    const x = roots[n - 1 - i]
    jacobiWithDerivative(n, 0, 1, x, pd)
    nodes[i] = 0.5 * (1 + x)
    weights[i] = 1 / ((1 - x * x) * pd[1] * pd[1])
  }
  return { nodes, weights }
}

/**
 * Builds a normalised angular quadrature for hemispheric fluxes.
 *
 * Method: F = 2π ∫₀¹ I μ dμ ≈ π Σ wᵢ I(μᵢ); Gauss–Legendre: wᵢ = 2gᵢμᵢ; Gauss–Jacobi (weight μ):
 * wᵢ = 2hᵢ; diffusivity: μ = 1/r, w = 1 with r = 1.66 by default.
 * Notes: every scheme returns F = πB for isotropic I = B (Σ wᵢ = 1 to rounding). The diffusivity
 * form reproduces the flux transmittance 2E₃(τ) only approximately (e^{−1.66τ}; a few % for
 * τ ≲ 1, worse for thick layers — Feng & Huang 2019, J. Atmos. Sci. 76, 2171).
 * Source: Elsasser 1942 (diffusivity, from memory); Abramowitz & Stegun 1964, ch. 25.
 *
 * @param spec scheme and number of nodes (1…16), or the secant r (≥ 1) for the diffusivity form
 * @returns cosines μᵢ (dimensionless) and flux weights wᵢ (dimensionless)
 */
export function angleQuadrature(spec: AngleQuadratureSpec): AngleQuadrature {
  if (spec.kind === 'diffusivity') {
    const secant = spec.secant ?? DIFFUSIVITY_FACTOR
    if (!Number.isFinite(secant) || secant < 1 || secant > 100) {
      throw new PhysicsError('OUT_OF_RANGE', `diffusivity secant = ${secant} must be in [1, 100]`, {
        name: 'secant',
        value: secant,
      })
    }
    return {
      kind: 'diffusivity',
      mu: Float64Array.of(1 / secant),
      fluxWeights: Float64Array.of(1),
    }
  }
  if (spec.kind === 'gauss-legendre') {
    const rule = gaussLegendreUnitInterval(spec.nodes)
    const fluxWeights = new Float64Array(rule.nodes.length)
    for (let i = 0; i < fluxWeights.length; i++) {
      fluxWeights[i] = 2 * rule.weights[i] * rule.nodes[i]
    }
    return { kind: 'gauss-legendre', mu: rule.nodes, fluxWeights }
  }
  if (spec.kind === 'gauss-jacobi') {
    const rule = gaussJacobiMuUnitInterval(spec.nodes)
    const fluxWeights = new Float64Array(rule.nodes.length)
    for (let i = 0; i < fluxWeights.length; i++) fluxWeights[i] = 2 * rule.weights[i]
    return { kind: 'gauss-jacobi', mu: rule.nodes, fluxWeights }
  }
  throw new PhysicsError('INVALID_ARGUMENT', 'unknown angle quadrature kind', {
    kind: (spec as { kind: unknown }).kind,
  })
}
