/**
 * The χ-factor of CO2 line wings: the ratio of the measured far-wing absorption of a CO2 line to
 * that of a Lorentz line, in the piecewise-exponential form of Perrin & Hartmann (1989).
 *
 *   χ(Δν, T) = 1                                                    |Δν| ≤ σ₁
 *            = exp[−B₁(|Δν| − σ₁)]                                   σ₁ < |Δν| ≤ σ₂
 *            = exp[−B₁(σ₂ − σ₁) − B₂(|Δν| − σ₂)]                     σ₂ < |Δν| ≤ σ₃
 *            = exp[−B₁(σ₂ − σ₁) − B₂(σ₃ − σ₂) − B₃(|Δν| − σ₃)]       |Δν| > σ₃
 *
 * σ₁ = 3, σ₂ = 30, σ₃ = 120 cm⁻¹; B₁ = 0.0888 − 0.16 e^{−0.0041 T}, B₂ = 0.0526 e^{−0.00152 T},
 * B₃ = 0.0232 (cm⁻¹)⁻¹, T in K.
 *
 * Confidence: from memory, low confidence — the form and coefficients are recalled from Perrin &
 * Hartmann 1989, JQSRT 42, 311, and must be checked against the paper before any result depends
 * on them quantitatively. They were derived for CO2–N2 in the 4.3 µm band wing (≈193 K to above
 * room temperature); applying them to air broadening and to the 15 µm band is an approximation
 * (the real χ depends on the band and is asymmetric about the line centre: Appl. Opt. 30, 281,
 * 1991, for the low-wavenumber wing of ν₃).
 */
import { assertFiniteInRange } from '../errors'
import type { LineWingWeight } from './line-wing-weight'

/**
 * Break points σ₁, σ₂, σ₃ of χ, cm⁻¹ (Perrin & Hartmann 1989, JQSRT 42, 311; from memory, low
 * confidence).
 */
export const CO2_CHI_BREAKPOINTS_CM = { sigma1: 3, sigma2: 30, sigma3: 120 } as const

/**
 * Temperatures accepted by the χ-factor, K. Below ≈144 K the fitted B₁ turns negative (χ > 1,
 * not a sub-Lorentzian wing), so the range stops at 150 K; above ≈300 K it is an extrapolation of
 * the recalled fit.
 */
export const CO2_CHI_TEMPERATURE_RANGE_K = { min: 150, max: 800 } as const

/** Decay constants B₁, B₂, B₃ of the χ-factor at one temperature, (cm⁻¹)⁻¹. */
export interface Co2ChiCoefficients {
  b1PerCm: number
  b2PerCm: number
  b3PerCm: number
}

/**
 * Decay constants of the CO2 χ-factor at a temperature.
 *
 * Method: B₁ = 0.0888 − 0.16 e^{−0.0041 T}, B₂ = 0.0526 e^{−0.00152 T}, B₃ = 0.0232.
 * Notes: at 296 K: B₁ = 0.04126, B₂ = 0.03354, B₃ = 0.0232. Accepts 150–800 K (B₁ > 0 there).
 * Coefficients from memory, low confidence. Units: (cm⁻¹)⁻¹.
 * Source: Perrin & Hartmann 1989, JQSRT 42, 311 (form and coefficients from memory, low
 * confidence).
 * @param temperatureK T, K
 */
export function co2ChiCoefficients(temperatureK: number): Co2ChiCoefficients {
  const { min, max } = CO2_CHI_TEMPERATURE_RANGE_K
  assertFiniteInRange('temperatureK', temperatureK, min, max)
  return {
    b1PerCm: 0.0888 - 0.16 * Math.exp(-0.0041 * temperatureK),
    b2PerCm: 0.0526 * Math.exp(-0.00152 * temperatureK),
    b3PerCm: 0.0232,
  }
}

/**
 * χ at a detuning for given decay constants (no validation; for inner loops).
 * Method and source as `co2ChiFactor`.
 */
function chiWithCoefficients(detuningCm: number, c: Co2ChiCoefficients): number {
  const { sigma1, sigma2, sigma3 } = CO2_CHI_BREAKPOINTS_CM
  const d = Math.abs(detuningCm)
  if (d <= sigma1) return 1
  if (d <= sigma2) return Math.exp(-c.b1PerCm * (d - sigma1))
  if (d <= sigma3) return Math.exp(-c.b1PerCm * (sigma2 - sigma1) - c.b2PerCm * (d - sigma2))
  return Math.exp(
    -c.b1PerCm * (sigma2 - sigma1) - c.b2PerCm * (sigma3 - sigma2) - c.b3PerCm * (d - sigma3),
  )
}

/**
 * Sub-Lorentzian far-wing factor χ of a CO2 line.
 *
 * Method: the piecewise exponential of the module comment, symmetric in the sign of Δν = ν − ν*,
 * continuous at σ₁, σ₂, σ₃ (slope discontinuities there).
 * Notes: multiplies the Lorentz (Voigt) profile of each CO2 line beyond 3 cm⁻¹ from its centre;
 * χ(30 cm⁻¹, 296 K) = 0.33, χ(120 cm⁻¹, 296 K) = 0.016. Weakens the far wings that make the
 * 8–12 µm window absorption of CO2; the band-integrated absorption of optically thick bands changes
 * little. Coefficients from memory, low confidence (see the module comment). Accepts 150–800 K; any
 * finite Δν. Dimensionless, in (0, 1].
 * Source: Perrin & Hartmann 1989, JQSRT 42, 311 (from memory, low confidence); sub-Lorentzian CO2
 * wings first measured by Burch, Gryvnak, Patty & Bartky 1969, J. Opt. Soc. Am. 59, 267.
 * @param detuningCm ν − ν*, cm⁻¹
 * @param temperatureK T, K
 */
export function co2ChiFactor(detuningCm: number, temperatureK: number): number {
  assertFiniteInRange('detuningCm', detuningCm, -Infinity, Infinity)
  return chiWithCoefficients(detuningCm, co2ChiCoefficients(temperatureK))
}

/**
 * The CO2 χ-factor as a far-wing weight for the optics: onset σ₁, kinks σ₁, σ₂, σ₃, and a
 * per-temperature evaluator (coefficients computed once, no allocation per call).
 * Source: as `co2ChiFactor`.
 */
export const CO2_CHI_WING_WEIGHT: LineWingWeight = {
  onsetCm: CO2_CHI_BREAKPOINTS_CM.sigma1,
  kinksCm: [
    CO2_CHI_BREAKPOINTS_CM.sigma1,
    CO2_CHI_BREAKPOINTS_CM.sigma2,
    CO2_CHI_BREAKPOINTS_CM.sigma3,
  ],
  atTemperature(temperatureK: number) {
    const coefficients = co2ChiCoefficients(temperatureK)
    return (detuningCm: number) => chiWithCoefficients(detuningCm, coefficients)
  },
}
