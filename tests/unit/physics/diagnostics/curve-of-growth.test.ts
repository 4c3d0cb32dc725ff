import { describe, expect, it } from 'vitest'
import {
  besselI0Scaled,
  besselI1Scaled,
  equivalentWidthCm,
  ladenburgReicheFunction,
  lorentzEquivalentWidthCm,
} from '../../../../shared/physics/diagnostics/curve-of-growth'
import { PhysicsError } from '../../../../shared/physics/errors'
import fixture from '../fixtures/transfer-reference.json'
import { expectRelClose } from '../transfer/expect-close'

describe('scaled Bessel functions', () => {
  it('when 1e-6 ≤ x ≤ 1e5 (across the series/asymptotic switch at 30), match mpmath besseli·e^{−x} (rel 1e-14)', () => {
    // mpmath 1.2.1 besseli at 30 digits (fixture); SciPy i0e/i1e agree to rounding.
    expect(fixture.bessel).toHaveLength(16)
    for (const row of fixture.bessel) {
      expectRelClose(besselI0Scaled(row.x), row.i0e, 1e-14, `i0e(${row.x})`)
      expectRelClose(besselI1Scaled(row.x), row.i1e, 1e-14, `i1e(${row.x})`)
    }
    expect(besselI0Scaled(0)).toBe(1)
    expect(besselI1Scaled(0)).toBe(0)
  })
})

describe('ladenburgReicheFunction', () => {
  it('when x = 0.01…100, returns the L(x) table to its printed 6 decimals', () => {
    // Ladenburg & Reiche 1913, Ann. Phys. 42, 181 (form from memory); values of
    // x e^{−x}[I₀(x) + I₁(x)] to 6 decimals, agreeing with mpmath 1.2.1 (abs 5e-7).
    const table: [number, number][] = [
      [0.01, 0.00995],
      [0.1, 0.09524],
      [1, 0.67367],
      [10, 2.49096],
      [100, 7.968853],
    ]
    for (const [x, v] of table) expectRelClose(ladenburgReicheFunction(x), v, 6e-7 / v, `x=${x}`)
  })

  it('when compared with mpmath, agrees to rel 1e-14', () => {
    for (const row of fixture.ladenburgReiche) {
      expectRelClose(ladenburgReicheFunction(row.x), row.value, 1e-14, `x=${row.x}`)
    }
  })
})

describe('lorentzEquivalentWidthCm', () => {
  const s = 1e-19 // cm⁻¹/(molecule cm⁻²)
  const alpha = 0.07 // cm⁻¹

  it('when the line is weak (x = 1e-6), returns W = S u (rel 1e-6)', () => {
    // Weak limit W → S u (Ladenburg & Reiche 1913; from memory); L(x) = x(1 − x/2 + …), so rel
    // error ≈ x/2.
    const u = (1e-6 * 2 * Math.PI * alpha) / s
    expectRelClose(lorentzEquivalentWidthCm(s, u, alpha), s * u, 1e-6)
  })

  it('when the line is strong (x = 1e6), returns W = 2√(S α u) (rel 1e-6)', () => {
    // Strong (square-root) limit (Ladenburg & Reiche 1913; from memory);
    // L(x) = √(2x/π)(1 − 1/(8x) + …).
    const u = (1e6 * 2 * Math.PI * alpha) / s
    expectRelClose(lorentzEquivalentWidthCm(s, u, alpha), 2 * Math.sqrt(s * alpha * u), 1e-6)
  })

  it('when integrated numerically on a nonuniform grid, equivalentWidthCm matches Ladenburg–Reiche (rel 1e-5)', () => {
    // W = ∫(1 − e^{−τ})dν for τ = S u α/(π(Δν² + α²)); grid ±5000 cm⁻¹, fine near the centre and
    // geometric outward; the far wings beyond ±D add ≈ 2 S u α/(πD) (Lorentz tail, analytic).
    for (const x of [0.1, 1, 10, 100]) {
      const u = (x * 2 * Math.PI * alpha) / s
      const half: number[] = []
      let d = 0
      while (d < 5000) {
        half.push(d)
        d += Math.min(0.0005 + d * 0.003, 2)
      }
      const nu = Float64Array.from([
        ...half
          .slice(1)
          .reverse()
          .map((v) => -v),
        ...half,
      ])
      const tau = nu.map((v) => (s * u * alpha) / (Math.PI * (v * v + alpha * alpha)))
      const edge = -nu[0]
      const tail = (2 * s * u * alpha) / (Math.PI * edge)
      const w = equivalentWidthCm(nu, tau) + tail
      expectRelClose(w, lorentzEquivalentWidthCm(s, u, alpha), 1e-5, `x=${x}`)
    }
  })

  it('when inputs are invalid, throws PhysicsError', () => {
    expect(() => lorentzEquivalentWidthCm(0, 1, 0.1)).toThrow(PhysicsError)
    expect(() => lorentzEquivalentWidthCm(1e-20, -1, 0.1)).toThrow(PhysicsError)
    expect(() => ladenburgReicheFunction(-1)).toThrow(PhysicsError)
    expect(() => equivalentWidthCm(Float64Array.of(1, 1), Float64Array.of(0, 0))).toThrow(
      PhysicsError,
    )
  })
})
