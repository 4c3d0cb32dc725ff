import { describe, expect, it } from 'vitest'
import { fitLogarithmicForcing } from '../../../../shared/physics/diagnostics/log-fit'
import { PhysicsError } from '../../../../shared/physics/errors'
import fixture from '../fixtures/transfer-reference.json'
import { expectRelClose } from '../transfer/expect-close'

describe('fitLogarithmicForcing', () => {
  it('when the data follow 5.35 ln(C/C₀) exactly, returns a = 5.35, b = 0, R² = 1, 3.708 per doubling', () => {
    // Myhre et al. 1998 (GRL 25, 2715) form; 5.35 ln 2 = 3.708 W m⁻² (computed by hand).
    const c = [280, 350, 420, 560, 1120]
    const f = c.map((v) => 5.35 * Math.log(v / 280))
    const fit = fitLogarithmicForcing(c, f, 280)
    expectRelClose(fit.slopeWPerM2, 5.35, 1e-13)
    expect(Math.abs(fit.interceptWPerM2)).toBeLessThan(1e-13)
    expectRelClose(fit.rSquared, 1, 1e-13)
    expectRelClose(fit.perDoublingWPerM2, 3.708, 2e-4)
  })

  it('when the data are noisy, returns the numpy polyfit slope, intercept and R² (rel 1e-12)', () => {
    // numpy 1.24.2 polyfit(ln(C/C₀), ΔF, 1) (fixture transfer-reference.json).
    const d = fixture.logFit
    const fit = fitLogarithmicForcing(d.concentrations, d.forcingWPerM2, d.referenceConcentration)
    expectRelClose(fit.slopeWPerM2, d.slope, 1e-12)
    expectRelClose(fit.interceptWPerM2, d.intercept, 1e-10)
    expectRelClose(fit.rSquared, d.rSquared, 1e-12)
    const origin = fitLogarithmicForcing(
      d.concentrations,
      d.forcingWPerM2,
      d.referenceConcentration,
      true,
    )
    expectRelClose(origin.slopeWPerM2, d.slopeThroughOrigin, 1e-12)
    expect(origin.interceptWPerM2).toBe(0)
    expectRelClose(origin.rSquared, d.rSquaredThroughOrigin, 1e-12)
  })

  it('when fewer than two points, equal concentrations or non-positive values are given, throws PhysicsError', () => {
    expect(() => fitLogarithmicForcing([280], [0], 280)).toThrow(PhysicsError)
    expect(() => fitLogarithmicForcing([400, 400], [1, 2], 280)).toThrow(PhysicsError)
    expect(() => fitLogarithmicForcing([0, 400], [1, 2], 280)).toThrow(PhysicsError)
    expect(() => fitLogarithmicForcing([300, 400], [1, 2], 0)).toThrow(PhysicsError)
  })
})
