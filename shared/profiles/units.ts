/**
 * Units of the level table and of uploaded soundings: definitions the UI can show (labels,
 * symbols) and the conversions to and from the SI values stored in `AtmosphereLevel`.
 *
 * Stored (SI) units: pressure Pa, temperature and dew point K, height m, relative humidity as a
 * fraction, mass mixing ratio and specific humidity kg kg⁻¹, volume mixing ratios mol/mol of
 * moist air. Humidity columns are turned into a water-vapour volume mixing ratio with
 * `waterVmrFromHumidity`, which needs the level's temperature and pressure.
 */
import {
  dewPointBoltonK,
  dewPointK,
  mixingRatioFromVapourPressure,
  mixingRatioFromVmr,
  relativeHumidityFromVmr,
  saturationVapourPressureBoltonPa,
  specificHumidityFromVmr,
  vapourPressureFromDewPointPa,
  vapourPressureFromMixingRatioPa,
  vmrFromMixingRatio,
  vmrFromRelativeHumidity,
  vmrFromSpecificHumidity,
  vmrFromVapourPressure,
  type SaturationPhase,
} from '../physics/atmosphere/humidity'
import { PhysicsError } from '../physics/errors'

export type PressureUnit = 'hPa' | 'Pa' | 'kPa'
export type TemperatureUnit = 'degC' | 'K'
export type HeightUnit = 'm' | 'km'
export type RelativeHumidityUnit = 'percent' | 'fraction'
export type MassMixingRatioUnit = 'gPerKg' | 'kgPerKg'
export type WaterVmrUnit = 'ppmv' | 'molPerMol'
export type OzoneUnit = 'ppmv' | 'ppbv' | 'molPerMol'

/** The unit identifiers allowed for each quantity of the level table. */
export interface LevelUnitIds {
  pressure: PressureUnit
  temperature: TemperatureUnit
  height: HeightUnit
  relativeHumidity: RelativeHumidityUnit
  dewPoint: TemperatureUnit
  mixingRatio: MassMixingRatioUnit
  specificHumidity: MassMixingRatioUnit
  waterVmr: WaterVmrUnit
  ozone: OzoneUnit
}

/** A quantity of the level table (also the field names of a sounding column mapping). */
export type LevelQuantity = keyof LevelUnitIds

/** A chosen unit per quantity. */
export type LevelUnits = { [Q in LevelQuantity]?: LevelUnitIds[Q] }

/** The ways humidity can be given; each is converted to a water-vapour volume mixing ratio. */
export const HUMIDITY_QUANTITIES = [
  'waterVmr',
  'mixingRatio',
  'specificHumidity',
  'dewPoint',
  'relativeHumidity',
] as const satisfies readonly LevelQuantity[]
export type HumidityQuantity = (typeof HUMIDITY_QUANTITIES)[number]

/** One unit of a quantity: SI value = value × toSiScale + toSiOffset. */
export interface UnitDefinition<U extends string = string> {
  id: U
  /** Short symbol for column headers, e.g. 'hPa', '°C', 'g/kg'. */
  symbol: string
  /** Long name for menus and tooltips. */
  label: string
  toSiScale: number
  toSiOffset: number
}

/** A quantity of the level table with its SI unit and the units offered to analysts. */
export interface QuantityDefinition<U extends string = string> {
  /** Name for column headers, e.g. 'Pressure'. */
  label: string
  /** Symbol of the stored (SI) value. */
  siSymbol: string
  /** Unit shown by default in the level table. */
  defaultUnit: U
  units: readonly UnitDefinition<U>[]
}

const CELSIUS_OFFSET_K = 273.15

/**
 * Units of every level-table quantity, for the UI (labels and symbols) and for conversion.
 *
 * Sources: SI Brochure, 9th ed. (BIPM 2019) — hecto = 10², kilo = 10³, T/K = t/°C + 273.15
 * (exact); ppmv = 10⁻⁶ mol/mol and ppbv = 10⁻⁹ mol/mol (common practice for mole fractions).
 */
export const LEVEL_UNITS: { readonly [Q in LevelQuantity]: QuantityDefinition<LevelUnitIds[Q]> } = {
  pressure: {
    label: 'Pressure',
    siSymbol: 'Pa',
    defaultUnit: 'hPa',
    units: [
      {
        id: 'hPa',
        symbol: 'hPa',
        label: 'hectopascal (= millibar)',
        toSiScale: 100,
        toSiOffset: 0,
      },
      { id: 'Pa', symbol: 'Pa', label: 'pascal', toSiScale: 1, toSiOffset: 0 },
      { id: 'kPa', symbol: 'kPa', label: 'kilopascal', toSiScale: 1000, toSiOffset: 0 },
    ],
  },
  temperature: {
    label: 'Temperature',
    siSymbol: 'K',
    defaultUnit: 'K',
    units: [
      { id: 'K', symbol: 'K', label: 'kelvin', toSiScale: 1, toSiOffset: 0 },
      {
        id: 'degC',
        symbol: '°C',
        label: 'degree Celsius',
        toSiScale: 1,
        toSiOffset: CELSIUS_OFFSET_K,
      },
    ],
  },
  height: {
    label: 'Height',
    siSymbol: 'm',
    defaultUnit: 'm',
    units: [
      { id: 'm', symbol: 'm', label: 'metre', toSiScale: 1, toSiOffset: 0 },
      { id: 'km', symbol: 'km', label: 'kilometre', toSiScale: 1000, toSiOffset: 0 },
    ],
  },
  relativeHumidity: {
    label: 'Relative humidity',
    siSymbol: '1',
    defaultUnit: 'percent',
    units: [
      { id: 'percent', symbol: '%', label: 'percent', toSiScale: 0.01, toSiOffset: 0 },
      { id: 'fraction', symbol: '0–1', label: 'fraction', toSiScale: 1, toSiOffset: 0 },
    ],
  },
  dewPoint: {
    label: 'Dew point',
    siSymbol: 'K',
    defaultUnit: 'degC',
    units: [
      {
        id: 'degC',
        symbol: '°C',
        label: 'degree Celsius',
        toSiScale: 1,
        toSiOffset: CELSIUS_OFFSET_K,
      },
      { id: 'K', symbol: 'K', label: 'kelvin', toSiScale: 1, toSiOffset: 0 },
    ],
  },
  mixingRatio: {
    label: 'Mixing ratio',
    siSymbol: 'kg/kg',
    defaultUnit: 'gPerKg',
    units: [
      {
        id: 'gPerKg',
        symbol: 'g/kg',
        label: 'gram of vapour per kilogram of dry air',
        toSiScale: 1e-3,
        toSiOffset: 0,
      },
      {
        id: 'kgPerKg',
        symbol: 'kg/kg',
        label: 'kilogram of vapour per kilogram of dry air',
        toSiScale: 1,
        toSiOffset: 0,
      },
    ],
  },
  specificHumidity: {
    label: 'Specific humidity',
    siSymbol: 'kg/kg',
    defaultUnit: 'gPerKg',
    units: [
      {
        id: 'gPerKg',
        symbol: 'g/kg',
        label: 'gram of vapour per kilogram of moist air',
        toSiScale: 1e-3,
        toSiOffset: 0,
      },
      {
        id: 'kgPerKg',
        symbol: 'kg/kg',
        label: 'kilogram of vapour per kilogram of moist air',
        toSiScale: 1,
        toSiOffset: 0,
      },
    ],
  },
  waterVmr: {
    label: 'Water vapour (volume mixing ratio)',
    siSymbol: 'mol/mol',
    defaultUnit: 'ppmv',
    units: [
      {
        id: 'ppmv',
        symbol: 'ppmv',
        label: 'parts per million by volume',
        toSiScale: 1e-6,
        toSiOffset: 0,
      },
      {
        id: 'molPerMol',
        symbol: 'mol/mol',
        label: 'mole fraction',
        toSiScale: 1,
        toSiOffset: 0,
      },
    ],
  },
  ozone: {
    label: 'Ozone',
    siSymbol: 'mol/mol',
    defaultUnit: 'ppmv',
    units: [
      {
        id: 'ppmv',
        symbol: 'ppmv',
        label: 'parts per million by volume',
        toSiScale: 1e-6,
        toSiOffset: 0,
      },
      {
        id: 'ppbv',
        symbol: 'ppbv',
        label: 'parts per billion by volume',
        toSiScale: 1e-9,
        toSiOffset: 0,
      },
      {
        id: 'molPerMol',
        symbol: 'mol/mol',
        label: 'mole fraction',
        toSiScale: 1,
        toSiOffset: 0,
      },
    ],
  },
}

/** Looks up a unit definition; throws PhysicsError INVALID_ARGUMENT for an unknown unit. */
export function unitDefinition<Q extends LevelQuantity>(
  quantity: Q,
  unit: LevelUnitIds[Q],
): UnitDefinition<LevelUnitIds[Q]> {
  const definition = LEVEL_UNITS[quantity]
  if (!definition) {
    throw new PhysicsError('INVALID_ARGUMENT', `unknown quantity '${String(quantity)}'`, {
      quantity,
    })
  }
  const found = (definition.units as readonly UnitDefinition<LevelUnitIds[Q]>[]).find(
    (u) => u.id === unit,
  )
  if (!found) {
    throw new PhysicsError(
      'INVALID_ARGUMENT',
      `unknown unit '${String(unit)}' for ${quantity}; expected one of ${definition.units
        .map((u) => u.id)
        .join(', ')}`,
      { quantity, unit },
    )
  }
  return found
}

/** Symbol of a unit for messages and headers, e.g. unitSymbol('pressure', 'hPa') → 'hPa'. */
export function unitSymbol<Q extends LevelQuantity>(quantity: Q, unit: LevelUnitIds[Q]): string {
  return unitDefinition(quantity, unit).symbol
}

/**
 * Converts a value in a display unit to the stored SI unit.
 *
 * Method: x_SI = x · scale + offset, with the scale and offset of `LEVEL_UNITS` (e.g. hPa → Pa
 * ×100; °C → K +273.15; g/kg → kg/kg ×10⁻³; ppbv → mol/mol ×10⁻⁹).
 * Notes: exact up to binary rounding; no range check (physical checks live in level-checks).
 * Source: SI Brochure, 9th ed. (BIPM 2019), prefixes and the Celsius temperature definition.
 *
 * @param quantity quantity of the level table
 * @param value value in `unit`
 * @param unit unit identifier
 * @returns value in the SI unit of the quantity (Pa, K, m, fraction, kg/kg, mol/mol)
 */
export function toSi<Q extends LevelQuantity>(
  quantity: Q,
  value: number,
  unit: LevelUnitIds[Q],
): number {
  if (!Number.isFinite(value)) {
    throw new PhysicsError('INVALID_ARGUMENT', `${quantity} value ${value} must be finite`, {
      quantity,
      value,
    })
  }
  const { toSiScale, toSiOffset } = unitDefinition(quantity, unit)
  return value * toSiScale + toSiOffset
}

/**
 * Converts a stored SI value to a display unit; the inverse of `toSi`.
 *
 * Method: x = (x_SI − offset)/scale.
 * Source: SI Brochure, 9th ed. (BIPM 2019).
 *
 * @param quantity quantity of the level table
 * @param valueSi value in the SI unit of the quantity
 * @param unit unit identifier
 * @returns value in `unit`
 */
export function fromSi<Q extends LevelQuantity>(
  quantity: Q,
  valueSi: number,
  unit: LevelUnitIds[Q],
): number {
  if (!Number.isFinite(valueSi)) {
    throw new PhysicsError('INVALID_ARGUMENT', `${quantity} value ${valueSi} must be finite`, {
      quantity,
      valueSi,
    })
  }
  const { toSiScale, toSiOffset } = unitDefinition(quantity, unit)
  return (valueSi - toSiOffset) / toSiScale
}

/**
 * Saturation formula used for dew points: 'murphy-koop' (Murphy & Koop 2005 eq. 10, the
 * library default) or 'bolton' (Bolton 1980 Magnus-type fit, used by many published worked
 * examples; within 0.1 % of Murphy–Koop over −30…35 °C).
 */
export type DewPointFormula = 'murphy-koop' | 'bolton'

/** Options of the humidity conversions. */
export interface HumidityConversionOptions {
  /** Reference phase of relative humidity, default 'water' (the WMO convention). */
  phase?: SaturationPhase
  /** Saturation formula for dew points, default 'murphy-koop'. */
  dewPointFormula?: DewPointFormula
}

function vapourPressureAtDewPointPa(dewPointTemperatureK: number, formula: DewPointFormula) {
  return formula === 'bolton'
    ? saturationVapourPressureBoltonPa(dewPointTemperatureK)
    : vapourPressureFromDewPointPa(dewPointTemperatureK)
}

/**
 * Water-vapour mixing ratio from dew point and pressure.
 *
 * Method: e = e_s(T_d) over liquid water, r = ε e/(p − e), ε = M_w/M_d ≈ 0.62198.
 * Notes: with formula 'bolton', e_s = 611.2 exp[17.67 t/(t + 243.5)] Pa (t in °C), valid
 * −80…60 °C here; with 'murphy-koop' (default) Murphy & Koop 2005 eq. (10), 123–332 K.
 * Source: Wallace & Hobbs 2006, Atmospheric Science, 2nd ed., ch. 3 (r from e); Bolton 1980,
 * Mon. Wea. Rev. 108, 1046, eq. (10) (number from memory); Murphy & Koop 2005, QJRMS 131, 1539.
 *
 * @param dewPointTemperatureK dew point, K
 * @param pressurePa total pressure, Pa
 * @param formula saturation formula, default 'murphy-koop'
 * @returns mixing ratio, kg kg⁻¹
 */
export function mixingRatioFromDewPoint(
  dewPointTemperatureK: number,
  pressurePa: number,
  formula: DewPointFormula = 'murphy-koop',
): number {
  return mixingRatioFromVapourPressure(
    vapourPressureAtDewPointPa(dewPointTemperatureK, formula),
    pressurePa,
  )
}

/**
 * Dew point from mixing ratio and pressure; the inverse of `mixingRatioFromDewPoint`.
 *
 * Method: e = r p/(ε + r), then T_d solves e_s(T_d) = e (Bolton: analytic inverse
 * t_d = 243.5 ln(e/611.2)/(17.67 − ln(e/611.2)); Murphy–Koop: Newton iteration).
 * Notes: r must be > 0 (a dry level has no finite dew point).
 * Source: Wallace & Hobbs 2006, ch. 3; Bolton 1980, eqs. (10)–(11) (numbers from memory);
 * Murphy & Koop 2005, eq. (10).
 *
 * @param mixingRatio kg kg⁻¹ (> 0)
 * @param pressurePa total pressure, Pa
 * @param formula saturation formula, default 'murphy-koop'
 * @returns dew point, K
 */
export function dewPointFromMixingRatioK(
  mixingRatio: number,
  pressurePa: number,
  formula: DewPointFormula = 'murphy-koop',
): number {
  if (!(mixingRatio > 0)) {
    throw new PhysicsError('OUT_OF_RANGE', `mixingRatio = ${mixingRatio} must be > 0`, {
      mixingRatio,
    })
  }
  const e = vapourPressureFromMixingRatioPa(mixingRatio, pressurePa)
  return formula === 'bolton' ? dewPointBoltonK(e) : dewPointK(e)
}

/**
 * Water-vapour volume mixing ratio from any humidity quantity (SI value).
 *
 * Method: relative humidity x = RH e_s(T)/p (phase per options); dew point x = e_s(T_d)/p;
 * mixing ratio x = r/(ε + r); specific humidity x = q/(ε + (1 − ε)q); vmr unchanged.
 * Notes: throws PhysicsError when the value is outside the domain of the formula (negative
 * amounts, RH > 1.5, temperatures outside the saturation formula's range, or a vapour pressure
 * reaching the total pressure).
 * Source: WMO-No. 8 (definition of RH); Dalton's law; Wallace & Hobbs 2006, ch. 3; e_s from
 * Murphy & Koop 2005 eqs. (7), (10) or Bolton 1980.
 *
 * @param quantity which humidity quantity `valueSi` is
 * @param valueSi humidity in SI (fraction, K, kg/kg or mol/mol)
 * @param temperatureK air temperature, K (used for relative humidity)
 * @param pressurePa pressure, Pa
 * @param options reference phase and dew-point formula
 * @returns water-vapour volume mixing ratio, mol/mol of moist air
 */
export function waterVmrFromHumidity(
  quantity: HumidityQuantity,
  valueSi: number,
  temperatureK: number,
  pressurePa: number,
  options: HumidityConversionOptions = {},
): number {
  switch (quantity) {
    case 'relativeHumidity':
      return vmrFromRelativeHumidity(valueSi, temperatureK, pressurePa, options.phase)
    case 'dewPoint':
      return vmrFromVapourPressure(
        vapourPressureAtDewPointPa(valueSi, options.dewPointFormula ?? 'murphy-koop'),
        pressurePa,
      )
    case 'mixingRatio':
      return checkedVmr(vmrFromMixingRatio(valueSi))
    case 'specificHumidity':
      return checkedVmr(vmrFromSpecificHumidity(valueSi))
    case 'waterVmr':
      return checkedVmr(valueSi)
  }
}

function checkedVmr(vmr: number): number {
  if (!Number.isFinite(vmr) || vmr < 0 || vmr >= 1) {
    throw new PhysicsError('OUT_OF_RANGE', `water vmr = ${vmr} must be in [0, 1)`, { vmr })
  }
  return vmr
}

/**
 * A humidity quantity (SI value) from the water-vapour volume mixing ratio; the inverse of
 * `waterVmrFromHumidity`, for showing stored levels in the analyst's chosen humidity column.
 *
 * Method: RH = x p/e_s(T); T_d from e = x p; r = ε x/(1 − x); q = ε x/(1 − (1 − ε)x).
 * Notes: the dew point of a dry level (x = 0) does not exist and throws PhysicsError.
 * Source: as `waterVmrFromHumidity`.
 *
 * @param quantity humidity quantity wanted
 * @param vmr water-vapour volume mixing ratio, mol/mol of moist air
 * @param temperatureK air temperature, K
 * @param pressurePa pressure, Pa
 * @param options reference phase and dew-point formula
 * @returns humidity in SI (fraction, K, kg/kg or mol/mol)
 */
export function humidityFromWaterVmr(
  quantity: HumidityQuantity,
  vmr: number,
  temperatureK: number,
  pressurePa: number,
  options: HumidityConversionOptions = {},
): number {
  switch (quantity) {
    case 'relativeHumidity':
      return relativeHumidityFromVmr(vmr, temperatureK, pressurePa, options.phase)
    case 'dewPoint': {
      checkedVmr(vmr)
      const e = vmr * pressurePa
      return options.dewPointFormula === 'bolton' ? dewPointBoltonK(e) : dewPointK(e)
    }
    case 'mixingRatio':
      return mixingRatioFromVmr(vmr)
    case 'specificHumidity':
      return specificHumidityFromVmr(vmr)
    case 'waterVmr':
      return checkedVmr(vmr)
  }
}
