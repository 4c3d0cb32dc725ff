import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { computeReferenceOpticalDepth } from '../../../../shared/physics/optics/reference-optical-depth'
import { dopplerHalfWidthCm, toLineTable } from '../../../../shared/physics/spectroscopy'
import fixture from '../fixtures/optics-reference.json'
import { expectRelativeClose } from '../../../support/expect-close'
import { ATM_PA, co2Line, molarMassForDopplerWidth, trapezoid } from './optics-test-helpers'
import { singleLayer } from './synthetic-band'

const SQRT_LN2 = Math.sqrt(Math.LN2)

describe('computeReferenceOpticalDepth', () => {
  it('when a line has y = 1, returns S·u·√(ln2/π)/α_D·K(x, 1) at x = 0, 1, 3, 10', () => {
    // K(x, 1) = Re w(x + i): 0.42758357616, 0.30474420526, 0.065317777289, 5.6699425669e-3
    // (computed with SciPy's scipy.special.wofz). Voigt profile normalisation: Armstrong 1967
    // (from memory).
    const step = 2 ** -12
    const centre = Math.round(667.3 / step) * step
    const alphaTarget = 8 * step * SQRT_LN2 // x = 1 at 8 grid steps from the centre
    const mass = molarMassForDopplerWidth(centre, 296, alphaTarget)
    const alphaD = dopplerHalfWidthCm(centre, 296, mass)
    const gamma = alphaD / SQRT_LN2 // y = 1
    const lines = toLineTable([
      co2Line({ wavenumberCm: centre, airHalfWidthCmPerAtm: gamma, selfHalfWidthCmPerAtm: gamma }),
    ])
    const column = 1e19
    const result = computeReferenceOpticalDepth({
      lines,
      layers: [singleLayer(ATM_PA, 296, column)],
      startCm: centre - 0.01,
      endCm: centre + 0.1,
      stepCm: step,
      options: { molarMassLookup: () => mass },
    })
    const peak = (1e-19 * column * Math.sqrt(Math.LN2 / Math.PI)) / alphaD
    const index = (k: number): number =>
      Math.round((centre - result.wavenumberCm[0]) / step) + 8 * k
    const tau = result.opticalDepth[0]
    expectRelativeClose(tau[index(0)], peak * 0.42758357616, 1e-9, 'x = 0')
    expectRelativeClose(tau[index(1)], peak * 0.30474420526, 1e-9, 'x = 1')
    expectRelativeClose(tau[index(3)], peak * 0.065317777289, 1e-9, 'x = 3')
    expectRelativeClose(tau[index(10)], peak * 5.6699425669e-3, 1e-9, 'x = 10')
  })

  it('when one Lorentz-like line is integrated, returns S·u·(2/π)·atan(cutoff/γ)', () => {
    // Beer–Lambert: ∫τ dν = S·u for the whole line (Goody & Yung 1989 §3, from memory); plain
    // truncation at ±c keeps ∫_{−c}^{c} f_L = (2/π) atan(c/γ) (elementary integral). Here
    // γ/α_D ≈ 113, so the Voigt wing equals the Lorentz wing to O(α_D²/c²).
    const lines = toLineTable([co2Line()])
    const column = 1e19
    const step = 2 ** -6
    const result = computeReferenceOpticalDepth({
      lines,
      layers: [singleLayer(ATM_PA, 296, column)],
      startCm: 637,
      endCm: 698,
      stepCm: step,
    })
    const expected = 1e-19 * column * (2 / Math.PI) * Math.atan(25 / 0.07)
    expectRelativeClose(trapezoid(result.opticalDepth[0], step), expected, 1e-5)
  })

  it('when compared with an independent SciPy evaluation (three lines, 1 and 1e-3 atm), agrees to 1e-7', () => {
    // tests/unit/physics/fixtures/optics-reference.json from scripts/fixtures/optics-reference.py
    // (scipy.special.wofz and scipy.constants; versions recorded in the fixture). Measured: 3.5e-15
    // (1 atm) and 1.7e-11 (1e-3 atm); the bound is the Weideman K budget (≤ 1e-8) with margin.
    const lines = toLineTable(
      fixture.lines.map((line) =>
        co2Line({
          wavenumberCm: line.wavenumberCm,
          intensityCmPerMolecule: line.intensityCmPerMolecule,
          airHalfWidthCmPerAtm: line.airHalfWidthCmPerAtm,
          selfHalfWidthCmPerAtm: line.selfHalfWidthCmPerAtm,
        }),
      ),
    )
    let compared = 0
    for (const testCase of fixture.cases) {
      const points = testCase.points
      const layer = singleLayer(
        testCase.pressureAtm * ATM_PA,
        fixture.temperatureK,
        fixture.co2ColumnMoleculesPerCm2,
        fixture.co2Vmr,
      )
      const maxTau = Math.max(...points.map((p) => p[2]))
      const result = computeReferenceOpticalDepth({
        lines,
        layers: [layer],
        startCm: points[0][1],
        endCm: points[points.length - 1][1],
        stepCm: fixture.stepCm,
        options: { wingCutoffCm: fixture.cutoffCm },
      })
      const firstIndex = points[0][0]
      for (const [gridIndex, wavenumberCm, expected] of points) {
        const i = gridIndex - firstIndex
        expect(result.wavenumberCm[i]).toBe(wavenumberCm)
        const actual = result.opticalDepth[0][i]
        if (expected === 0) expect(actual).toBe(0)
        else expectRelativeClose(actual, expected, 1e-7, `${testCase.name} ν = ${wavenumberCm}`)
        expect(Math.abs(actual - expected)).toBeLessThanOrEqual(1e-7 * maxTau)
        compared++
      }
    }
    expect(compared).toBe(68)
  })

  it('when the inputs are invalid, throws', () => {
    const lines = toLineTable([co2Line()])
    const layers = [singleLayer(ATM_PA, 296, 1e19)]
    expect(() =>
      computeReferenceOpticalDepth({ lines, layers, startCm: 700, endCm: 600, stepCm: 0.01 }),
    ).toThrow(PhysicsError)
    expect(() =>
      computeReferenceOpticalDepth({ lines, layers, startCm: 600, endCm: 700, stepCm: 0 }),
    ).toThrow(PhysicsError)
  })
})
