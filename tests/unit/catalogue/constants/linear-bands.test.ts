import { describe, expect, it } from 'vitest'
import { LINEAR_BANDS, bandOriginCm } from '../../../../shared/catalogue/constants/linear-bands'
import {
  evaluateBroadening,
  CO2_BROADENING,
} from '../../../../shared/catalogue/constants/linear-broadening'
import { expectAbsoluteClose, expectRelativeClose } from '../../../support/expect-close'

// Band centres computed by hand from the level energies of Rothman et al. 1992, JQSRT 48, 537
// (from memory); they agree with the literature centres to ≈0.01 cm⁻¹ (from memory). 01101–00001
// rests on 667.3799, confirmed against an independent listing.
const REFERENCE_CENTRES: Record<string, number> = {
  'co2-626-01101-00001': 667.38,
  'co2-626-02201-01101': 667.752,
  'co2-626-10002-01101': 618.029,
  'co2-626-10001-01101': 720.805,
  'co2-626-03301-02201': 668.115,
  'co2-626-11102-02201': 597.338,
  'co2-626-11101-02201': 741.724,
  'co2-626-11102-10002': 647.061,
  'co2-626-11101-10001': 688.671,
  'co2-626-11101-10002': 791.447,
  'co2-626-00011-10001': 960.958,
  'co2-626-00011-10002': 1063.734,
  'co2-626-00011-00001': 2349.143,
  'co2-636-01101-00001': 648.478,
  'co2-636-00011-00001': 2283.487,
}

describe('LINEAR_BANDS', () => {
  it('when the band origins are computed, match the published centres within 0.002 cm⁻¹', () => {
    let checked = 0
    for (const band of LINEAR_BANDS) {
      const reference = REFERENCE_CENTRES[band.id]
      if (reference === undefined) continue
      expectAbsoluteClose(bandOriginCm(band), reference, 2e-3, band.id)
      checked++
    }
    expect(checked).toBe(15)
  })

  it('when listed, has unique ids, a source, a tag, positive intensity and |Δl| ≤ 1 for every row', () => {
    expect(new Set(LINEAR_BANDS.map((b) => b.id)).size).toBe(LINEAR_BANDS.length)
    for (const band of LINEAR_BANDS) {
      expect(band.source.length).toBeGreaterThan(10)
      expect(['VERIFIED', 'COMPUTED', 'MEMORY', 'MEMORY-low']).toContain(band.confidence)
      expect(band.bandIntensityCmPerMolecule).toBeGreaterThan(0)
      expect(Math.abs(band.upper.l - band.lower.l)).toBeLessThanOrEqual(1)
      expect(band.type === 'parallel').toBe(band.upper.l === band.lower.l)
    }
  })

  it('when the CO2 ν₂ and first hot band are compared, keep the harmonic ratio ≈ 0.078', () => {
    // Harmonic estimate 0.078 × fundamental (computed by hand: lower-state population 0.078 at
    // 296 K); 5 % tolerance.
    const fundamental = LINEAR_BANDS.find((b) => b.id === 'co2-626-01101-00001')!
    const hot = LINEAR_BANDS.find((b) => b.id === 'co2-626-02201-01101')!
    expectRelativeClose(
      hot.bandIntensityCmPerMolecule / fundamental.bandIntensityCmPerMolecule,
      0.078,
      0.05,
    )
  })
})

describe('evaluateBroadening', () => {
  it('when evaluated for CO2, returns the representative widths within 3 %', () => {
    // γ_air ≈ 0.080 (J″≈2), 0.072 (20), 0.065 (40), 0.060 (60); γ_self ≈ 0.11, 0.09, 0.08 (from
    // memory).
    const points: [number, number, number | null][] = [
      [2, 0.08, 0.11],
      [20, 0.072, 0.09],
      [40, 0.065, 0.08],
      [60, 0.06, null],
    ]
    for (const [m, air, self] of points) {
      const w = evaluateBroadening(CO2_BROADENING, m)
      expectRelativeClose(w.airHalfWidthCmPerAtm, air, 0.03, `air |m|=${m}`)
      if (self !== null) expectRelativeClose(w.selfHalfWidthCmPerAtm, self, 0.03, `self |m|=${m}`)
      // n_air ≈ 0.75, range 0.69–0.78 (from memory).
      expect(w.temperatureExponentAir).toBeGreaterThanOrEqual(0.62)
      expect(w.temperatureExponentAir).toBeLessThanOrEqual(0.78)
    }
  })
})
