/**
 * Water-vapour profiles from a relative-humidity distribution: the Manabe–Wetherald (1967) form
 * RH = RH*(Q − 0.02)/0.98, Q = p/p_s, below the tropopause, and a fixed stratospheric mixing ratio
 * above it, never exceeding saturation.
 */
import { PhysicsError } from '../errors'
import { EPSILON_WATER_DRY_AIR, saturationVapourPressurePa, type SaturationPhase } from './humidity'

/**
 * Stratospheric water-vapour floor of Manabe & Wetherald 1967: 3 × 10⁻⁶ g/g (mass mixing ratio,
 * value from memory), as a volume mixing ratio 3e-6/ε ≈ 4.82 × 10⁻⁶ mol/mol.
 */
export const MANABE_WETHERALD_STRATOSPHERIC_WATER_VMR = 3e-6 / (EPSILON_WATER_DRY_AIR + 3e-6)

/** Manabe & Wetherald 1967 surface relative humidity RH* = 0.77 (value from memory). */
export const MANABE_WETHERALD_SURFACE_RELATIVE_HUMIDITY = 0.77

/**
 * Relative humidity at a pressure in the Manabe–Wetherald (1967) distribution.
 *
 * Method: RH = RH* (Q − 0.02)/(1 − 0.02), Q = p/p_s, and RH = 0 where Q ≤ 0.02.
 * Notes: a fixed-relative-humidity idealisation; RH falls roughly linearly with pressure.
 * Source: Manabe & Wetherald 1967, J. Atmos. Sci. 24, 241–259, eq. (2) (form and equation
 * number from memory).
 *
 * @param pressurePa pressure, Pa
 * @param surfacePressurePa surface pressure p_s, Pa
 * @param surfaceRelativeHumidity RH* (fraction, default 0.77)
 * @returns relative humidity, fraction
 */
export function manabeWetheraldRelativeHumidity(
  pressurePa: number,
  surfacePressurePa: number,
  surfaceRelativeHumidity = MANABE_WETHERALD_SURFACE_RELATIVE_HUMIDITY,
): number {
  if (!(surfacePressurePa > 0) || !(pressurePa > 0) || !Number.isFinite(surfacePressurePa)) {
    throw new PhysicsError('OUT_OF_RANGE', 'pressures must be finite and > 0', {
      pressurePa,
      surfacePressurePa,
    })
  }
  if (!(surfaceRelativeHumidity >= 0 && surfaceRelativeHumidity <= 1)) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `surfaceRelativeHumidity = ${surfaceRelativeHumidity} is outside [0, 1]`,
      {
        name: 'surfaceRelativeHumidity',
        value: surfaceRelativeHumidity,
      },
    )
  }
  const q = pressurePa / surfacePressurePa
  return Math.max(0, (surfaceRelativeHumidity * (q - 0.02)) / 0.98)
}

/** Inputs of `waterVapourVmrProfile`. */
export interface WaterVapourProfileInput {
  /** Level pressures, Pa, surface first. */
  pressurePa: ArrayLike<number>
  /** Level temperatures, K. */
  temperatureK: ArrayLike<number>
  /** Level relative humidities (fraction) used below the tropopause. */
  relativeHumidity: ArrayLike<number>
  /** Tropopause pressure, Pa: at lower pressures the stratospheric value is used. */
  tropopausePressurePa: number
  /** Stratospheric volume mixing ratio (and tropospheric floor), mol/mol. */
  stratosphericVmr: number
  /** Reference phase for saturation and RH, default 'water'. */
  phase?: SaturationPhase
}

/**
 * Water-vapour volume mixing ratio per level from relative humidity, with a stratospheric value.
 *
 * Method: for p ≥ p_trop, x = max(RH · e_s(T)/p, x_strat); for p < p_trop, x = x_strat; finally
 * x ≤ e_s(T)/p everywhere, so no level is supersaturated with respect to the chosen phase.
 * Notes: the floor in the upper troposphere follows Manabe & Wetherald's treatment of the
 * stratospheric mixing ratio as a lower limit (from memory); the saturation cap can lower the
 * stratospheric value at a very cold tropopause (a cold trap).
 * Source: Manabe & Wetherald 1967, J. Atmos. Sci. 24, 241; e_s from Murphy & Koop 2005.
 *
 * @param input pressures (Pa), temperatures (K), RH (fraction), tropopause (Pa), floor (mol/mol)
 * @param out optional output of the same length
 * @returns water-vapour volume mixing ratios, mol/mol of moist air
 */
export function waterVapourVmrProfile(
  input: WaterVapourProfileInput,
  out: Float64Array = new Float64Array(input.pressurePa.length),
): Float64Array {
  const { pressurePa, temperatureK, relativeHumidity, tropopausePressurePa, stratosphericVmr } =
    input
  const n = pressurePa.length
  if (temperatureK.length !== n || relativeHumidity.length !== n || out.length !== n) {
    throw new PhysicsError('INVALID_ARGUMENT', 'all level arrays must have the same length', { n })
  }
  if (!(stratosphericVmr >= 0 && stratosphericVmr < 0.01)) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `stratosphericVmr = ${stratosphericVmr} is outside [0, 0.01)`,
      {
        name: 'stratosphericVmr',
        value: stratosphericVmr,
      },
    )
  }
  if (!(tropopausePressurePa > 0)) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `tropopausePressurePa = ${tropopausePressurePa} must be > 0`,
      {},
    )
  }
  for (let i = 0; i < n; i++) {
    const p = pressurePa[i]
    const rh = relativeHumidity[i]
    if (!(p > 0) || !(rh >= 0 && rh <= 1)) {
      throw new PhysicsError('OUT_OF_RANGE', `level ${i}: pressure must be > 0 and RH in [0, 1]`, {
        index: i,
        pressurePa: p,
        relativeHumidity: rh,
      })
    }
    const saturationVmr = saturationVapourPressurePa(temperatureK[i], input.phase) / p
    const wanted =
      p >= tropopausePressurePa ? Math.max(rh * saturationVmr, stratosphericVmr) : stratosphericVmr
    out[i] = Math.min(wanted, saturationVmr)
  }
  return out
}
