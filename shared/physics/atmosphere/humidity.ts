/**
 * Humidity: saturation vapour pressure over liquid water and ice, dew and frost point, and the
 * conversions between relative humidity, vapour pressure, mixing ratio, specific humidity and
 * volume mixing ratio.
 *
 * Units: pressure Pa, temperature K, relative humidity as a fraction (0.5 = 50 %), mixing ratio
 * and specific humidity in kg kg⁻¹, volume mixing ratio in mol/mol of moist air. The enhancement
 * factor of moist air (≈1.004 near the surface) is neglected: vapour pressures are those of the
 * pure phase, as in common meteorological practice.
 */
import { DRY_AIR_MOLAR_MASS_KG_PER_MOL, WATER_MOLAR_MASS_KG_PER_MOL } from '../constants'
import { PhysicsError } from '../errors'

/** ε = M_w/M_d ≈ 0.621 98 (from the molar masses in constants.ts; often rounded to 0.622). */
export const EPSILON_WATER_DRY_AIR = WATER_MOLAR_MASS_KG_PER_MOL / DRY_AIR_MOLAR_MASS_KG_PER_MOL

/** Melting point used to switch between water and ice, K. */
export const FREEZING_POINT_K = 273.15

/** Reference phase for saturation: liquid water at all temperatures, or ice below 273.15 K. */
export type SaturationPhase = 'water' | 'ice-below-freezing'

function assertRange(name: string, value: number, min: number, max: number): void {
  if (!Number.isFinite(value) || value < min || value > max) {
    throw new PhysicsError('OUT_OF_RANGE', `${name} = ${value} is outside [${min}, ${max}]`, {
      name,
      value,
      min,
      max,
    })
  }
}

function assertPositive(name: string, value: number): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new PhysicsError('OUT_OF_RANGE', `${name} = ${value} must be finite and > 0`, {
      name,
      value,
    })
  }
}

/**
 * Saturation vapour pressure over (possibly supercooled) liquid water.
 *
 * Method: ln e_w = 54.842763 − 6763.22/T − 4.210 ln T + 0.000367 T
 *   + tanh[0.0415 (T − 218.8)] (53.878 − 1331.22/T − 9.44523 ln T + 0.014025 T), e_w in Pa.
 * Notes: valid 123 K < T < 332 K; agrees with the best measurements to better than 0.05 % above
 * 273 K. Accepted range here: 123–332 K.
 * Source: Murphy & Koop 2005, Q. J. R. Meteorol. Soc. 131, 1539–1565, eq. (10).
 *
 * @param temperatureK temperature, K
 * @returns saturation vapour pressure, Pa
 */
export function saturationVapourPressureOverWaterPa(temperatureK: number): number {
  assertRange('temperatureK', temperatureK, 123, 332)
  const t = temperatureK
  const lnT = Math.log(t)
  return Math.exp(
    54.842763 -
      6763.22 / t -
      4.21 * lnT +
      0.000367 * t +
      Math.tanh(0.0415 * (t - 218.8)) * (53.878 - 1331.22 / t - 9.44523 * lnT + 0.014025 * t),
  )
}

/**
 * Saturation vapour pressure over hexagonal ice.
 *
 * Method: ln e_i = 9.550426 − 5723.265/T + 3.53068 ln T − 0.00728332 T, e_i in Pa.
 * Notes: valid for T > 110 K (and up to the triple point, 273.16 K, where e_i = 611.657 Pa).
 * Accepted range here: 110–273.16 K.
 * Source: Murphy & Koop 2005, Q. J. R. Meteorol. Soc. 131, 1539–1565, eq. (7).
 *
 * @param temperatureK temperature, K
 * @returns saturation vapour pressure over ice, Pa
 */
export function saturationVapourPressureOverIcePa(temperatureK: number): number {
  assertRange('temperatureK', temperatureK, 110, 273.16)
  const t = temperatureK
  return Math.exp(9.550426 - 5723.265 / t + 3.53068 * Math.log(t) - 0.00728332 * t)
}

/**
 * Saturation vapour pressure over liquid water, Bolton's Magnus-type fit.
 *
 * Method: e_s = 611.2 exp[17.67 t/(t + 243.5)] Pa, t = T − 273.15 in °C.
 * Notes: ±0.1 % for −30 °C ≤ t ≤ 35 °C; analytically invertible (see `dewPointBoltonK`).
 * Accepted range here: 193.15–333.15 K (−80…60 °C), where it degrades gracefully.
 * Source: Bolton 1980, Mon. Wea. Rev. 108, 1046–1053, eq. (10) (equation number from memory).
 *
 * @param temperatureK temperature, K
 * @returns saturation vapour pressure, Pa
 */
export function saturationVapourPressureBoltonPa(temperatureK: number): number {
  assertRange('temperatureK', temperatureK, 193.15, 333.15)
  const t = temperatureK - FREEZING_POINT_K
  return 611.2 * Math.exp((17.67 * t) / (t + 243.5))
}

/**
 * Saturation vapour pressure for a chosen reference phase.
 *
 * Method: Murphy & Koop 2005 eq. (10) over water; with 'ice-below-freezing', eq. (7) over ice
 * for T < 273.15 K (so relative humidity is then taken with respect to ice in the cold).
 * Notes: 'water' is the WMO convention for reported relative humidity. Range 123–332 K (water),
 * 110 K upward (ice).
 * Source: Murphy & Koop 2005, QJRMS 131, 1539, eqs. (7) and (10).
 *
 * @param temperatureK temperature, K
 * @param phase reference phase, default 'water'
 * @returns saturation vapour pressure, Pa
 */
export function saturationVapourPressurePa(
  temperatureK: number,
  phase: SaturationPhase = 'water',
): number {
  if (phase === 'ice-below-freezing' && temperatureK < FREEZING_POINT_K) {
    return saturationVapourPressureOverIcePa(temperatureK)
  }
  return saturationVapourPressureOverWaterPa(temperatureK)
}

/** Newton iteration on ln e_s(T) = ln e, starting from a first guess, for a monotone e_s. */
function invertSaturation(
  vapourPressurePa: number,
  guessK: number,
  saturation: (temperatureK: number) => number,
  minK: number,
  maxK: number,
): number {
  const target = Math.log(vapourPressurePa)
  let t = Math.min(Math.max(guessK, minK + 1), maxK - 1)
  for (let iteration = 0; iteration < 50; iteration++) {
    const h = 1e-4
    const f = Math.log(saturation(t)) - target
    const slope = (Math.log(saturation(t + h)) - Math.log(saturation(t - h))) / (2 * h)
    const step = f / slope
    t = Math.min(Math.max(t - step, minK + 2 * h), maxK - 2 * h)
    if (Math.abs(step) < 1e-10 * t) return t
  }
  return t
}

/**
 * Dew point (saturation over liquid water) for a vapour pressure.
 *
 * Method: solves e_w(T_d) = e with Murphy & Koop 2005 eq. (10) by Newton iteration on ln e_w,
 * started from Bolton's analytic inverse.
 * Notes: accurate to ≈1e-8 K; e must lie within e_w(123 K)…e_w(332 K) ≈ 7e-6…20 700 Pa.
 * Source: Murphy & Koop 2005, QJRMS 131, 1539, eq. (10).
 *
 * @param vapourPressurePa water-vapour partial pressure, Pa
 * @returns dew-point temperature, K
 */
export function dewPointK(vapourPressurePa: number): number {
  const min = saturationVapourPressureOverWaterPa(123)
  const max = saturationVapourPressureOverWaterPa(332)
  assertRange('vapourPressurePa', vapourPressurePa, min, max)
  const lnRatio = Math.log(vapourPressurePa / 611.2)
  const guess = FREEZING_POINT_K + (243.5 * lnRatio) / (17.67 - lnRatio)
  return invertSaturation(vapourPressurePa, guess, saturationVapourPressureOverWaterPa, 123, 332)
}

/**
 * Frost point (saturation over ice) for a vapour pressure.
 *
 * Method: solves e_i(T_f) = e with Murphy & Koop 2005 eq. (7) by Newton iteration.
 * Notes: e must lie within e_i(110 K)…e_i(273.16 K) ≈ 1.1e-9…611.657 Pa.
 * Source: Murphy & Koop 2005, QJRMS 131, 1539, eq. (7).
 *
 * @param vapourPressurePa water-vapour partial pressure, Pa
 * @returns frost-point temperature, K
 */
export function frostPointK(vapourPressurePa: number): number {
  const min = saturationVapourPressureOverIcePa(110)
  const max = saturationVapourPressureOverIcePa(273.16)
  assertRange('vapourPressurePa', vapourPressurePa, min, max)
  // ln e_i is nearly linear in 1/T: start from the Clausius–Clapeyron line through the triple point.
  const guess = 1 / (1 / 273.16 - Math.log(vapourPressurePa / 611.657) / 6150)
  return invertSaturation(vapourPressurePa, guess, saturationVapourPressureOverIcePa, 110, 273.16)
}

/**
 * Dew point from Bolton's fit, analytically.
 *
 * Method: t_d = 243.5 ln(e/611.2)/(17.67 − ln(e/611.2)) °C, the inverse of Bolton 1980 eq. (10).
 * Notes: consistent with `saturationVapourPressureBoltonPa` to rounding; ≈0.02 K from the
 * Murphy–Koop dew point over −30…35 °C.
 * Source: Bolton 1980, Mon. Wea. Rev. 108, 1046, eq. (11) (equation number from memory).
 *
 * @param vapourPressurePa water-vapour partial pressure, Pa (1–20 000)
 * @returns dew-point temperature, K
 */
export function dewPointBoltonK(vapourPressurePa: number): number {
  assertRange('vapourPressurePa', vapourPressurePa, 1e-3, 2e4)
  const lnRatio = Math.log(vapourPressurePa / 611.2)
  return FREEZING_POINT_K + (243.5 * lnRatio) / (17.67 - lnRatio)
}

/**
 * Vapour pressure from dew point (saturation over water at T_d).
 *
 * Method: e = e_w(T_d), Murphy & Koop 2005 eq. (10).
 * Source: Murphy & Koop 2005, QJRMS 131, 1539, eq. (10); definition of the dew point.
 *
 * @param dewPointTemperatureK dew point, K (123–332)
 * @returns vapour pressure, Pa
 */
export function vapourPressureFromDewPointPa(dewPointTemperatureK: number): number {
  return saturationVapourPressureOverWaterPa(dewPointTemperatureK)
}

/**
 * Relative humidity from vapour pressure and temperature.
 *
 * Method: RH = e/e_s(T) for the chosen phase (WMO definition uses water).
 * Source: WMO-No. 8 (Guide to Instruments and Methods of Observation), definition of RH; e_s from
 * Murphy & Koop 2005.
 *
 * @param vapourPressurePa vapour pressure, Pa (≥ 0)
 * @param temperatureK temperature, K
 * @param phase reference phase, default 'water'
 * @returns relative humidity, fraction
 */
export function relativeHumidityFromVapourPressure(
  vapourPressurePa: number,
  temperatureK: number,
  phase: SaturationPhase = 'water',
): number {
  assertRange('vapourPressurePa', vapourPressurePa, 0, Number.MAX_VALUE)
  return vapourPressurePa / saturationVapourPressurePa(temperatureK, phase)
}

/**
 * Vapour pressure from relative humidity and temperature.
 *
 * Method: e = RH · e_s(T).
 * Notes: RH is limited to [0, 1.5] (ice supersaturation up to ~50 % occurs; water
 * supersaturation above a few tenths of a percent does not).
 * Source: definition of relative humidity (WMO-No. 8); e_s from Murphy & Koop 2005.
 *
 * @param relativeHumidity fraction
 * @param temperatureK temperature, K
 * @param phase reference phase, default 'water'
 * @returns vapour pressure, Pa
 */
export function vapourPressureFromRelativeHumidityPa(
  relativeHumidity: number,
  temperatureK: number,
  phase: SaturationPhase = 'water',
): number {
  assertRange('relativeHumidity', relativeHumidity, 0, 1.5)
  return relativeHumidity * saturationVapourPressurePa(temperatureK, phase)
}

function assertVapourBelowPressure(vapourPressurePa: number, pressurePa: number): void {
  assertPositive('pressurePa', pressurePa)
  if (
    !Number.isFinite(vapourPressurePa) ||
    vapourPressurePa < 0 ||
    vapourPressurePa >= pressurePa
  ) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `vapourPressurePa = ${vapourPressurePa} must be in [0, pressurePa = ${pressurePa})`,
      { vapourPressurePa, pressurePa },
    )
  }
}

/**
 * Water-vapour mixing ratio (mass of vapour per mass of dry air) from vapour pressure.
 *
 * Method: r = ε e/(p − e), ε = M_w/M_d.
 * Source: Wallace & Hobbs 2006, Atmospheric Science, 2nd ed., ch. 3 (moisture variables).
 *
 * @param vapourPressurePa vapour pressure, Pa (< p)
 * @param pressurePa total pressure, Pa
 * @returns mixing ratio, kg kg⁻¹
 */
export function mixingRatioFromVapourPressure(
  vapourPressurePa: number,
  pressurePa: number,
): number {
  assertVapourBelowPressure(vapourPressurePa, pressurePa)
  return (EPSILON_WATER_DRY_AIR * vapourPressurePa) / (pressurePa - vapourPressurePa)
}

/**
 * Vapour pressure from mixing ratio.
 *
 * Method: e = r p/(ε + r), the inverse of r = εe/(p − e).
 * Source: Wallace & Hobbs 2006, ch. 3, inverted.
 *
 * @param mixingRatio kg kg⁻¹ (≥ 0)
 * @param pressurePa total pressure, Pa
 * @returns vapour pressure, Pa
 */
export function vapourPressureFromMixingRatioPa(mixingRatio: number, pressurePa: number): number {
  assertRange('mixingRatio', mixingRatio, 0, Number.MAX_VALUE)
  assertPositive('pressurePa', pressurePa)
  return (mixingRatio * pressurePa) / (EPSILON_WATER_DRY_AIR + mixingRatio)
}

/**
 * Specific humidity (mass of vapour per mass of moist air) from vapour pressure.
 *
 * Method: q = ε e/(p − (1 − ε) e).
 * Source: Wallace & Hobbs 2006, ch. 3 (exact form, without the e ≪ p approximation).
 *
 * @param vapourPressurePa vapour pressure, Pa (< p)
 * @param pressurePa total pressure, Pa
 * @returns specific humidity, kg kg⁻¹
 */
export function specificHumidityFromVapourPressure(
  vapourPressurePa: number,
  pressurePa: number,
): number {
  assertVapourBelowPressure(vapourPressurePa, pressurePa)
  return (
    (EPSILON_WATER_DRY_AIR * vapourPressurePa) /
    (pressurePa - (1 - EPSILON_WATER_DRY_AIR) * vapourPressurePa)
  )
}

/**
 * Vapour pressure from specific humidity.
 *
 * Method: e = q p/(ε + (1 − ε) q).
 * Source: inverse of the specific-humidity definition (Wallace & Hobbs 2006, ch. 3).
 *
 * @param specificHumidity kg kg⁻¹ in [0, 1)
 * @param pressurePa total pressure, Pa
 * @returns vapour pressure, Pa
 */
export function vapourPressureFromSpecificHumidityPa(
  specificHumidity: number,
  pressurePa: number,
): number {
  assertRange('specificHumidity', specificHumidity, 0, 1 - Number.EPSILON)
  assertPositive('pressurePa', pressurePa)
  return (
    (specificHumidity * pressurePa) /
    (EPSILON_WATER_DRY_AIR + (1 - EPSILON_WATER_DRY_AIR) * specificHumidity)
  )
}

/**
 * Volume mixing ratio of water vapour in moist air from vapour pressure (Dalton's law).
 *
 * Method: x = e/p.
 * Source: Dalton's law of partial pressures (ideal gas).
 *
 * @param vapourPressurePa vapour pressure, Pa (< p)
 * @param pressurePa total pressure, Pa
 * @returns volume mixing ratio, mol/mol of moist air
 */
export function vmrFromVapourPressure(vapourPressurePa: number, pressurePa: number): number {
  assertVapourBelowPressure(vapourPressurePa, pressurePa)
  return vapourPressurePa / pressurePa
}

/**
 * Vapour pressure from volume mixing ratio (Dalton's law).
 *
 * Method: e = x p.
 * Source: Dalton's law of partial pressures.
 *
 * @param vmr mol/mol of moist air, [0, 1)
 * @param pressurePa total pressure, Pa
 * @returns vapour pressure, Pa
 */
export function vapourPressureFromVmrPa(vmr: number, pressurePa: number): number {
  assertRange('vmr', vmr, 0, 1 - Number.EPSILON)
  assertPositive('pressurePa', pressurePa)
  return vmr * pressurePa
}

/**
 * Specific humidity from mixing ratio.
 *
 * Method: q = r/(1 + r).
 * Source: definitions (Wallace & Hobbs 2006, ch. 3).
 *
 * @param mixingRatio kg kg⁻¹ (≥ 0)
 * @returns specific humidity, kg kg⁻¹
 */
export function specificHumidityFromMixingRatio(mixingRatio: number): number {
  assertRange('mixingRatio', mixingRatio, 0, Number.MAX_VALUE)
  return mixingRatio / (1 + mixingRatio)
}

/**
 * Mixing ratio from specific humidity.
 *
 * Method: r = q/(1 − q).
 * Source: definitions (Wallace & Hobbs 2006, ch. 3).
 *
 * @param specificHumidity kg kg⁻¹ in [0, 1)
 * @returns mixing ratio, kg kg⁻¹
 */
export function mixingRatioFromSpecificHumidity(specificHumidity: number): number {
  assertRange('specificHumidity', specificHumidity, 0, 1 - Number.EPSILON)
  return specificHumidity / (1 - specificHumidity)
}

/**
 * Volume mixing ratio (moist air) from mass mixing ratio.
 *
 * Method: x = r/(ε + r) (moles of vapour r/M_w per moles of moist air 1/M_d + r/M_w).
 * Source: definitions; ε = M_w/M_d.
 *
 * @param mixingRatio kg kg⁻¹ (≥ 0)
 * @returns volume mixing ratio, mol/mol of moist air
 */
export function vmrFromMixingRatio(mixingRatio: number): number {
  assertRange('mixingRatio', mixingRatio, 0, Number.MAX_VALUE)
  return mixingRatio / (EPSILON_WATER_DRY_AIR + mixingRatio)
}

/**
 * Mass mixing ratio from volume mixing ratio (moist air).
 *
 * Method: r = ε x/(1 − x).
 * Source: definitions; ε = M_w/M_d.
 *
 * @param vmr mol/mol of moist air, [0, 1)
 * @returns mixing ratio, kg kg⁻¹
 */
export function mixingRatioFromVmr(vmr: number): number {
  assertRange('vmr', vmr, 0, 1 - Number.EPSILON)
  return (EPSILON_WATER_DRY_AIR * vmr) / (1 - vmr)
}

/**
 * Volume mixing ratio (moist air) from specific humidity.
 *
 * Method: x = q/(ε + (1 − ε) q).
 * Source: definitions; ε = M_w/M_d.
 *
 * @param specificHumidity kg kg⁻¹ in [0, 1)
 * @returns volume mixing ratio, mol/mol of moist air
 */
export function vmrFromSpecificHumidity(specificHumidity: number): number {
  assertRange('specificHumidity', specificHumidity, 0, 1 - Number.EPSILON)
  return specificHumidity / (EPSILON_WATER_DRY_AIR + (1 - EPSILON_WATER_DRY_AIR) * specificHumidity)
}

/**
 * Specific humidity from volume mixing ratio (moist air).
 *
 * Method: q = ε x/(1 − (1 − ε) x).
 * Source: definitions; ε = M_w/M_d.
 *
 * @param vmr mol/mol of moist air, [0, 1)
 * @returns specific humidity, kg kg⁻¹
 */
export function specificHumidityFromVmr(vmr: number): number {
  assertRange('vmr', vmr, 0, 1 - Number.EPSILON)
  return (EPSILON_WATER_DRY_AIR * vmr) / (1 - (1 - EPSILON_WATER_DRY_AIR) * vmr)
}

/**
 * Water-vapour volume mixing ratio from relative humidity, temperature and pressure.
 *
 * Method: x = RH · e_s(T)/p.
 * Notes: throws if the resulting vapour pressure reaches the total pressure.
 * Source: definition of RH (WMO-No. 8) and Dalton's law; e_s from Murphy & Koop 2005.
 *
 * @param relativeHumidity fraction
 * @param temperatureK temperature, K
 * @param pressurePa total pressure, Pa
 * @param phase reference phase, default 'water'
 * @returns volume mixing ratio, mol/mol of moist air
 */
export function vmrFromRelativeHumidity(
  relativeHumidity: number,
  temperatureK: number,
  pressurePa: number,
  phase: SaturationPhase = 'water',
): number {
  const e = vapourPressureFromRelativeHumidityPa(relativeHumidity, temperatureK, phase)
  return vmrFromVapourPressure(e, pressurePa)
}

/**
 * Relative humidity from water-vapour volume mixing ratio, temperature and pressure.
 *
 * Method: RH = x p / e_s(T).
 * Source: definition of RH (WMO-No. 8) and Dalton's law; e_s from Murphy & Koop 2005.
 *
 * @param vmr mol/mol of moist air
 * @param temperatureK temperature, K
 * @param pressurePa total pressure, Pa
 * @param phase reference phase, default 'water'
 * @returns relative humidity, fraction
 */
export function relativeHumidityFromVmr(
  vmr: number,
  temperatureK: number,
  pressurePa: number,
  phase: SaturationPhase = 'water',
): number {
  return relativeHumidityFromVapourPressure(
    vapourPressureFromVmrPa(vmr, pressurePa),
    temperatureK,
    phase,
  )
}
