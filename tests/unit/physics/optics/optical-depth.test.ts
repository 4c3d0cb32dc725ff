import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { computeChunkOpticalDepth } from '../../../../shared/physics/optics/optical-depth'
import { computeReferenceOpticalDepth } from '../../../../shared/physics/optics/reference-optical-depth'
import type { ContinuumHook } from '../../../../shared/physics/optics/continuum'
import { dopplerHalfWidthCm, toLineTable } from '../../../../shared/physics/spectroscopy'
import fixture from '../fixtures/optics-reference.json'
import { expectRelativeClose } from '../../../support/expect-close'
import {
  ATM_PA,
  bandAbsorptionCm,
  co2Line,
  molarMassForDopplerWidth,
  trapezoid,
} from './optics-test-helpers'
import { fiveLayers, singleLayer, syntheticBandTable } from './synthetic-band'

const SQRT_LN2 = Math.sqrt(Math.LN2)
const band = syntheticBandTable()
const layers = fiveLayers()

describe('computeChunkOpticalDepth: analytic checks', () => {
  it('when one Lorentz-like line is integrated, returns S·u·(2/π)·atan(cutoff/γ) within 1e-4', () => {
    // Beer–Lambert: ∫τ dν = S·u (Goody & Yung 1989 §3, from memory) minus the wings beyond the
    // cutoff, ∫_{−c}^{c} f_L = (2/π) atan(c/γ) (elementary integral); γ/α_D ≈ 113 (Lorentz-like).
    const column = 1e19
    const result = computeChunkOpticalDepth({
      lines: toLineTable([co2Line()]),
      layers: [singleLayer(ATM_PA, 296, column)],
      startCm: 637,
      endCm: 698,
    })
    const expected = 1e-19 * column * (2 / Math.PI) * Math.atan(25 / 0.07)
    expectRelativeClose(trapezoid(result.opticalDepth[0], result.stats.stepCm), expected, 1e-4)
  })

  it('when the pedestal is subtracted (cutoff 5 cm⁻¹), returns the area (2/π)atan(c/γ) − 2c·f_L(c)', () => {
    // Elementary integral of f_L − f_L(c) over [−c, c] (as truncatedLorentzArea, common practice).
    const column = 1e19
    const gamma = 0.07
    const c = 5
    const result = computeChunkOpticalDepth({
      lines: toLineTable([co2Line()]),
      layers: [singleLayer(ATM_PA, 296, column)],
      startCm: 660,
      endCm: 675,
      options: { wingCutoffCm: c, subtractPedestal: true },
    })
    const pedestal = gamma / Math.PI / (c * c + gamma * gamma)
    const expected = 1e-19 * column * ((2 / Math.PI) * Math.atan(c / gamma) - 2 * c * pedestal)
    expectRelativeClose(trapezoid(result.opticalDepth[0], result.stats.stepCm), expected, 1e-4)
  })

  it('when a line has y = 1, returns S·u·√(ln2/π)/α_D·K(x, 1) at x = 0, 1, 3, 10 within 1e-4', () => {
    // K(x, 1) computed with SciPy's scipy.special.wofz; the fast path uses Humlíček's
    // approximation, relative error ≤ 1e-4 (faddeeva.ts, measured against SciPy).
    const step = 2 ** -12
    const centre = Math.round(667.3 / step) * step
    const mass = molarMassForDopplerWidth(centre, 296, 8 * step * SQRT_LN2)
    const alphaD = dopplerHalfWidthCm(centre, 296, mass)
    const gamma = alphaD / SQRT_LN2
    const result = computeChunkOpticalDepth({
      lines: toLineTable([
        co2Line({
          wavenumberCm: centre,
          airHalfWidthCmPerAtm: gamma,
          selfHalfWidthCmPerAtm: gamma,
        }),
      ]),
      layers: [singleLayer(ATM_PA, 296, 1e19)],
      startCm: centre - 0.01,
      endCm: centre + 0.1,
      options: { stepCm: step, molarMassLookup: () => mass },
    })
    const peak = (1e-19 * 1e19 * Math.sqrt(Math.LN2 / Math.PI)) / alphaD
    const index = (k: number): number =>
      Math.round((centre - result.wavenumberCm[0]) / step) + 8 * k
    const tau = result.opticalDepth[0]
    expectRelativeClose(tau[index(0)], peak * 0.42758357616, 1e-4, 'x = 0')
    expectRelativeClose(tau[index(1)], peak * 0.30474420526, 1e-4, 'x = 1')
    expectRelativeClose(tau[index(3)], peak * 0.065317777289, 1e-4, 'x = 3')
    expectRelativeClose(tau[index(10)], peak * 5.6699425669e-3, 1e-4, 'x = 10')
  })

  it('when compared with an independent SciPy evaluation (three lines, 1 and 1e-3 atm), agrees to 2.5e-4', () => {
    // tests/unit/physics/fixtures/optics-reference.json (scripts/fixtures/optics-reference.py,
    // scipy.special.wofz). Fast-path budget (optical-depth.ts): Humlíček K ≤ 7.7e-5 + interpolated
    // cores of wide lines ≤ 1.4e-4; measured 1.0e-4 (1 atm) and 3.5e-5 (1e-3 atm).
    const lines = toLineTable(fixture.lines.map((line) => co2Line(line)))
    let compared = 0
    for (const testCase of fixture.cases) {
      const points = testCase.points
      const result = computeChunkOpticalDepth({
        lines,
        layers: [
          singleLayer(
            testCase.pressureAtm * ATM_PA,
            fixture.temperatureK,
            fixture.co2ColumnMoleculesPerCm2,
            fixture.co2Vmr,
          ),
        ],
        startCm: points[0][1],
        endCm: points[points.length - 1][1],
        options: { stepCm: fixture.stepCm, wingCutoffCm: fixture.cutoffCm },
      })
      const maxTau = Math.max(...points.map((p) => p[2]))
      for (const [gridIndex, wavenumberCm, expected] of points) {
        const i = gridIndex - points[0][0]
        expect(result.wavenumberCm[i]).toBe(wavenumberCm)
        const actual = result.opticalDepth[0][i]
        if (expected === 0) expect(actual).toBeLessThanOrEqual(1e-15 * maxTau)
        else expectRelativeClose(actual, expected, 2.5e-4, `${testCase.name} ν = ${wavenumberCm}`)
        compared++
      }
    }
    expect(compared).toBe(68)
  })
})

/** Per-layer comparison of the fast path with the reference on the fast path's grid. */
function compareWithReference(startCm: number, endCm: number) {
  const fast = computeChunkOpticalDepth({ lines: band, layers, startCm, endCm })
  const reference = computeReferenceOpticalDepth({
    lines: band,
    layers,
    startCm,
    endCm,
    stepCm: fast.stats.stepCm,
  })
  const perLayer = fast.opticalDepth.map((tau, k) => {
    const ref = reference.opticalDepth[k]
    let maxRelativeTau = 0
    let budgetUse = 0 // max |Δτ| / (1e-3 τ + 1e-6)
    let maxAbsoluteTransmittance = 0
    let maxRelativeTransmittance = 0 // where T ≥ 1e-3
    for (let i = 0; i < tau.length; i++) {
      const difference = Math.abs(tau[i] - ref[i])
      maxRelativeTau = Math.max(maxRelativeTau, difference / ref[i])
      budgetUse = Math.max(budgetUse, difference / (1e-3 * ref[i] + 1e-6))
      const t = Math.exp(-tau[i])
      const tRef = Math.exp(-ref[i])
      maxAbsoluteTransmittance = Math.max(maxAbsoluteTransmittance, Math.abs(t - tRef))
      if (tRef >= 1e-3) {
        maxRelativeTransmittance = Math.max(maxRelativeTransmittance, Math.abs(t - tRef) / tRef)
      }
    }
    const absorption = bandAbsorptionCm(tau, fast.stats.stepCm)
    const absorptionRef = bandAbsorptionCm(ref, fast.stats.stepCm)
    return {
      maxRelativeTau,
      budgetUse,
      maxAbsoluteTransmittance,
      maxRelativeTransmittance,
      absorptionRelative: Math.abs(absorption - absorptionRef) / absorptionRef,
    }
  })
  return { fast, reference, perLayer }
}

describe('computeChunkOpticalDepth: fast path against the brute-force reference', () => {
  // Synthetic CO2-like ν₂ band (P/Q/R + hot band, 1.56 cm⁻¹ spacing, S ≤ 1e-19, γ_air ≈ 0.07,
  // E″ ≤ 2000 cm⁻¹) in five layers 1000–1 hPa; the reference uses the Weideman K (≤ 1e-8) and no
  // wing approximation. Target (common practice for line-by-line engines):
  // |Δτ| ≤ 1e-3 τ + 1e-6 and band absorption within 1e-4.
  for (const [startCm, endCm, measured] of [
    [666, 669, 'max |Δτ|/τ 7.0e-5, |ΔT| 2.5e-5, ΔT/T (T ≥ 1e-3) 3.9e-4, band 2.9e-6'],
    [719, 721, 'max |Δτ|/τ 7.1e-5, |ΔT| 8.5e-6, ΔT/T (T ≥ 1e-3) 1.1e-5, band 4.7e-6'],
  ] as const) {
    it(`when the window is [${startCm}, ${endCm}] cm⁻¹, returns τ within 1e-3 τ + 1e-6 (measured: ${measured})`, () => {
      const { fast, reference, perLayer } = compareWithReference(startCm, endCm)
      expect(fast.wavenumberCm).toEqual(reference.wavenumberCm)
      perLayer.forEach((m, k) => {
        const label = `layer ${k}: ${JSON.stringify(m)}`
        expect(m.budgetUse, label).toBeLessThanOrEqual(1)
        expect(m.maxRelativeTau, label).toBeLessThanOrEqual(1.5e-4)
        expect(m.maxAbsoluteTransmittance, label).toBeLessThanOrEqual(5e-5)
        expect(m.maxRelativeTransmittance, label).toBeLessThanOrEqual(1e-3)
        expect(m.absorptionRelative, label).toBeLessThanOrEqual(1e-5)
      })
      // Work, not time: the fast path evaluates the Voigt function at under 2 % of the points the
      // reference does (measured 1.0 % on [666, 669], 0.49 % on [719, 721]).
      expect(fast.stats.voigtEvaluations).toBeLessThan(0.02 * reference.voigtEvaluations)
    })
  }
})

describe('computeChunkOpticalDepth: grid', () => {
  it('when refining the step from 2⁻⁸ to 2⁻¹⁴ cm⁻¹, the band absorption of the top layer converges', () => {
    // Convergence with grid refinement (common practice). Measured successive differences
    // (cm⁻¹): 3.1e-3, 9.6e-4, 5.5e-5, 2.6e-6, 2.5e-7, 1.9e-7 (floor set by the fast-path error).
    const values = [8, 9, 10, 11, 12, 13, 14].map((e) => {
      const stepCm = 2 ** -e
      const result = computeChunkOpticalDepth({
        lines: band,
        layers,
        startCm: 666,
        endCm: 669,
        options: { stepCm },
      })
      return bandAbsorptionCm(result.opticalDepth[4], stepCm)
    })
    const differences = values.slice(1).map((v, i) => Math.abs(v - values[i]))
    for (let i = 0; i < 4; i++) {
      expect(differences[i + 1], `differences ${differences}`).toBeLessThan(differences[i] / 2)
    }
    expect(differences[5] / values[6]).toBeLessThan(1e-6)
  })

  it('when the step is adaptive, returns a power of two between α_min/8 and α_min/4', () => {
    // Grid step tied to the narrowest Voigt HWHM, 4 points per HWHM (common practice).
    const { stats } = computeChunkOpticalDepth({ lines: band, layers, startCm: 666, endCm: 669 })
    expect(stats.narrowestHalfWidthCm).not.toBeNull()
    const narrowest = stats.narrowestHalfWidthCm as number
    expect(Number.isInteger(Math.log2(stats.stepCm))).toBe(true)
    expect(stats.stepCm).toBeLessThanOrEqual(narrowest / 4)
    expect(stats.stepCm).toBeGreaterThan(narrowest / 8)
    expect(stats.pointCount).toBe(3 / stats.stepCm + 1)
  })

  it('when there are no lines, uses the largest power-of-two step within maxStepCm', () => {
    const { stats } = computeChunkOpticalDepth({
      lines: toLineTable([]),
      layers,
      startCm: 100,
      endCm: 101,
      options: { maxStepCm: 1e-3 },
    })
    expect(stats.stepCm).toBe(2 ** -10)
    expect(stats.narrowestHalfWidthCm).toBeNull()
  })
})

/** Values at the points two results share (by wavenumber), as [a, b] pairs of arrays. */
function sharedPoints(
  whole: ReturnType<typeof computeChunkOpticalDepth>,
  part: ReturnType<typeof computeChunkOpticalDepth>,
): { count: number; mismatches: number } {
  const index = new Map<number, number>()
  whole.wavenumberCm.forEach((nu, i) => index.set(nu, i))
  let count = 0
  let mismatches = 0
  part.wavenumberCm.forEach((nu, i) => {
    const j = index.get(nu)
    if (j === undefined) return
    for (let k = 0; k < whole.opticalDepth.length; k++) {
      count++
      if (!Object.is(part.opticalDepth[k][i], whole.opticalDepth[k][j])) mismatches++
    }
  })
  return { count, mismatches }
}

describe('computeChunkOpticalDepth: chunks and determinism', () => {
  for (const [a, b, c, options] of [
    [690, 692, 694, {}],
    [666, 667.5, 669, { stepCm: 2 ** -12 }],
    [700, 700.3, 701, { stepCm: 1e-3 }],
  ] as const) {
    it(`when [${a}, ${c}] is split at ${b}, returns bit-identical τ at every shared point`, () => {
      // Chunk independence (design requirement): lines near the boundary contribute across it.
      const whole = computeChunkOpticalDepth({ lines: band, layers, startCm: a, endCm: c, options })
      const left = computeChunkOpticalDepth({ lines: band, layers, startCm: a, endCm: b, options })
      const right = computeChunkOpticalDepth({ lines: band, layers, startCm: b, endCm: c, options })
      expect(left.stats.stepCm).toBe(whole.stats.stepCm)
      expect(right.stats.stepCm).toBe(whole.stats.stepCm)
      const l = sharedPoints(whole, left)
      const r = sharedPoints(whole, right)
      expect(l.count + r.count).toBeGreaterThanOrEqual(whole.wavenumberCm.length * layers.length)
      expect(l.mismatches + r.mismatches).toBe(0)
    })
  }

  it('when the same input is computed twice, returns bit-identical output', () => {
    const run = () =>
      computeChunkOpticalDepth({ lines: band, layers, startCm: 667, endCm: 668.5 }).opticalDepth
    const first = run()
    const second = run()
    let differentBits = 0
    first.forEach((tau, k) => {
      const a = new BigUint64Array(tau.buffer)
      const b = new BigUint64Array(second[k].buffer)
      for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) differentBits++
    })
    expect(first.length).toBe(layers.length)
    expect(differentBits).toBe(0)
  })
})

describe('computeChunkOpticalDepth: edge cases', () => {
  it('when the line list is empty, returns τ = 0, plus the continuum hooks if any', () => {
    const empty = computeChunkOpticalDepth({
      lines: toLineTable([]),
      layers,
      startCm: 800,
      endCm: 801,
    })
    expect(empty.opticalDepth.length).toBe(layers.length)
    for (const tau of empty.opticalDepth) expect(tau.every((v) => v === 0)).toBe(true)
    const hook: ContinuumHook = (_nu, _layer, k, out) => {
      for (let i = 0; i < out.length; i++) out[i] += 0.5 * (k + 1)
    }
    const withHook = computeChunkOpticalDepth({
      lines: toLineTable([]),
      layers,
      startCm: 800,
      endCm: 801,
      options: { continuum: [hook] },
    })
    withHook.opticalDepth.forEach((tau, k) => {
      expect(tau.every((v) => v === 0.5 * (k + 1))).toBe(true)
    })
  })

  it('when the lines belong to a gas absent from the layers, returns τ = 0', () => {
    const water = toLineTable([co2Line({ moleculeId: 1, wavenumberCm: 1594.75 })])
    const result = computeChunkOpticalDepth({ lines: water, layers, startCm: 1594, endCm: 1596 })
    for (const tau of result.opticalDepth) expect(tau.every((v) => v === 0)).toBe(true)
    expect(result.stats.activeLineLayerCount).toBe(0)
  })

  it('when there are no layers, returns an empty list of optical depths', () => {
    const result = computeChunkOpticalDepth({ lines: band, layers: [], startCm: 667, endCm: 668 })
    expect(result.opticalDepth).toEqual([])
    expect(result.wavenumberCm.length).toBeGreaterThan(0)
  })

  it('when the options or bounds are invalid, throws', () => {
    const input = { lines: band, layers, startCm: 667, endCm: 668 }
    expect(() => computeChunkOpticalDepth({ ...input, startCm: 668, endCm: 667 })).toThrow(
      PhysicsError,
    )
    expect(() => computeChunkOpticalDepth({ ...input, startCm: 0 })).toThrow(PhysicsError)
    expect(() =>
      computeChunkOpticalDepth({
        ...input,
        options: { lineShape: 'lorentz' as unknown as 'voigt' },
      }),
    ).toThrow(/not supported/)
    expect(() =>
      computeChunkOpticalDepth({ ...input, options: { minStepCm: 0.003, maxStepCm: 0.0035 } }),
    ).toThrow(/power-of-two/)
    expect(() => computeChunkOpticalDepth({ ...input, options: { wingCutoffCm: 0 } })).toThrow(
      PhysicsError,
    )
    expect(() =>
      computeChunkOpticalDepth({ ...input, options: { multigrid: { coarseningRatio: 3.5 } } }),
    ).toThrow(/coarseningRatio/)
  })
})
