import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  heatingRateFromUpDownKPerDay,
  heatingRateKPerDay,
} from '../../../../shared/physics/transfer/heating-rate'
import { angleQuadrature } from '../../../../shared/physics/transfer/quadrature'
import { solveSchwarzschild } from '../../../../shared/physics/transfer/schwarzschild'
import { expectRelClose } from './expect-close'

describe('heatingRateKPerDay', () => {
  it('when net upward flux grows by 10 W m⁻² across 100 hPa, returns −0.84392 K/day (hand calculation)', () => {
    // Hand calculation: (g/c_p)·ΔF_net/Δp·86400 = (9.80665/1004)·(100 − 110)/10000·86400
    // = −0.843919 K/day (g standard gravity, CGPM; c_p = 1004 J kg⁻¹ K⁻¹, common practice).
    // The layer exports 10 W m⁻² more at its top than it receives at its bottom: cooling.
    const out = heatingRateKPerDay([100000, 90000], [100, 110], new Float64Array(1))
    expectRelClose(out[0], -0.8439188844621512, 1e-14)
  })

  it('when the net flux decreases upward, returns warming (positive), and scales with g/c_p', () => {
    // Same hand formula with ΔF_net = +50 W m⁻² over 50 hPa and c_p doubled: +4.2196 K/day.
    const out = heatingRateKPerDay([50000, 45000], [60, 10], new Float64Array(1), {
      specificHeatJPerKgK: 2008,
    })
    expectRelClose(out[0], 8.439188844621512 / 2, 1e-14)
  })

  it('when up and down fluxes are given separately, returns the same as from the net flux', () => {
    const p = [100000, 80000, 50000]
    const up = [390, 370, 300]
    const down = [320, 250, 120]
    const a = heatingRateFromUpDownKPerDay(p, up, down, new Float64Array(2))
    const b = heatingRateKPerDay(p, [70, 120, 180], new Float64Array(2))
    expect(Array.from(a)).toEqual(Array.from(b))
  })

  it('when an isothermal column radiates to cold space, returns cooling in the top layer', () => {
    // Sign check with the solver: the top layer emits to space and receives nothing from above
    // (common practice: "cooling to space").
    const nu = Float64Array.from({ length: 11 }, (_, i) => 600 + 10 * i)
    const res = solveSchwarzschild({
      wavenumberCm: nu,
      layerOpticalDepth: [0.5, 0.5, 0.5].map((t) => new Float64Array(11).fill(t)),
      levelTemperatureK: [260, 260, 260, 260],
      surfaceTemperatureK: 260,
      surfaceEmissivity: 1,
      quadrature: angleQuadrature({ kind: 'gauss-legendre', nodes: 4 }),
    })
    const h = heatingRateKPerDay(
      [100000, 70000, 40000, 10000],
      res.fluxNetUpWPerM2,
      new Float64Array(3),
    )
    expect(h[2]).toBeLessThan(0)
    expect(h[2]).toBeLessThan(h[0])
  })

  it('when pressures do not decrease upward or lengths differ, throws PhysicsError', () => {
    expect(() => heatingRateKPerDay([1000, 1000], [1, 2], new Float64Array(1))).toThrow(
      PhysicsError,
    )
    expect(() => heatingRateKPerDay([1000, 2000], [1, 2], new Float64Array(1))).toThrow(
      PhysicsError,
    )
    expect(() => heatingRateKPerDay([1000, 500], [1], new Float64Array(1))).toThrow(PhysicsError)
    expect(() =>
      heatingRateKPerDay([1000, 500], [1, 2], new Float64Array(1), { gravityMPerS2: 0 }),
    ).toThrow(PhysicsError)
  })
})
