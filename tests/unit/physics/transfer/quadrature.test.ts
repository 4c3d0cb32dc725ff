import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  DIFFUSIVITY_FACTOR,
  angleQuadrature,
  gaussJacobiMuUnitInterval,
  gaussLegendreUnitInterval,
} from '../../../../shared/physics/transfer/quadrature'
import fixture from '../fixtures/transfer-reference.json'
import { expectRelClose } from './expect-close'

describe('gaussLegendreUnitInterval', () => {
  // Gauss–Legendre rule mapped to [0, 1], computed (8 significant digits); the [−1, 1] rule is
  // tabulated in Abramowitz & Stegun Table 25.4 (from memory).
  const table: [number, number[], number[]][] = [
    [1, [0.5], [1]],
    [2, [0.21132487, 0.78867513], [0.5, 0.5]],
    [3, [0.11270167, 0.5, 0.88729833], [0.27777778, 0.44444444, 0.27777778]],
    [
      4,
      [0.06943184, 0.33000948, 0.66999052, 0.93056816],
      [0.17392742, 0.32607258, 0.32607258, 0.17392742],
    ],
  ]
  it.each(table)('when n = %i, returns the tabulated nodes and weights (rel 1e-7)', (n, x, w) => {
    const rule = gaussLegendreUnitInterval(n)
    for (let i = 0; i < n; i++) {
      expectRelClose(rule.nodes[i], x[i], 1e-7, `node ${i}`)
      expectRelClose(rule.weights[i], w[i], 1e-7, `weight ${i}`)
    }
  })

  it('when n = 1…8, returns the SciPy roots_legendre nodes and weights (rel 1e-13)', () => {
    // SciPy 1.10 special.roots_legendre mapped to [0, 1] (fixture transfer-reference.json).
    expect(fixture.gaussLegendre01).toHaveLength(8)
    for (const row of fixture.gaussLegendre01) {
      const rule = gaussLegendreUnitInterval(row.n)
      for (let i = 0; i < row.n; i++) {
        expectRelClose(rule.nodes[i], row.nodes[i], 1e-13, `n=${row.n} node ${i}`)
        expectRelClose(rule.weights[i], row.weights[i], 1e-13, `n=${row.n} weight ${i}`)
      }
    }
  })

  it('when n = 1…16, integrates μ^k exactly for k ≤ 2n − 1 (rel 1e-13)', () => {
    // Exactness degree of Gauss quadrature (Abramowitz & Stegun 1964, 25.4.29); ∫₀¹ μ^k dμ = 1/(k+1).
    for (let n = 1; n <= 16; n++) {
      const rule = gaussLegendreUnitInterval(n)
      for (let k = 0; k <= 2 * n - 1; k++) {
        let s = 0
        for (let i = 0; i < n; i++) s += rule.weights[i] * rule.nodes[i] ** k
        expectRelClose(s, 1 / (k + 1), 1e-13, `n=${n} k=${k}`)
      }
    }
  })
})

describe('gaussJacobiMuUnitInterval', () => {
  // Gauss–Jacobi rule for weight μ on [0, 1], computed; weights normalised to sum 1 (= 2 h_i).
  const table: [number, number[], number[]][] = [
    [1, [2 / 3], [1]],
    [2, [0.35505103, 0.84494897], [0.36391724, 0.63608276]],
    [3, [0.21234054, 0.59053314, 0.91141204], [0.13965396, 0.45848221, 0.40186383]],
  ]
  it.each(table)('when n = %i, returns the tabulated nodes and weights (rel 1e-7)', (n, x, w) => {
    const rule = gaussJacobiMuUnitInterval(n)
    for (let i = 0; i < n; i++) {
      expectRelClose(rule.nodes[i], x[i], 1e-7, `node ${i}`)
      expectRelClose(2 * rule.weights[i], w[i], 1e-7, `weight ${i}`)
    }
  })

  it('when n = 1…8, returns the SciPy roots_jacobi(n, 0, 1) nodes and weights (rel 1e-13)', () => {
    // SciPy 1.10 special.roots_jacobi, mapped to [0, 1], weights normalised to sum 1.
    expect(fixture.gaussJacobiMu01).toHaveLength(8)
    for (const row of fixture.gaussJacobiMu01) {
      const rule = gaussJacobiMuUnitInterval(row.n)
      for (let i = 0; i < row.n; i++) {
        expectRelClose(rule.nodes[i], row.nodes[i], 1e-13, `n=${row.n} node ${i}`)
        expectRelClose(2 * rule.weights[i], row.weights[i], 1e-13, `n=${row.n} weight ${i}`)
      }
    }
  })

  it('when n = 1…16, integrates μ·μ^k exactly for k ≤ 2n − 1 (rel 1e-13)', () => {
    // ∫₀¹ μ^{k+1} dμ = 1/(k+2); Gauss–Jacobi exactness (A&S 25.4.33).
    for (let n = 1; n <= 16; n++) {
      const rule = gaussJacobiMuUnitInterval(n)
      for (let k = 0; k <= 2 * n - 1; k++) {
        let s = 0
        for (let i = 0; i < n; i++) s += rule.weights[i] * rule.nodes[i] ** k
        expectRelClose(s, 1 / (k + 2), 1e-13, `n=${n} k=${k}`)
      }
    }
  })
})

describe('angleQuadrature', () => {
  it('when the radiance is isotropic, every scheme returns F = πB (rel 1e-14)', () => {
    // With I = B every scheme must return F = πB exactly (2π∫₀¹ B μ dμ = πB).
    const b = 0.130906 // any radiance; B(667 cm⁻¹, 288 K), computed (CODATA 2018)
    const specs = [
      ...Array.from({ length: 8 }, (_, i) => ({ kind: 'gauss-legendre' as const, nodes: i + 1 })),
      ...Array.from({ length: 8 }, (_, i) => ({ kind: 'gauss-jacobi' as const, nodes: i + 1 })),
      { kind: 'diffusivity' as const },
    ]
    for (const spec of specs) {
      const q = angleQuadrature(spec)
      let f = 0
      for (let i = 0; i < q.mu.length; i++) f += Math.PI * q.fluxWeights[i] * b
      expectRelClose(f, Math.PI * b, 1e-14, JSON.stringify(spec))
    }
  })

  it('when diffusivity is chosen, returns one stream at μ = 1/1.66 with weight 1', () => {
    // Diffusivity factor 1.66, Elsasser 1942, Harvard Meteorological Studies No. 6 (from memory).
    const q = angleQuadrature({ kind: 'diffusivity' })
    expect(DIFFUSIVITY_FACTOR).toBe(1.66)
    expect(q.mu).toHaveLength(1)
    expectRelClose(q.mu[0], 1 / 1.66, 1e-15)
    expect(q.fluxWeights[0]).toBe(1)
    expectRelClose(angleQuadrature({ kind: 'diffusivity', secant: 2 }).mu[0], 0.5, 1e-15)
  })

  it('when the node count or secant is invalid, throws PhysicsError', () => {
    expect(() => angleQuadrature({ kind: 'gauss-legendre', nodes: 0 })).toThrow(PhysicsError)
    expect(() => angleQuadrature({ kind: 'gauss-jacobi', nodes: 2.5 })).toThrow(PhysicsError)
    expect(() => angleQuadrature({ kind: 'gauss-legendre', nodes: 17 })).toThrow(PhysicsError)
    expect(() => angleQuadrature({ kind: 'diffusivity', secant: 0.5 })).toThrow(PhysicsError)
  })
})
