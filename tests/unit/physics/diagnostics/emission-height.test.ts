import { describe, expect, it } from 'vitest'
import {
  createEmissionLevelResult,
  emissionLevel,
} from '../../../../shared/physics/diagnostics/emission-height'
import { PhysicsError } from '../../../../shared/physics/errors'
import { expectRelClose } from '../transfer/expect-close'

/**
 * Isothermal column: z = H ln(p_s/p) (hydrostatic, scale height H), and an absorber with
 * τ_cum(p) = τ_s (p/p_s)^n (n = 2: pressure-broadened, uniformly mixed; n = 1: pure mass path).
 * The τ = 1 level is p₁ = p_s τ_s^{−1/n} (analytic).
 */
function column(tauSurface: number, power: number, pressures: number[]) {
  const ps = 100000
  const scaleHeightM = 7000
  const heights = pressures.map((p) => (p > 0 ? scaleHeightM * Math.log(ps / p) : 1e5))
  const cum = (p: number) => tauSurface * (p / ps) ** power
  const layers: Float64Array[] = []
  for (let l = 0; l < pressures.length - 1; l++) {
    layers.push(Float64Array.of(cum(pressures[l]) - cum(pressures[l + 1])))
  }
  return { ps, scaleHeightM, heights, layers }
}

describe('emissionLevel', () => {
  // Levels evenly spaced in ln p, with a top level at p = 0 so that the column above the
  // crossing is complete (τ_cum at each level is then exactly τ_s (p/p_s)^n).
  const pressures = [...Array.from({ length: 41 }, (_, i) => 100000 * Math.exp(-i * 0.2)), 0]

  it('when τ_cum ∝ p², returns p₁ = p_s/√τ_s and z = H ln(p_s/p₁) exactly (log interpolation, rel 1e-12)', () => {
    // Analytic: the log–log interpolation is exact for a power law within a layer.
    for (const tauS of [3, 50, 1e4]) {
      const { ps, scaleHeightM, heights, layers } = column(tauS, 2, pressures)
      const out = emissionLevel(layers, pressures, heights, createEmissionLevelResult(1))
      const p1 = ps / Math.sqrt(tauS)
      expectRelClose(out.pressurePa[0], p1, 1e-12, `τ_s=${tauS}`)
      expectRelClose(out.heightM[0], scaleHeightM * Math.log(ps / p1), 1e-12)
      expect(out.reachesSurface[0]).toBe(0)
    }
  })

  it('when a slant path μ = 0.5 is chosen, returns the level where τ_cum = μ (rel 1e-12)', () => {
    // Slant optical depth τ/μ reaches 1 where τ = μ: p = p_s √(μ/τ_s) (analytic).
    const { ps, layers, heights } = column(50, 2, pressures)
    const out = emissionLevel(layers, pressures, heights, createEmissionLevelResult(1), { mu: 0.5 })
    expectRelClose(out.pressurePa[0], ps * Math.sqrt(0.5 / 50), 1e-12)
  })

  it('when the crossing lies in the top layer reaching p = 0, returns the linear-in-p level (rel 1e-12)', () => {
    // τ_cum = τ_s p/p_s (n = 1) with the top level at p = 0: τ = 1 at p = p_s/τ_s.
    const p = [100000, 50000, 20000, 0]
    const { layers, heights } = column(1.5e5 / 1e5 / 0.2, 1, p)
    const out = emissionLevel(layers, p, heights, createEmissionLevelResult(1))
    expectRelClose(out.pressurePa[0], 100000 / 7.5, 1e-12)
  })

  it('when the column is thinner than the threshold, returns the surface and sets the flag', () => {
    const { layers, heights } = column(0.5, 2, pressures)
    const out = emissionLevel(layers, pressures, heights, createEmissionLevelResult(1))
    expect(out.pressurePa[0]).toBe(100000)
    expect(out.heightM[0]).toBe(0)
    expect(out.reachesSurface[0]).toBe(1)
  })

  it('when levels are not monotonic or τ is negative, throws PhysicsError', () => {
    const layer = [Float64Array.of(1)]
    const out = createEmissionLevelResult(1)
    expect(() => emissionLevel(layer, [1000, 2000], [0, 100], out)).toThrow(PhysicsError)
    expect(() => emissionLevel([Float64Array.of(-1)], [2000, 1000], [0, 100], out)).toThrow(
      PhysicsError,
    )
    expect(() => emissionLevel(layer, [2000, 1000], [0, 100], out, { mu: 0 })).toThrow(PhysicsError)
  })
})
