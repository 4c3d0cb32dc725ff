/**
 * Sub-Lorentzian CO₂ far wings (χ-factor, `lineWingWeights`) in the three optics paths: the fast
 * uniform and adaptive paths against the brute-force reference with the same weight, the region
 * |ν − ν*| ≤ 3 cm⁻¹ left alone, and the size of the effect on a 1-atm CO₂ path.
 */
import { describe, expect, it } from 'vitest'
import {
  CO2_CHI_WING_WEIGHT,
  co2ChiFactor,
} from '../../../../shared/physics/continuum/co2-chi-factor'
import { PhysicsError } from '../../../../shared/physics/errors'
import { computeAdaptiveChunkOpticalDepth } from '../../../../shared/physics/optics/adaptive-optical-depth'
import type { AdaptiveSpectralGrid } from '../../../../shared/physics/optics/adaptive-grid'
import { computeChunkOpticalDepth } from '../../../../shared/physics/optics/optical-depth'
import { computeReferenceOpticalDepth } from '../../../../shared/physics/optics/reference-optical-depth'
import { toLineTable } from '../../../../shared/physics/spectroscopy'
import { endCorrectedTrapezoidWeights } from '../../../../shared/physics/transfer/end-corrected-trapezoid'
import { expectRelativeClose } from '../../../support/expect-close'
import { ATM_PA, bandAbsorptionCm, co2Line } from './optics-test-helpers'
import { fiveLayers, singleLayer, syntheticBandLines, syntheticBandTable } from './synthetic-band'

const CHI = { 2: CO2_CHI_WING_WEIGHT }
const band = syntheticBandTable()
const layers = fiveLayers()

/** ∫ values dν with the engine's end-corrected trapezoid weights on an adaptive grid. */
function absorptionOn(grid: AdaptiveSpectralGrid, tau: ArrayLike<number>): number {
  const n = grid.wavenumberCm.length
  const weights = endCorrectedTrapezoidWeights(
    grid.nodeIndex,
    grid.wavenumberCm,
    Math.round(1 / grid.baseStepCm),
    { left: new Float64Array(n), right: new Float64Array(n) },
  )
  let sum = 0
  for (let i = 0; i < n; i++) sum -= (weights.left[i] + weights.right[i]) * Math.expm1(-tau[i])
  return sum
}

// Windows: the Q branch, the R branch, and a far wing 12–25 cm⁻¹ beyond the last R lines
// (≈ 722.8 cm⁻¹), where every line contributes only χ-weighted wing.
const WINDOWS = [
  [666, 669],
  [719, 721],
  [735, 737],
] as const

describe('χ wings: uniform fast path against the reference with the same weight', () => {
  // Tolerances as optical-depth.test.ts (common practice for line-by-line engines):
  // |Δτ| ≤ 1e-3 τ + 1e-6, max |Δτ|/τ ≤ 1.5e-4, band absorption within 1e-5.
  for (const [startCm, endCm] of WINDOWS) {
    it(`when the window is [${startCm}, ${endCm}] cm⁻¹ with χ on, returns τ within 1.5e-4 τ and band absorption within 1e-5`, () => {
      const fast = computeChunkOpticalDepth({
        lines: band,
        layers,
        startCm,
        endCm,
        options: { lineWingWeights: CHI },
      })
      const reference = computeReferenceOpticalDepth({
        lines: band,
        layers,
        startCm,
        endCm,
        stepCm: fast.stats.stepCm,
        options: { lineWingWeights: CHI },
      })
      expect(fast.wavenumberCm).toEqual(reference.wavenumberCm)
      for (let k = 0; k < layers.length; k++) {
        const tau = fast.opticalDepth[k]
        const ref = reference.opticalDepth[k]
        let worst = 0
        let budgetUse = 0
        for (let i = 0; i < tau.length; i++) {
          const difference = Math.abs(tau[i] - ref[i])
          worst = Math.max(worst, difference / ref[i])
          budgetUse = Math.max(budgetUse, difference / (1e-3 * ref[i] + 1e-6))
        }
        const label = `layer ${k}: max |Δτ|/τ ${worst.toExponential(2)}`
        expect(worst, label).toBeLessThanOrEqual(1.5e-4)
        expect(budgetUse, label).toBeLessThanOrEqual(1)
        expectRelativeClose(
          bandAbsorptionCm(tau, fast.stats.stepCm),
          bandAbsorptionCm(ref, fast.stats.stepCm),
          1e-5,
          `layer ${k}`,
        )
      }
    })
  }
})

describe('χ wings: adaptive path against the reference with the same weight', () => {
  // Tolerances as adaptive-optical-depth.test.ts: band absorption of each layer within 2e-4, τ at
  // the grid points of the lowest layer (all lines significant) within 1e-3. In the far-wing window
  // the cutoff jumps of the lines 710–712 cm⁻¹ lie inside it and dominate the quadrature difference
  // between the 1/16 cm⁻¹ adaptive grid and the 2⁻¹³ cm⁻¹ reference grid (measured 6.5e-3 with and
  // without χ), so only point values are compared there (measured max |Δτ|/τ 3.5e-5 with χ).
  for (const [startCm, endCm] of WINDOWS) {
    it(`when the window is [${startCm}, ${endCm}] cm⁻¹ with χ on, returns τ within 1e-3 (and band absorption within 2e-4 in the band)`, () => {
      const adaptive = computeAdaptiveChunkOpticalDepth({
        lines: band,
        layers,
        startCm,
        endCm,
        options: { unitCm: 1, lineWingWeights: CHI },
      })
      const step = 2 ** -13
      const reference = computeReferenceOpticalDepth({
        lines: band,
        layers,
        startCm,
        endCm,
        stepCm: step,
        options: { lineWingWeights: CHI },
      })
      for (let k = 0; k < layers.length && startCm < 730; k++) {
        let r = 0
        const ref = reference.opticalDepth[k]
        for (let i = 1; i < ref.length; i++)
          r -= 0.5 * step * (Math.expm1(-ref[i - 1]) + Math.expm1(-ref[i]))
        expectRelativeClose(
          absorptionOn(adaptive.grid, adaptive.opticalDepth[k]),
          r,
          2e-4,
          `layer ${k}`,
        )
      }
      const ratio = adaptive.grid.baseStepCm / step
      let worst = 0
      for (let p = 0; p < adaptive.wavenumberCm.length; p++) {
        const ref = reference.opticalDepth[0][adaptive.grid.nodeIndex[p] * ratio]
        worst = Math.max(worst, Math.abs(adaptive.opticalDepth[0][p] - ref) / ref)
      }
      expect(worst, `max |Δτ|/τ ${worst.toExponential(2)}`).toBeLessThanOrEqual(1e-3)
    })
  }
})

describe('χ wings: onset, pedestal and validation', () => {
  const line = toLineTable([co2Line({ wavenumberCm: 700 })])
  const layer = [singleLayer(ATM_PA, 296, 1e18)]

  it('when |ν − ν*| ≤ 3 cm⁻¹, returns τ unchanged (reference exactly, uniform path within 1.5e-4)', () => {
    // χ = 1 up to σ₁ = 3 cm⁻¹ (Perrin & Hartmann 1989, JQSRT 42, 311; from memory, low
    // confidence).
    const input = { lines: line, layers: layer, startCm: 696, endCm: 704, stepCm: 2 ** -6 }
    const plain = computeReferenceOpticalDepth(input)
    const weighted = computeReferenceOpticalDepth({ ...input, options: { lineWingWeights: CHI } })
    const fastPlain = computeChunkOpticalDepth({ ...input, options: { stepCm: 2 ** -6 } })
    const fastWeighted = computeChunkOpticalDepth({
      ...input,
      options: { stepCm: 2 ** -6, lineWingWeights: CHI },
    })
    let inside = 0
    let outside = 0
    for (let i = 0; i < plain.wavenumberCm.length; i++) {
      const offset = Math.abs(plain.wavenumberCm[i] - 700)
      const a = plain.opticalDepth[0][i]
      const b = weighted.opticalDepth[0][i]
      if (offset <= 3) {
        inside++
        expect(b).toBe(a)
        expectRelativeClose(fastWeighted.opticalDepth[0][i], fastPlain.opticalDepth[0][i], 1.5e-4)
      } else {
        outside++
        // Beyond the onset the wing is weighted by χ(Δν, 296 K) (same source).
        expectRelativeClose(b, a * co2ChiFactor(offset, 296), 1e-12)
      }
    }
    expect(inside).toBeGreaterThan(300)
    expect(outside).toBeGreaterThan(100)
  })

  it('when the pedestal is subtracted, returns τ → 0 at the cutoff (K(c)·χ(c) subtracted)', () => {
    // A pedestal-subtracted line is continuous at the cutoff (common practice).
    const input = {
      lines: line,
      layers: layer,
      startCm: 690,
      endCm: 710,
      stepCm: 2 ** -6,
      options: { lineWingWeights: CHI, subtractPedestal: true, wingCutoffCm: 10 },
    }
    const reference = computeReferenceOpticalDepth(input)
    const fast = computeChunkOpticalDepth({
      ...input,
      options: { ...input.options, stepCm: 2 ** -6 },
    })
    const peak = Math.max(...reference.opticalDepth[0])
    for (const result of [reference, fast]) {
      const at = (nu: number) => result.opticalDepth[0][Math.round((nu - 690) * 64)]
      expect(at(690) / peak).toBeLessThan(1e-14)
      expect(at(710) / peak).toBeLessThan(1e-14)
      // Just inside: f(c − h) − f(c) ≈ −h f′(c), small next to the peak.
      expect(at(690 + 2 ** -6) / peak).toBeLessThan(1e-6)
    }
    for (let i = 0; i < reference.opticalDepth[0].length; i++) {
      const ref = reference.opticalDepth[0][i]
      expect(Math.abs(fast.opticalDepth[0][i] - ref)).toBeLessThanOrEqual(1e-3 * ref + 1e-12 * peak)
    }
  })

  it('when the weight option is malformed, throws PhysicsError', () => {
    const input = { lines: line, layers: layer, startCm: 699, endCm: 701 }
    const bad = { 2: { ...CO2_CHI_WING_WEIGHT, kinksCm: [30, 3] } }
    expect(() => computeChunkOpticalDepth({ ...input, options: { lineWingWeights: bad } })).toThrow(
      PhysicsError,
    )
    expect(() =>
      computeAdaptiveChunkOpticalDepth({
        ...input,
        options: { lineWingWeights: { 0: CO2_CHI_WING_WEIGHT } },
      }),
    ).toThrow(PhysicsError)
  })
})

describe('χ wings: effect on a 1-atm single-layer CO₂ path', () => {
  // 1 atm, 296 K, the CO₂ column of the whole atmosphere at 400 ppmv (≈ 8.6e21 cm⁻²: 2.15e25 air
  // molecules cm⁻² × 4e-4; from memory). Expected behaviour (from memory): the total band
  // absorption changes by ≪ 1 % while the far wing beyond the band drops by tens of per cent.
  const column = 8.6e21
  const path = [singleLayer(ATM_PA, 296, column)]
  const step = 2 ** -6
  const run = (weights: typeof CHI | undefined) =>
    computeChunkOpticalDepth({
      lines: band,
      layers: path,
      startCm: 550,
      endCm: 800,
      options: { stepCm: step, lineWingWeights: weights },
    })
  const plain = run(undefined)
  const weighted = run(CHI)

  it('when χ is on, changes ∫(1 − e^{−τ}) dν over 550–800 cm⁻¹ by less than 1 % (measured 0.48 %)', () => {
    const a = bandAbsorptionCm(plain.opticalDepth[0], step)
    const b = bandAbsorptionCm(weighted.opticalDepth[0], step)
    const change = (a - b) / a
    expect(change, `band absorption ${a} → ${b} cm⁻¹, change ${change}`).toBeGreaterThan(0)
    expect(change, `band absorption ${a} → ${b} cm⁻¹, change ${change}`).toBeLessThan(1e-2)
  })

  it('when χ is on, lowers τ 12–20 cm⁻¹ beyond the last R line by tens of per cent, within [χ(25), χ(d_min)]', () => {
    const lastLineCm = Math.max(...syntheticBandLines().map((l) => l.wavenumberCm))
    for (const beyond of [12, 16, 20]) {
      const nu = Math.round((lastLineCm + beyond) / step) * step
      const i = Math.round((nu - plain.wavenumberCm[0]) / step)
      expect(plain.wavenumberCm[i]).toBe(nu)
      const ratio = weighted.opticalDepth[0][i] / plain.opticalDepth[0][i]
      // Every contributing line is between d_min = nu − lastLine and the 25 cm⁻¹ cutoff away, so the
      // ratio is a weighted mean of χ over [d_min, 25] (χ decreasing; Perrin & Hartmann 1989).
      const label = `${nu} cm⁻¹: τ ratio ${ratio}`
      expect(ratio, label).toBeLessThanOrEqual(co2ChiFactor(nu - lastLineCm, 296) * (1 + 1e-4))
      expect(ratio, label).toBeGreaterThanOrEqual(co2ChiFactor(25, 296) * (1 - 1e-4))
      expect(ratio, label).toBeLessThan(0.8)
    }
  })
})
