/**
 * Local-thermodynamic-equilibrium (LTE) check for the CO₂ bending mode (01101, 15 µm band):
 * LTE holds for the vibrational populations where collisional de-excitation is much faster than
 * spontaneous emission, k_VT·n ≫ A. This is an ORDER-OF-MAGNITUDE diagnostic: the rate
 * coefficients are uncertain by tens of percent and atomic oxygen (which dominates above ~85 km)
 * is only included when its density is supplied.
 * Sources: López-Puertas & Taylor 2001, Non-LTE Radiative Transfer in the Atmosphere, ch. 6
 * (k_VT fit based on Siddles, Wilson & Simpson 1994, Chem. Phys.; from memory, low confidence);
 * Castle et al. 2006, JGR 111, A09303 (k for CO₂(ν₂) + O, 1.8 × 10⁻¹² cm³ s⁻¹); Einstein
 * A ≈ 1.5 s⁻¹ computed from the band intensity ≈7.9 × 10⁻¹⁸ cm molecule⁻¹ (from memory).
 */
import { BOLTZMANN_J_PER_K } from '../constants'
import { PhysicsError } from '../errors'

/** Einstein A of the CO₂ 01101 → 00001 band, s⁻¹ (≈1.5; literature 1.3–1.5; from memory). */
export const CO2_BENDING_EINSTEIN_A_PER_S = 1.5
/** Default ratio below which non-LTE is flagged (common practice: an order of magnitude). */
export const LTE_RATIO_THRESHOLD = 10
/** k for CO₂(ν₂) + O, cm³ s⁻¹ (laboratory, Castle et al. 2006, JGR 111, A09303). */
export const CO2_BENDING_ATOMIC_OXYGEN_RATE_CM3_PER_S = 1.8e-12

/**
 * Vibrational–translational de-excitation rate coefficient of CO₂(01101) by N₂ and O₂.
 *
 * Method: k_VT(T) = 7 × 10⁻¹⁷ √T + 6.7 × 10⁻¹⁰ exp(−83.8 T^{−1/3}) cm³ s⁻¹.
 * Notes: fit from the non-LTE literature (from memory, low confidence); ≈3.5 × 10⁻¹⁵ at 295 K,
 * ≈1.4 × 10⁻¹⁵ at 200 K; room-temperature measurements (3–6) × 10⁻¹⁵. Use as an order of
 * magnitude only.
 * Source: López-Puertas & Taylor 2001, ch. 6, after Siddles, Wilson & Simpson 1994 (from memory).
 *
 * @param temperatureK kinetic temperature, K, in (0, 1000]
 * @returns rate coefficient, cm³ s⁻¹
 */
export function co2BendingVtRateCoefficientCm3PerS(temperatureK: number): number {
  if (!(temperatureK > 0 && temperatureK <= 1000)) {
    throw new PhysicsError('OUT_OF_RANGE', `temperatureK = ${temperatureK} must be in (0, 1000]`)
  }
  return 7e-17 * Math.sqrt(temperatureK) + 6.7e-10 * Math.exp(-83.8 * Math.cbrt(1 / temperatureK))
}

/** Options of the LTE check. */
export interface LteCheckOptions {
  /** Einstein A, s⁻¹ (default 1.5). */
  einsteinAPerS?: number
  /** Ratio below which a level is flagged (default 10). */
  ratioThreshold?: number
  /** Atomic-oxygen number density per level, cm⁻³ (optional; adds k_O·n_O). */
  atomicOxygenPerCm3?: ArrayLike<number>
  /** k for CO₂(ν₂) + O, cm³ s⁻¹ (default 1.8e-12). */
  atomicOxygenRateCm3PerS?: number
}

/** Per-level output of the LTE check. */
export interface LteCheckResult {
  /** Air number density, cm⁻³. */
  airNumberDensityPerCm3: Float64Array
  /** Collisional de-excitation rate k_VT·n (+ k_O·n_O), s⁻¹. */
  collisionRatePerS: Float64Array
  /** Collision rate divided by A, dimensionless. */
  ratio: Float64Array
  /** 1 where ratio < threshold (non-LTE risk). */
  nonLteRisk: Uint8Array
}

/**
 * Per-level LTE diagnostic for the CO₂ bending mode: collisional de-excitation rate versus the
 * spontaneous emission rate.
 *
 * Method: n = p/(k_B T) (ideal gas, converted to cm⁻³); rate = k_VT(T)·n [+ k_O·n_O];
 * ratio = rate/A; flag where ratio < threshold (10 by default).
 * Notes: order of magnitude only (rate coefficients from memory, low confidence). Ratio ≈ 6 × 10⁴
 * at 1000 hPa, 295 K; with a US76-like profile it falls below 10 in the upper mesosphere (around
 * 55–65 km with this fit) and below 1 near 73 km.
 * Source: López-Puertas & Taylor 2001, ch. 6 (from memory); see module note.
 *
 * @param levelPressurePa pressure per level, Pa (> 0)
 * @param levelTemperatureK temperature per level, K
 * @param options A, threshold, optional atomic oxygen
 * @returns number density (cm⁻³), collision rate (s⁻¹), ratio, flag per level
 */
export function lteCheck(
  levelPressurePa: ArrayLike<number>,
  levelTemperatureK: ArrayLike<number>,
  options: LteCheckOptions = {},
): LteCheckResult {
  const n = levelPressurePa.length
  if (n < 1 || levelTemperatureK.length !== n) {
    throw new PhysicsError('INVALID_ARGUMENT', 'pressure and temperature lengths differ or are 0')
  }
  const a = options.einsteinAPerS ?? CO2_BENDING_EINSTEIN_A_PER_S
  const threshold = options.ratioThreshold ?? LTE_RATIO_THRESHOLD
  const kO = options.atomicOxygenRateCm3PerS ?? CO2_BENDING_ATOMIC_OXYGEN_RATE_CM3_PER_S
  if (
    !(a > 0 && a < Infinity) ||
    !(threshold > 0 && threshold < Infinity) ||
    !(kO >= 0 && kO < 1)
  ) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      'Einstein A, threshold and k_O must be positive and finite',
    )
  }
  const oxygen = options.atomicOxygenPerCm3
  if (oxygen && oxygen.length !== n) {
    throw new PhysicsError('INVALID_ARGUMENT', 'atomicOxygenPerCm3 must have one value per level')
  }
  const result: LteCheckResult = {
    airNumberDensityPerCm3: new Float64Array(n),
    collisionRatePerS: new Float64Array(n),
    ratio: new Float64Array(n),
    nonLteRisk: new Uint8Array(n),
  }
  for (let l = 0; l < n; l++) {
    const p = levelPressurePa[l]
    const t = levelTemperatureK[l]
    if (!(p > 0 && p < 1e7))
      throw new PhysicsError('OUT_OF_RANGE', `pressure ${p} Pa invalid`, { level: l })
    const density = (p / (BOLTZMANN_J_PER_K * t)) * 1e-6
    let rate = co2BendingVtRateCoefficientCm3PerS(t) * density
    if (oxygen) {
      const nO = oxygen[l]
      if (!(nO >= 0 && nO < Infinity)) {
        throw new PhysicsError('OUT_OF_RANGE', 'atomic oxygen density must be ≥ 0', { level: l })
      }
      rate += kO * nO
    }
    result.airNumberDensityPerCm3[l] = density
    result.collisionRatePerS[l] = rate
    result.ratio[l] = rate / a
    result.nonLteRisk[l] = rate / a < threshold ? 1 : 0
  }
  return result
}
