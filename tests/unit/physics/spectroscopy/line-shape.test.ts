import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  addVoigtLineToGrid,
  dopplerProfile,
  lorentzProfile,
  truncatedLorentzArea,
  truncatedLorentzProfile,
  truncatedVoigtProfile,
  voigtProfile,
  voigtProfileAccurate,
} from '../../../../shared/physics/spectroscopy/line-shape'
import { expectRelativeClose } from '../../../support/expect-close'

/** Composite Simpson rule on [a, b] with n (even) intervals. */
function simpson(f: (x: number) => number, a: number, b: number, n: number): number {
  const h = (b - a) / n
  let sum = f(a) + f(b)
  for (let i = 1; i < n; i++) sum += (i % 2 === 1 ? 4 : 2) * f(a + i * h)
  return (sum * h) / 3
}

/**
 * ∫_{−W}^{W} f for an even profile, split into [0, w], [w, 10w], …, [1000w, W = 10⁴w] so that
 * both the core and the wings are resolved, plus the Lorentz tail beyond W:
 * 2∫_W^∞ γ/(π(ν² + γ²)) dν = 1 − (2/π) atan(W/γ) (analytic; the Voigt wing equals the Lorentz
 * wing to relative O(α_D²/W²) = 1e-8 here).
 */
function areaWithLorentzTail(f: (offset: number) => number, width: number, gamma: number): number {
  let area = 0
  let a = 0
  for (const b of [1, 10, 100, 1000, 10000].map((k) => k * width)) {
    area += 2 * simpson(f, a, b, 4000)
    a = b
  }
  const tail = gamma > 0 ? 1 - (2 / Math.PI) * Math.atan(a / gamma) : 0
  return area + tail
}

// Typical widths: CO2 at 667 cm⁻¹, 296 K, α_D = 6.20e-4 cm⁻¹ (computed by hand); γ from 1 atm
// (0.07 cm⁻¹ atm⁻¹, from memory) down to 1e-4 atm.
const ALPHA_D = 6.2e-4
const GAMMAS = [0.07, 7e-3, 6.2e-4, 7e-5, 7e-6, 0]

describe('lorentzProfile', () => {
  it('when at the centre and at one half width, returns 1/(πγ) and half of it', () => {
    // Analytic: f_L(0) = 1/(πγ), f_L(γ) = 1/(2πγ).
    const gamma = 0.07
    expectRelativeClose(lorentzProfile(0, gamma), 1 / (Math.PI * gamma), 1e-15)
    expectRelativeClose(lorentzProfile(gamma, gamma), 1 / (2 * Math.PI * gamma), 1e-15)
  })

  it('when integrated over ±W, returns (2/π) atan(W/γ)', () => {
    // Analytic integral of the Lorentz profile.
    const gamma = 0.05
    const numeric = simpson((x) => lorentzProfile(x, gamma), -1, 1, 20000)
    expectRelativeClose(numeric, (2 / Math.PI) * Math.atan(1 / gamma), 1e-9)
  })

  it('when the half width is not positive, throws OUT_OF_RANGE', () => {
    expect(() => lorentzProfile(0, 0)).toThrow(PhysicsError)
    expect(() => lorentzProfile(Number.NaN, 1)).toThrow(PhysicsError)
  })
})

describe('dopplerProfile', () => {
  it('when at the centre and at one half width, returns √(ln2/π)/α_D and half of it', () => {
    // Analytic Gaussian with HWHM α_D.
    const peak = Math.sqrt(Math.LN2 / Math.PI) / ALPHA_D
    expectRelativeClose(dopplerProfile(0, ALPHA_D), peak, 1e-15)
    expectRelativeClose(dopplerProfile(-ALPHA_D, ALPHA_D), peak / 2, 1e-14)
  })

  it('when integrated over ±10 α_D, returns 1', () => {
    // Analytic: erf(10√ln2) = 1 − 1e-31.
    expectRelativeClose(
      simpson((x) => dopplerProfile(x, ALPHA_D), -10 * ALPHA_D, 10 * ALPHA_D, 4000),
      1,
      1e-12,
    )
  })
})

describe('voigtProfile', () => {
  it('when integrated with the Lorentz tail added, returns unit area (fast 1e-4, accurate 1e-8)', () => {
    for (const gamma of GAMMAS) {
      const width = Math.max(ALPHA_D, gamma)
      const fast = areaWithLorentzTail((x) => voigtProfile(x, ALPHA_D, gamma), width, gamma)
      const accurate = areaWithLorentzTail(
        (x) => voigtProfileAccurate(x, ALPHA_D, gamma),
        width,
        gamma,
      )
      // Fast: Humlíček relative accuracy 1e-4 (faddeeva.ts); accurate: Weideman ≤ 1e-8.
      expectRelativeClose(fast, 1, 1e-4, `fast, γ = ${gamma}`)
      expectRelativeClose(accurate, 1, 1e-8, `accurate, γ = ${gamma}`)
    }
  })

  it('when the Doppler width is negligible, returns the Lorentz profile', () => {
    // Lorentz limit α_D → 0 (analytic; deviation O((α_D/γ)²) = 1e-12 here).
    const gamma = 0.07
    const alpha = 1e-6 * gamma
    for (const offset of [0, 0.3 * gamma, gamma, 10 * gamma, 300 * gamma]) {
      const lorentz = lorentzProfile(offset, gamma)
      // Fast path: Humlíček's region-I coefficient 0.5641896 differs from 1/√π by 2.9e-8.
      expectRelativeClose(voigtProfile(offset, alpha, gamma), lorentz, 5e-8, `fast ${offset}`)
      expectRelativeClose(
        voigtProfileAccurate(offset, alpha, gamma),
        lorentz,
        1e-9,
        `acc ${offset}`,
      )
    }
  })

  it('when the Lorentz width is zero, returns the Doppler profile', () => {
    // Gauss limit γ → 0: K(x, 0) = exp(−x²) (analytic).
    for (const offset of [0, 0.5 * ALPHA_D, ALPHA_D, 2 * ALPHA_D, 4 * ALPHA_D]) {
      const doppler = dopplerProfile(offset, ALPHA_D)
      expectRelativeClose(voigtProfile(offset, ALPHA_D, 0), doppler, 1e-4, `fast ${offset}`)
      expectRelativeClose(voigtProfileAccurate(offset, ALPHA_D, 0), doppler, 1e-11, `acc ${offset}`)
    }
  })

  it('when y = 1, returns the peak K(0, 1) √(ln2/π)/α_D', () => {
    // K(0, 1) = 0.42758357616 (SciPy's scipy.special.wofz); γ = α_D/√ln2 gives y = 1.
    const gamma = ALPHA_D / Math.sqrt(Math.LN2)
    const peak = (0.42758357616 * Math.sqrt(Math.LN2 / Math.PI)) / ALPHA_D
    expectRelativeClose(voigtProfileAccurate(0, ALPHA_D, gamma), peak, 1e-10)
    expectRelativeClose(voigtProfile(0, ALPHA_D, gamma), peak, 1e-4)
  })

  it('when the Doppler width is zero or γ is negative, throws OUT_OF_RANGE', () => {
    expect(() => voigtProfile(0, 0, 0.07)).toThrow(PhysicsError)
    expect(() => voigtProfileAccurate(0, ALPHA_D, -1e-9)).toThrow(PhysicsError)
  })
})

describe('line-wing cutoff', () => {
  const gamma = 0.07
  const plain = { cutoffCm: 25, subtractPedestal: false }
  const pedestal = { cutoffCm: 25, subtractPedestal: true }

  it('when beyond the cutoff, returns zero for both variants', () => {
    expect(truncatedLorentzProfile(25.001, gamma, plain)).toBe(0)
    expect(truncatedVoigtProfile(-25.001, ALPHA_D, gamma, pedestal)).toBe(0)
  })

  it('when at the cutoff, returns f(c) for plain truncation and 0 with the pedestal removed', () => {
    // Common practice: pedestal subtraction makes the profile continuous at the cutoff.
    expect(truncatedLorentzProfile(25, gamma, plain)).toBe(lorentzProfile(25, gamma))
    expect(truncatedLorentzProfile(25, gamma, pedestal)).toBe(0)
    expect(truncatedVoigtProfile(25, ALPHA_D, gamma, pedestal)).toBe(0)
  })

  it('when the truncated Lorentz profile is integrated, returns truncatedLorentzArea', () => {
    // Analytic: (2/π) atan(c/γ), minus 2c f_L(c) with the pedestal.
    for (const wing of [plain, pedestal]) {
      const numeric =
        2 * simpson((x) => truncatedLorentzProfile(x, gamma, wing), 0, 1, 20000) +
        2 * simpson((x) => truncatedLorentzProfile(x, gamma, wing), 1, 25, 20000)
      expectRelativeClose(
        numeric,
        truncatedLorentzArea(gamma, wing),
        1e-10,
        `pedestal ${wing.subtractPedestal}`,
      )
    }
    // Lost area ≈ 2γ/(πc) (plain) and ≈ 4γ/(πc) (pedestal) for c ≫ γ (analytic expansion).
    expectRelativeClose(1 - truncatedLorentzArea(gamma, plain), (2 * gamma) / (Math.PI * 25), 1e-5)
    expectRelativeClose(
      1 - truncatedLorentzArea(gamma, pedestal),
      (4 * gamma) / (Math.PI * 25),
      1e-5,
    )
  })

  it('when the cutoff is not positive, throws OUT_OF_RANGE', () => {
    expect(() => truncatedLorentzArea(gamma, { cutoffCm: 0, subtractPedestal: false })).toThrow(
      PhysicsError,
    )
  })
})

describe('addVoigtLineToGrid', () => {
  const gamma = 0.007
  const step = 1e-4
  const start = 660
  const centre = 665.00003

  it('when a line is added, adds areaScale × the truncated profile inside the cutoff only', () => {
    const out = new Float64Array(100001).fill(1)
    const wing = { cutoffCm: 2, subtractPedestal: true }
    addVoigtLineToGrid(out, start, step, centre, 3, ALPHA_D, gamma, wing)
    for (const i of [0, 29999, 30001, 50000, 50003, 69999, 70001, 100000]) {
      const offset = start + i * step - centre
      const expected = 1 + 3 * truncatedVoigtProfile(offset, ALPHA_D, gamma, wing)
      expectRelativeClose(out[i], expected, 1e-14, `i = ${i}`)
    }
    // Beyond the cutoff the grid is untouched.
    expect(out[29999]).toBe(1)
    expect(out[70001]).toBe(1)
  })

  it('when summed over the grid, returns areaScale × the truncated area', () => {
    // For c ≫ α_D the truncated Voigt area equals the truncated Lorentz area to O(α_D²/c²)
    // (the Voigt wing is the Lorentz wing, analytic), here to 1e-4 with the fast K.
    const out = new Float64Array(100001)
    const wing = { cutoffCm: 4, subtractPedestal: false }
    addVoigtLineToGrid(out, start, step, centre, 2.5, ALPHA_D, gamma, wing)
    const area = out.reduce((sum, v) => sum + v, 0) * step
    expectRelativeClose(area, 2.5 * truncatedLorentzArea(gamma, wing), 2e-4)
  })

  it('when the line lies far outside the grid, leaves the grid unchanged', () => {
    const out = new Float64Array(10)
    addVoigtLineToGrid(out, start, step, 700, 1, ALPHA_D, gamma, {
      cutoffCm: 25,
      subtractPedestal: false,
    })
    expect(Array.from(out)).toEqual(new Array(10).fill(0))
  })

  it('when the grid step is not positive, throws OUT_OF_RANGE', () => {
    const out = new Float64Array(10)
    expect(() =>
      addVoigtLineToGrid(out, start, 0, centre, 1, ALPHA_D, gamma, {
        cutoffCm: 1,
        subtractPedestal: false,
      }),
    ).toThrow(PhysicsError)
  })
})
