import { describe, expect, it } from 'vitest'
import { LINEAR_BANDS, bandOriginCm } from '../../../../shared/catalogue/constants/linear-bands'
import {
  generateLinearBandLines,
  generateLinearBandTransitions,
  type LinearTransition,
} from '../../../../shared/catalogue/linear/band-generator'
import { PhysicsError } from '../../../../shared/physics/errors'
import { expectAbsoluteClose, expectRelativeClose } from '../../../support/expect-close'

function band(id: string) {
  const found = LINEAR_BANDS.find((b) => b.id === id)
  if (!found) throw new Error(`no band ${id}`)
  return found
}
function find(transitions: LinearTransition[], deltaJ: -1 | 0 | 1, lowerJ: number) {
  const found = transitions.find((t) => t.deltaJ === deltaJ && t.lowerJ === lowerJ)
  if (!found) throw new Error(`no line ΔJ=${deltaJ} J″=${lowerJ}`)
  return found
}

const nu2 = generateLinearBandTransitions(band('co2-626-01101-00001'))

describe('generateLinearBandTransitions, CO2 626 ν₂ fundamental', () => {
  // Constants of Rothman et al. 1992, JQSRT 48, 537: ν₀ = 667.3799 (confirmed against an
  // independent listing), B_e′ = 0.390639, B_f′ = 0.391254, B″ = 0.3902189 (from memory).
  // Positions computed from them by hand; D terms < 1e-5 cm⁻¹ here.
  it('when the lowest Q line is taken, returns the Q-branch head near 667.38 cm⁻¹', () => {
    const qLines = nu2.filter((t) => t.deltaJ === 0).map((t) => t.line.wavenumberCm)
    // Q(2) = 667.3799 + 6 (0.391254 − 0.3902189) = 667.38611; band centre 667.3799.
    expectAbsoluteClose(Math.min(...qLines), 667.38611, 0.01, 'Q head')
    expectAbsoluteClose(Math.min(...qLines), 667.3799, 0.01, 'Q head vs band centre')
  })

  it('when R(0) and P(2) are taken, returns ν₀ + 2B′ and ν₀ + 2B′ − 6B″ within 0.01 cm⁻¹', () => {
    expectAbsoluteClose(find(nu2, 1, 0).line.wavenumberCm, 667.3799 + 2 * 0.390639, 0.01, 'R(0)')
    expectAbsoluteClose(
      find(nu2, -1, 2).line.wavenumberCm,
      667.3799 + 2 * 0.390639 - 6 * 0.3902189,
      0.01,
      'P(2)',
    )
  })

  it('when consecutive R and P lines are compared, returns a spacing ≈ 4B ≈ 1.56 cm⁻¹', () => {
    // Only even J″ exist, so neighbours differ by ΔJ″ = 2: spacing ≈ 4B (nuclear-spin
    // statistics, Herzberg 1945, Infrared and Raman Spectra; from memory).
    const r = find(nu2, 1, 2).line.wavenumberCm - find(nu2, 1, 0).line.wavenumberCm
    const p = find(nu2, -1, 2).line.wavenumberCm - find(nu2, -1, 4).line.wavenumberCm
    expectAbsoluteClose(r, 4 * 0.3902189, 0.02, 'R spacing')
    expectAbsoluteClose(p, 4 * 0.3902189, 0.02, 'P spacing')
  })

  it('when the lower J″ values are listed, returns no odd J″ (nuclear spin statistics)', () => {
    expect(nu2.some((t) => t.lowerJ % 2 === 1)).toBe(false)
    expect(nu2.some((t) => t.lowerJ === 0)).toBe(true)
    // R/P end on e levels with odd J′, Q on f levels with even J′ (Herzberg 1945; from memory).
    for (const t of nu2) {
      expect(t.upperParity).toBe(t.deltaJ === 0 ? 'f' : 'e')
      expect(t.upperJ % 2).toBe(t.deltaJ === 0 ? 0 : 1)
    }
  })

  it('when the Einstein A values out of each upper level are summed, return the band A ≈ 1.52 s⁻¹', () => {
    // Computed by hand from S_band = 7.9e-18 (from memory): A(01101→00001) ≈ 1.52 s⁻¹; literature
    // 1.3–1.5 s⁻¹ (from memory). Tolerance 5 % covers the ν³ variation across the band.
    const sums = new Map<string, number>()
    for (const t of nu2) {
      const key = `${t.upperJ}${t.upperParity}`
      sums.set(key, (sums.get(key) ?? 0) + t.line.einsteinAPerS)
    }
    let checked = 0
    for (const [key, sum] of sums) {
      const j = Number.parseInt(key, 10)
      if (j < 2 || j > 41) continue // both P and R (or the Q) lines of the level are present
      expectRelativeClose(sum, 1.52, 0.05, `upper ${key}`)
      checked++
    }
    expect(checked).toBeGreaterThan(30)
  })

  it('when lines are generated, sets E″, statistical weights and quantum labels consistently', () => {
    const r10 = find(nu2, 1, 10).line
    // E″ = B″ J(J+1) − D″ [J(J+1)]² for J = 10 (Rothman et al. 1992 constants).
    expectAbsoluteClose(r10.lowerStateEnergyCm, 0.3902189 * 110 - 1.333e-7 * 110 * 110, 1e-6)
    expect(r10.upperStatisticalWeight).toBe(23)
    expect(r10.lowerStatisticalWeight).toBe(21)
    expect(r10.lowerLocalQuanta).toBe('R10e')
    expect(r10.upperGlobalQuanta).toBe('01101')
    expect(r10.lowerGlobalQuanta).toBe('00001')
  })
})

describe('generateLinearBandTransitions, every band', () => {
  it('when the intensities of a band are summed, return its band intensity to 1e-9', () => {
    for (const b of LINEAR_BANDS) {
      const lines = generateLinearBandLines(b)
      let sum = 0
      for (const line of lines) sum += line.intensityCmPerMolecule
      // Normalisation requirement (relative test, common practice: generated lines sum to S_band).
      expectRelativeClose(sum, b.bandIntensityCmPerMolecule, 1e-9, b.id)
    }
  })

  it('when lines are generated, returns them sorted, within ±150 cm⁻¹ of ν₀, with J″ ≤ 120', () => {
    for (const b of LINEAR_BANDS) {
      const transitions = generateLinearBandTransitions(b)
      const nu = transitions.map((t) => t.line.wavenumberCm)
      for (let i = 1; i < nu.length; i++) expect(nu[i]).toBeGreaterThanOrEqual(nu[i - 1])
      const origin = bandOriginCm(b)
      expect(Math.min(...nu)).toBeGreaterThan(origin - 150)
      expect(Math.max(...nu)).toBeLessThan(origin + 150)
      expect(Math.max(...transitions.map((t) => t.lowerJ))).toBeLessThanOrEqual(120)
    }
  })

  it('when the weakest kept line is compared with the strongest, returns a ratio ≥ 1e-6', () => {
    for (const b of LINEAR_BANDS) {
      const s = generateLinearBandLines(b).map((line) => line.intensityCmPerMolecule)
      expect(Math.min(...s) / Math.max(...s)).toBeGreaterThanOrEqual(1e-6)
    }
  })

  it('when the band is Σ–Σ (parallel), returns no Q lines; when perpendicular, returns Q lines', () => {
    for (const b of LINEAR_BANDS) {
      const hasQ = generateLinearBandTransitions(b).some((t) => t.deltaJ === 0)
      expect(hasQ, b.id).toBe(b.type === 'perpendicular')
    }
  })
})

describe('generateLinearBandTransitions, laser bands and isotopologues', () => {
  it('when the 10.4 and 9.4 µm P(20) lines are taken, returns 944.194 and 1046.854 cm⁻¹', () => {
    // CO2 laser lines 10P(20) = 944.194 cm⁻¹ (10.591 µm) and 9P(20) = 1046.854 cm⁻¹ (from memory;
    // the same values in a public excerpt of the public spectroscopic database line list).
    const p10 = find(generateLinearBandTransitions(band('co2-626-00011-10001')), -1, 20)
    const p9 = find(generateLinearBandTransitions(band('co2-626-00011-10002')), -1, 20)
    expectAbsoluteClose(p10.line.wavenumberCm, 944.194, 0.01, '10P(20)')
    expectAbsoluteClose(p9.line.wavenumberCm, 1046.854, 0.01, '9P(20)')
  })

  it('when the laser bands are generated, have centres near 960.9 and 1063.7 cm⁻¹', () => {
    // Devi et al. 2003, JQSRT 76, 393: bands "centered near 960.9 and 1063.7 cm⁻¹" (checked against
    // the published text).
    expectAbsoluteClose(bandOriginCm(band('co2-626-00011-10001')), 960.9, 0.1)
    expectAbsoluteClose(bandOriginCm(band('co2-626-00011-10002')), 1063.7, 0.1)
  })

  it('when the Herman–Wallis factor is applied, makes P(30) weaker than R(28) in the 10.4 µm band', () => {
    // a₁ < 0 (fit to published Einstein A values): F(m) = (1 + a₁m + a₂m²)² decreases with m,
    // so lines with m > 0 (R) are weakened relative to P; with the ν factor the asymmetry is
    // checked against the F ratio computed here from the table's coefficients.
    const t = generateLinearBandTransitions(band('co2-626-00011-10001'))
    const hw = band('co2-626-00011-10001').hermanWallis!
    const f = (m: number) => (1 + hw.a1 * m + hw.a2 * m * m) ** 2
    const r28 = find(t, 1, 28).line
    const p30 = find(t, -1, 30).line
    // Same upper level J′ = 29: A ratio = [HL_R/HL_P] (ν_R/ν_P)³ F(29)/F(−30), HL_R = 29, HL_P = 30.
    const expected = (29 / 30) * (r28.wavenumberCm / p30.wavenumberCm) ** 3 * (f(29) / f(-30))
    expectRelativeClose(r28.einsteinAPerS / p30.einsteinAPerS, expected, 1e-9)
  })

  it('when the 628 ν₂ band is generated, keeps odd and even J″ and both e and f Q levels', () => {
    // ¹⁶O¹²C¹⁸O has no exchange symmetry: all J (Herzberg 1945; from memory).
    const t = generateLinearBandTransitions(band('co2-628-01101-00001'))
    expect(t.some((x) => x.lowerJ === 1)).toBe(true)
    expect(t.some((x) => x.lowerJ === 2)).toBe(true)
  })

  it('when the N2O ν₂ band is generated, has its Q branch at 588.78 cm⁻¹', () => {
    // N2O ν₂ origin 588.78 cm⁻¹ (NBS wavenumber tables, PMC5325172, checked against the published
    // text); tolerance 0.02.
    const q = generateLinearBandTransitions(band('n2o-446-0110-0000')).filter((x) => x.deltaJ === 0)
    expectAbsoluteClose(Math.min(...q.map((x) => x.line.wavenumberCm)), 588.78, 0.02, 'Q head')
  })

  it('when the N2O ν₃ band is generated, centres the R(0)/P(1) gap on 2223.7567 cm⁻¹', () => {
    // ν₃ = 2223.756693 cm⁻¹ (quoted by Gimmler & Havenith 2002, J. Mol. Spectrosc.
    // 216, 315). Gap centre = ν₀ + (B′ − B″) ≈ ν₀ − 0.0035; tolerance 0.01 cm⁻¹.
    const t = generateLinearBandTransitions(band('n2o-446-0001-0000'))
    const centre = (find(t, 1, 0).line.wavenumberCm + find(t, -1, 1).line.wavenumberCm) / 2
    expectAbsoluteClose(centre, 2223.756693, 0.01)
  })
})

describe('generateLinearBandTransitions, weak-limit absorption', () => {
  it('when a weak CO2 path is integrated over a Lorentz grid, returns W = S_band · u within 1 %', () => {
    // Weak-line limit of the curve of growth: W → S u (Ladenburg & Reiche 1913,
    // Ann. Phys. 42, 181; from memory).
    // Independent check with our own Lorentz sum: 0.1 atm air, u = 1e14 molecule cm⁻², each line
    // truncated at ±5 cm⁻¹ (expected area fraction (2/π) atan(5/γ), ≥ 0.99), trapezoid on 0.001.
    const b = band('co2-626-01101-00001')
    const lines = generateLinearBandLines(b)
    const u = 1e14
    const pressureAtm = 0.1
    const start = 590
    const step = 0.001
    const n = Math.round((760 - start) / step) + 1
    const tau = new Float64Array(n)
    let expected = 0
    for (const line of lines) {
      const gamma = line.airHalfWidthCmPerAtm * pressureAtm
      const a = line.intensityCmPerMolecule * u
      expected += (a * 2 * Math.atan(5 / gamma)) / Math.PI
      const i0 = Math.ceil((line.wavenumberCm - 5 - start) / step)
      const i1 = Math.floor((line.wavenumberCm + 5 - start) / step)
      for (let i = Math.max(0, i0); i <= Math.min(n - 1, i1); i++) {
        const dx = start + i * step - line.wavenumberCm
        tau[i] += (a * gamma) / (Math.PI * (dx * dx + gamma * gamma))
      }
    }
    let w = 0
    for (let i = 0; i < n; i++) w += (i === 0 || i === n - 1 ? 0.5 : 1) * -Math.expm1(-tau[i])
    w *= step
    let maxTau = 0
    for (let i = 0; i < n; i++) maxTau = Math.max(maxTau, tau[i])
    expect(maxTau).toBeLessThan(0.005) // weak limit: 1 − e^{−τ} within τ/2 of τ
    expectRelativeClose(w, expected, 1e-3, 'W vs Σ S u (truncated)')
    expectRelativeClose(w / u, b.bandIntensityCmPerMolecule, 0.01, 'W/u vs S_band')
  })
})

describe('generateLinearBandTransitions, validation', () => {
  it('when the options are out of range, throws PhysicsError', () => {
    expect(() => generateLinearBandTransitions(LINEAR_BANDS[0], { maxLowerJ: -1 })).toThrow(
      PhysicsError,
    )
    expect(() =>
      generateLinearBandTransitions(LINEAR_BANDS[0], { relativeIntensityCutoff: 2 }),
    ).toThrow(PhysicsError)
  })

  it('when the band has an unknown isotopologue, throws PhysicsError UNSUPPORTED', () => {
    expect(() => generateLinearBandTransitions({ ...LINEAR_BANDS[0], isotopologueId: 9 })).toThrow(
      PhysicsError,
    )
  })

  it('when maxLowerJ is lowered, still normalises to the band intensity', () => {
    const b = LINEAR_BANDS[0]
    const lines = generateLinearBandLines(b, { maxLowerJ: 20 })
    const sum = lines.reduce((s, line) => s + line.intensityCmPerMolecule, 0)
    expectRelativeClose(sum, b.bandIntensityCmPerMolecule, 1e-9)
  })
})
