import { describe, expect, it } from 'vitest'
import { C1L_W_PER_M2_SR_CM4, C2_CM_K } from '../../../../shared/physics/constants'
import { brightnessTemperatureSpectrumK } from '../../../../shared/physics/diagnostics/brightness-temperature'
import { PhysicsError } from '../../../../shared/physics/errors'
import { angleQuadrature } from '../../../../shared/physics/transfer/quadrature'
import { solveSchwarzschild } from '../../../../shared/physics/transfer/schwarzschild'
import { expectRelClose } from '../transfer/expect-close'

/** Local Planck function (Goody & Yung 1989 eq. 1.1, CODATA 2018 constants). */
function planck(nuCm: number, tK: number): number {
  return (C1L_W_PER_M2_SR_CM4 * nuCm ** 3) / Math.expm1((C2_CM_K * nuCm) / tK)
}

describe('brightnessTemperatureSpectrumK', () => {
  it('when given blackbody radiances, returns their temperatures (rel 1e-13)', () => {
    // Round trip through the Planck function (analytic inverse).
    const nu = Float64Array.of(100, 667, 1000, 2349)
    const temps = [180, 220, 288, 320]
    const radiance = nu.map((v, i) => planck(v, temps[i]))
    const tb = brightnessTemperatureSpectrumK(nu, radiance, new Float64Array(4))
    temps.forEach((t, i) => expectRelClose(tb[i], t, 1e-13, `ν=${nu[i]}`))
  })

  it('when given B(667 cm⁻¹, 288 K) = 0.130906, returns 288 K (rel 2e-6)', () => {
    // Planck function with CODATA 2018 constants, computed (6 digits): B(667, 288) = 0.130906,
    // B(1000, 288) = 0.081142, B(500, 250) = 0.088774. 6 digits in B → ~1e-6 in T.
    const tb = brightnessTemperatureSpectrumK(
      Float64Array.of(667, 1000, 500),
      Float64Array.of(0.130906, 0.081142, 0.088774),
      new Float64Array(3),
    )
    expectRelClose(tb[0], 288, 2e-6)
    expectRelClose(tb[1], 288, 2e-6)
    expectRelClose(tb[2], 250, 2e-6)
  })

  it('when an opaque isothermal layer is viewed from space, returns its temperature at every ν', () => {
    const nu = Float64Array.from({ length: 5 }, (_, i) => 650 + 5 * i)
    const res = solveSchwarzschild({
      wavenumberCm: nu,
      layerOpticalDepth: [new Float64Array(5).fill(1e3)],
      levelTemperatureK: [230, 230],
      surfaceTemperatureK: 300,
      surfaceEmissivity: 1,
      quadrature: angleQuadrature({ kind: 'gauss-legendre', nodes: 2 }),
      viewingMu: [1],
    })
    const tb = brightnessTemperatureSpectrumK(nu, res.toaRadianceUp[0], new Float64Array(5))
    for (const t of tb) expectRelClose(t, 230, 1e-13)
  })

  it('when radiance is zero, returns 0 K; when negative, throws PhysicsError', () => {
    const out = brightnessTemperatureSpectrumK(
      Float64Array.of(700),
      Float64Array.of(0),
      new Float64Array(1),
    )
    expect(out[0]).toBe(0)
    expect(() =>
      brightnessTemperatureSpectrumK(
        Float64Array.of(700),
        Float64Array.of(-1e-9),
        new Float64Array(1),
      ),
    ).toThrow(PhysicsError)
    expect(() =>
      brightnessTemperatureSpectrumK(
        Float64Array.of(700, 701),
        Float64Array.of(1),
        new Float64Array(2),
      ),
    ).toThrow(PhysicsError)
  })
})
