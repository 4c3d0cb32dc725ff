/**
 * CH4 (¹²CH₄, isotopologue 211) ν₄ constants for the spherical-top approximation of the
 * catalogue. Data only.
 */
import type { BroadeningModel, ConfidenceTag } from './types'

/** Constants of a triply degenerate (F2) fundamental of a spherical top. */
export interface SphericalTopBand {
  /** Stable identifier. */
  id: string
  /** Database molecule number. */
  moleculeId: number
  /** Isotopologue number. */
  isotopologueId: number
  /** Human-readable title. */
  title: string
  /** Vibrational term value of the upper state (band origin), cm⁻¹. */
  bandOriginCm: number
  /** Ground-state rotational constant B₀, cm⁻¹. */
  groundBCm: number
  /** Ground-state centrifugal distortion D₀, cm⁻¹. */
  groundDCm: number
  /** Upper-state rotational constant B′, cm⁻¹. */
  upperBCm: number
  /** Upper-state centrifugal distortion D′, cm⁻¹. */
  upperDCm: number
  /** Coriolis constant ζ of the degenerate vibration (dimensionless). */
  coriolisZeta: number
  /** Band intensity at 296 K, cm⁻¹/(molecule cm⁻²) including the isotopic abundance. */
  bandIntensityCmPerMolecule: number
  /** Pressure-broadening model. */
  broadening: BroadeningModel
  /** Sources. */
  source: string
  /** Confidence of the band intensity and ζ. */
  confidence: ConfidenceTag
}

/** CH4 ν₄ (F2 bending fundamental near 7.7 µm). */
export const METHANE_NU4: SphericalTopBand = {
  id: 'ch4-211-nu4',
  moleculeId: 6,
  isotopologueId: 1,
  title: 'CH4 ν₄ bending fundamental (0001)–(0000)',
  bandOriginCm: 1310.761,
  groundBCm: 5.241,
  groundDCm: 1.11e-4,
  upperBCm: 5.241,
  upperDCm: 1.11e-4,
  coriolisZeta: 0.46,
  bandIntensityCmPerMolecule: 5.5e-18,
  broadening: {
    airAtJ0CmPerAtm: 0.064,
    airDecayPerJ: 0.024,
    airMinCmPerAtm: 0.035,
    selfToAirRatio: 1.25,
    nAirAtJ0: 0.75,
    nAirSlopePerJ: 0.008,
    nAirMin: 0.6,
    pressureShiftCmPerAtm: -0.005,
    source:
      'Representative CH4–air values at 296 K (γ_air ≈ 0.064 at low J falling to ≈0.045 at J ≈ 15, γ_self ≈ 1.25 γ_air, n_air ≈ 0.75–0.6, shifts ≈ −0.005 cm⁻¹ atm⁻¹): from memory, low confidence.',
    confidence: 'MEMORY-low',
  },
  source:
    'ν₄ origin 1310.761 cm⁻¹ and B₀ = 5.2410 cm⁻¹ (from memory, low confidence); D₀ ≈ 1.11e-4 cm⁻¹ (from memory); ζ₄ = 0.46 from the XY₄ sum rule ζ₃ + ζ₄ = ½ with ζ₃ ≈ 0.04 (Herzberg 1945, Infrared and Raman Spectra, ch. IV; from memory, low confidence); B′ = B₀ and D′ = D₀ (no vibration–rotation α, an approximation); band intensity 5.5e-18 cm molecule⁻¹, the middle of a recalled 5.3–5.7e-18 range (from memory, low confidence). With these the Q branch falls at ν₀ − 2B′ζ = 1305.94 cm⁻¹, matching the observed Q-branch peak ≈1306 (from memory).',
  confidence: 'MEMORY-low',
}
