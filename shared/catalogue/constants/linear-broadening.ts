/**
 * Pressure-broadening models of the linear molecules: simple J-dependent fits of the kind used by
 * the public line lists, γ(|m|) = γ_∞ + (γ₀ − γ_∞) exp(−|m|/m_c) for the air- and self-broadened
 * Lorentz half widths at 296 K, and n(|m|) = max(n_min, n₀ − s|m|) for the temperature exponent.
 * |m| = J″ + 1 for R lines and J″ for P and Q lines. Data only (plus one pure evaluation helper).
 *
 * Accuracy: the fits reproduce representative values recalled from memory to ≈2 %;
 * real half widths differ from band to band and line to line by up to ~5–10 % (vibrational
 * dependence, line mixing is not modelled). Pressure shifts are not modelled (set to 0; typical
 * |δ| ≲ 0.003 cm⁻¹ atm⁻¹ for these bands, from memory).
 */
import { assertFiniteInRange } from '../../physics/errors'
import type { ConfidenceTag } from './confidence'

/** γ(|m|) = limit + (atZero − limit) exp(−|m| / decayM), cm⁻¹ atm⁻¹ at 296 K. */
export interface HalfWidthFit {
  /** γ at |m| = 0, cm⁻¹ atm⁻¹. */
  atZeroCmPerAtm: number
  /** γ for |m| → ∞, cm⁻¹ atm⁻¹. */
  limitCmPerAtm: number
  /** Decay scale m_c (dimensionless). */
  decayM: number
}

/** One broadening model (per band or per molecule). */
export interface LinearBroadeningModel {
  /** Air-broadened half width fit. */
  air: HalfWidthFit
  /** Self-broadened half width fit. */
  self: HalfWidthFit
  /** Temperature exponent n(|m|) = max(min, atZero − slopePerM |m|). */
  temperatureExponent: { atZero: number; slopePerM: number; min: number }
  /** Air pressure shift, cm⁻¹ atm⁻¹ (0 = not modelled). */
  pressureShiftCmPerAtm: number
  /** Published source of the values. */
  source: string
  /** Confidence tag. */
  confidence: ConfidenceTag
}

/**
 * CO2 (all bands): γ_air 0.080 (|m| ≈ 2) → 0.072 (20) → 0.065 (40) → 0.060 (60);
 * γ_self 0.11 → 0.09 (20) → 0.08 (40); n_air ≈ 0.78 → 0.69 (|m| = 60).
 */
export const CO2_BROADENING: LinearBroadeningModel = {
  air: { atZeroCmPerAtm: 0.082, limitCmPerAtm: 0.0555, decayM: 35 },
  self: { atZeroCmPerAtm: 0.113, limitCmPerAtm: 0.073, decayM: 22 },
  temperatureExponent: { atZero: 0.78, slopePerM: 0.0015, min: 0.62 },
  pressureShiftCmPerAtm: 0,
  source:
    'representative values from memory (modern source: Hashemi et al. 2020, JQSRT, sub-percent CO2 line-shape parameters); fit form common practice',
  confidence: 'MEMORY',
}

/**
 * N2O (all bands): γ_air ≈ 0.095 (|m| ≈ 2) → 0.077 (20) → 0.069 (40);
 * γ_self ≈ 0.11 → 0.087 → 0.077;
 * n_air ≈ 0.78 → 0.71 (|m| = 60).
 */
export const N2O_BROADENING: LinearBroadeningModel = {
  air: { atZeroCmPerAtm: 0.098, limitCmPerAtm: 0.064, decayM: 20 },
  self: { atZeroCmPerAtm: 0.112, limitCmPerAtm: 0.072, decayM: 20 },
  temperatureExponent: { atZero: 0.78, slopePerM: 0.0012, min: 0.6 },
  pressureShiftCmPerAtm: 0,
  source:
    'from memory (N2O air widths ≈ 0.07–0.10 cm⁻¹ atm⁻¹ decreasing with J, e.g. Toth 1984-era measurements); fit form common practice',
  confidence: 'MEMORY-low',
}

/**
 * Lorentz half widths and temperature exponent of a line from a broadening model.
 *
 * Method: γ(|m|) = γ_∞ + (γ₀ − γ_∞) e^{−|m|/m_c} (air and self), n(|m|) = max(n_min, n₀ − s|m|).
 * Notes: a smooth published-style fit, not a line-by-line measurement (see the module comment for
 * accuracy). Units: half widths cm⁻¹ atm⁻¹ (HWHM at 296 K), n dimensionless.
 * Source: fit form common practice; values as in the model's `source`.
 * @param model broadening model
 * @param absM |m| (J″ + 1 for R, J″ for P and Q), ≥ 0
 */
export function evaluateBroadening(
  model: LinearBroadeningModel,
  absM: number,
): { airHalfWidthCmPerAtm: number; selfHalfWidthCmPerAtm: number; temperatureExponentAir: number } {
  assertFiniteInRange('absM', absM, 0, 1000)
  const fit = (f: HalfWidthFit) =>
    f.limitCmPerAtm + (f.atZeroCmPerAtm - f.limitCmPerAtm) * Math.exp(-absM / f.decayM)
  const n = model.temperatureExponent
  return {
    airHalfWidthCmPerAtm: fit(model.air),
    selfHalfWidthCmPerAtm: fit(model.self),
    temperatureExponentAir: Math.max(n.min, n.atZero - n.slopePerM * absM),
  }
}
