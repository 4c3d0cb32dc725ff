/**
 * U.S. Standard Atmosphere 1976 (NOAA/NASA/USAF, U.S. Government Printing Office, Washington DC,
 * 1976), lower part 0–86 km, computed from its defining constants and layer formulas rather than
 * from its printed tables.
 *
 * Below 86 km the standard prescribes the molecular-scale temperature T_M as piecewise linear in
 * geopotential height H (seven layers). Hydrostatic equilibrium with constant M₀ then gives
 *   p = p_b (T_b/T_M)^{g₀M₀/(R*L_b)}            for L_b ≠ 0   (standard, eq. 33a)
 *   p = p_b exp(−g₀M₀(H − H_b)/(R* T_b))         for L_b = 0   (standard, eq. 33b)
 * and density ρ = p M₀/(R* T_M) (eq. 42). Kinetic temperature T = T_M · (M/M₀), where M/M₀ = 1
 * below 80 km and follows the standard's Table 8 between 80 and 86 km.
 */
import { PhysicsError } from '../errors'

/** Standard sea-level gravity g₀, m s⁻² (U.S. Standard Atmosphere 1976, Table 2). */
export const US76_G0_M_PER_S2 = 9.80665
/** Gas constant R* of the 1976 standard, J K⁻¹ mol⁻¹ (Table 2; deliberately not CODATA). */
export const US76_GAS_CONSTANT_J_PER_MOL_K = 8.31432
/** Sea-level mean molar mass M₀, kg mol⁻¹ (28.9644 kg kmol⁻¹, Table 2). */
export const US76_MOLAR_MASS_KG_PER_MOL = 0.0289644
/** Effective Earth radius r₀ for geopotential height, m (Table 2). */
export const US76_EARTH_RADIUS_M = 6356766
/** Sea-level pressure, Pa (Table 2). */
export const US76_SEA_LEVEL_PRESSURE_PA = 101325
/** Sea-level temperature, K (Table 2). */
export const US76_SEA_LEVEL_TEMPERATURE_K = 288.15

/** g₀M₀/R*, K m⁻¹ (the hydrostatic constant of the standard). */
const GMR_K_PER_M = (US76_G0_M_PER_S2 * US76_MOLAR_MASS_KG_PER_MOL) / US76_GAS_CONSTANT_J_PER_MOL_K

/** Layer bases in geopotential metres and molecular-scale lapse rates dT_M/dH, K m⁻¹ (Table 4). */
const LAYER_BASE_GEOPOTENTIAL_M: readonly number[] = [0, 11000, 20000, 32000, 47000, 51000, 71000]
const LAYER_LAPSE_RATE_K_PER_M: readonly number[] = [-0.0065, 0, 0.001, 0.0028, 0, -0.0028, -0.002]

/** Top of the lower atmosphere: 86 km geometric = 84 852.05 m′ geopotential. */
export const US76_TOP_GEOMETRIC_HEIGHT_M = 86000
/** Lowest height of the standard: −5 km geopotential (≈ −4 996 m geometric). */
export const US76_BOTTOM_GEOPOTENTIAL_HEIGHT_M = -5000

interface LayerBase {
  geopotentialHeightM: number
  lapseRateKPerM: number
  temperatureK: number
  pressurePa: number
}

/** Base temperature and pressure of each layer, derived once from the defining formulas. */
const LAYER_BASES: readonly LayerBase[] = (() => {
  const bases: LayerBase[] = []
  let temperatureK = US76_SEA_LEVEL_TEMPERATURE_K
  let pressurePa = US76_SEA_LEVEL_PRESSURE_PA
  for (let b = 0; b < LAYER_BASE_GEOPOTENTIAL_M.length; b++) {
    const base = {
      geopotentialHeightM: LAYER_BASE_GEOPOTENTIAL_M[b],
      lapseRateKPerM: LAYER_LAPSE_RATE_K_PER_M[b],
      temperatureK,
      pressurePa,
    }
    bases.push(base)
    if (b + 1 < LAYER_BASE_GEOPOTENTIAL_M.length) {
      const dh = LAYER_BASE_GEOPOTENTIAL_M[b + 1] - base.geopotentialHeightM
      const top = layerState(base, dh)
      temperatureK = top.temperatureK
      pressurePa = top.pressurePa
    }
  }
  return bases
})()

/** Molecular-scale temperature and pressure at dh geopotential metres above a layer base. */
function layerState(base: LayerBase, dh: number): { temperatureK: number; pressurePa: number } {
  const lapse = base.lapseRateKPerM
  if (lapse === 0) {
    return {
      temperatureK: base.temperatureK,
      pressurePa: base.pressurePa * Math.exp((-GMR_K_PER_M * dh) / base.temperatureK),
    }
  }
  const temperatureK = base.temperatureK + lapse * dh
  return {
    temperatureK,
    pressurePa: base.pressurePa * (base.temperatureK / temperatureK) ** (GMR_K_PER_M / lapse),
  }
}

/**
 * M/M₀ between 80 and 86 km geometric, every 0.5 km (U.S. Standard Atmosphere 1976, Table 8).
 * The values were recalled from memory and match the table as reproduced in public code.
 */
const MOLAR_MASS_RATIO_START_M = 80000
const MOLAR_MASS_RATIO_STEP_M = 500
const MOLAR_MASS_RATIO: readonly number[] = [
  1.0, 0.999996, 0.999989, 0.999971, 0.999941, 0.999909, 0.99987, 0.999829, 0.999786, 0.999741,
  0.999694, 0.999641, 0.999579,
]

/** Atmospheric state returned by the standard-atmosphere functions. */
export interface StandardAtmosphereState {
  /** Geometric height above mean sea level, m. */
  geometricHeightM: number
  /** Geopotential height, m′ (standard geopotential metres). */
  geopotentialHeightM: number
  /** Kinetic temperature, K. */
  temperatureK: number
  /** Molecular-scale temperature T_M = T M₀/M, K (equals T below 80 km). */
  molecularScaleTemperatureK: number
  /** Pressure, Pa. */
  pressurePa: number
  /** Mass density, kg m⁻³. */
  densityKgPerM3: number
}

/**
 * Geopotential height from geometric height.
 *
 * Method: H = r₀ z/(r₀ + z), r₀ = 6 356 766 m.
 * Notes: exact within the standard's model (gravity ∝ 1/r², g₀ at sea level).
 * Source: U.S. Standard Atmosphere 1976, eq. 18.
 *
 * @param geometricHeightM geometric height z, m (> −r₀)
 * @returns geopotential height, m′
 */
export function geometricToGeopotentialHeightM(geometricHeightM: number): number {
  if (!Number.isFinite(geometricHeightM) || geometricHeightM <= -US76_EARTH_RADIUS_M) {
    throw new PhysicsError('OUT_OF_RANGE', `geometricHeightM = ${geometricHeightM} is invalid`, {
      name: 'geometricHeightM',
      value: geometricHeightM,
    })
  }
  return (US76_EARTH_RADIUS_M * geometricHeightM) / (US76_EARTH_RADIUS_M + geometricHeightM)
}

/**
 * Geometric height from geopotential height.
 *
 * Method: z = r₀ H/(r₀ − H), the inverse of H = r₀ z/(r₀ + z).
 * Source: U.S. Standard Atmosphere 1976, eq. 19.
 *
 * @param geopotentialHeightM geopotential height H, m′ (< r₀)
 * @returns geometric height, m
 */
export function geopotentialToGeometricHeightM(geopotentialHeightM: number): number {
  if (!Number.isFinite(geopotentialHeightM) || geopotentialHeightM >= US76_EARTH_RADIUS_M) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `geopotentialHeightM = ${geopotentialHeightM} is invalid`,
      { name: 'geopotentialHeightM', value: geopotentialHeightM },
    )
  }
  return (US76_EARTH_RADIUS_M * geopotentialHeightM) / (US76_EARTH_RADIUS_M - geopotentialHeightM)
}

function layerIndexForGeopotential(geopotentialHeightM: number): number {
  let b = 0
  while (
    b + 1 < LAYER_BASES.length &&
    geopotentialHeightM >= LAYER_BASES[b + 1].geopotentialHeightM
  )
    b++
  return b
}

/** M/M₀ by linear interpolation in the standard's Table 8 (1 below 80 km). */
function molarMassRatio(geometricHeightM: number): number {
  if (geometricHeightM <= MOLAR_MASS_RATIO_START_M) return 1
  const s = (geometricHeightM - MOLAR_MASS_RATIO_START_M) / MOLAR_MASS_RATIO_STEP_M
  const i = Math.min(Math.floor(s), MOLAR_MASS_RATIO.length - 2)
  const f = s - i
  return MOLAR_MASS_RATIO[i] + f * (MOLAR_MASS_RATIO[i + 1] - MOLAR_MASS_RATIO[i])
}

function stateAtGeopotential(geopotentialHeightM: number): StandardAtmosphereState {
  const base = LAYER_BASES[layerIndexForGeopotential(geopotentialHeightM)]
  const { temperatureK: molecularScaleTemperatureK, pressurePa } = layerState(
    base,
    geopotentialHeightM - base.geopotentialHeightM,
  )
  const geometricHeightM = geopotentialToGeometricHeightM(geopotentialHeightM)
  return {
    geometricHeightM,
    geopotentialHeightM,
    temperatureK: molecularScaleTemperatureK * molarMassRatio(geometricHeightM),
    molecularScaleTemperatureK,
    pressurePa,
    densityKgPerM3:
      (pressurePa * US76_MOLAR_MASS_KG_PER_MOL) /
      (US76_GAS_CONSTANT_J_PER_MOL_K * molecularScaleTemperatureK),
  }
}

/**
 * U.S. Standard Atmosphere 1976 at a geometric height, 0–86 km (down to −5 km′).
 *
 * Method: H = r₀z/(r₀ + z); T_M piecewise linear in H over the seven layers (bases 0, 11, 20, 32,
 * 47, 51, 71 km′; lapse rates −6.5, 0, +1, +2.8, 0, −2.8, −2.0 K/km′); p from the hydrostatic
 * layer formulas with g₀ = 9.806 65, R* = 8.314 32, M₀ = 28.9644; ρ = pM₀/(R*T_M);
 * T = T_M·M/M₀ with M/M₀ from Table 8 (linear interpolation between its 0.5 km entries).
 * Notes: reproduces the printed tables to their digits (T 0.001 K, p 5 significant digits).
 * Above 86 km the standard changes model (diffusive separation); heights there are rejected.
 * Source: U.S. Standard Atmosphere 1976, eqs. 18, 23, 33a–b, 42 and Tables 4 and 8.
 *
 * @param geometricHeightM geometric height above mean sea level, m, in [−4 996, 86 000]
 * @returns temperature K, pressure Pa, density kg m⁻³ (plus geopotential height and T_M)
 */
export function usStandardAtmosphere1976(geometricHeightM: number): StandardAtmosphereState {
  if (!Number.isFinite(geometricHeightM) || geometricHeightM > US76_TOP_GEOMETRIC_HEIGHT_M) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `geometricHeightM = ${geometricHeightM} is outside the 1976 standard's lower atmosphere (≤ 86 km)`,
      { name: 'geometricHeightM', value: geometricHeightM, max: US76_TOP_GEOMETRIC_HEIGHT_M },
    )
  }
  const geopotentialHeightM = geometricToGeopotentialHeightM(geometricHeightM)
  if (geopotentialHeightM < US76_BOTTOM_GEOPOTENTIAL_HEIGHT_M) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `geometricHeightM = ${geometricHeightM} is below −5 km′`,
      {
        name: 'geometricHeightM',
        value: geometricHeightM,
      },
    )
  }
  return { ...stateAtGeopotential(geopotentialHeightM), geometricHeightM }
}

/**
 * U.S. Standard Atmosphere 1976 at a geopotential height (the standard's own coordinate).
 *
 * Method and source: as `usStandardAtmosphere1976`, with H given directly.
 *
 * @param geopotentialHeightM geopotential height, m′, in [−5 000, 84 852.05]
 * @returns temperature K, pressure Pa, density kg m⁻³ (plus geometric height and T_M)
 */
export function usStandardAtmosphere1976AtGeopotential(
  geopotentialHeightM: number,
): StandardAtmosphereState {
  const top = geometricToGeopotentialHeightM(US76_TOP_GEOMETRIC_HEIGHT_M)
  if (
    !Number.isFinite(geopotentialHeightM) ||
    geopotentialHeightM < US76_BOTTOM_GEOPOTENTIAL_HEIGHT_M ||
    geopotentialHeightM > top
  ) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `geopotentialHeightM = ${geopotentialHeightM} is outside [−5000, ${top}] m′`,
      { name: 'geopotentialHeightM', value: geopotentialHeightM },
    )
  }
  return stateAtGeopotential(geopotentialHeightM)
}

/** Pressure at 86 km (top of the lower atmosphere) and at −5 km′, Pa. */
const TOP_PRESSURE_PA = stateAtGeopotential(
  geometricToGeopotentialHeightM(US76_TOP_GEOMETRIC_HEIGHT_M),
).pressurePa
const BOTTOM_PRESSURE_PA = stateAtGeopotential(US76_BOTTOM_GEOPOTENTIAL_HEIGHT_M).pressurePa

/**
 * Geometric height at which the 1976 standard has a given pressure (inverse of the layer formulas).
 *
 * Method: find the layer with p_b ≥ p > p_{b+1}; then H = H_b + (T_b/L_b)[(p/p_b)^{−R*L_b/(g₀M₀)} − 1]
 * for L_b ≠ 0, H = H_b − (R*T_b/(g₀M₀)) ln(p/p_b) for L_b = 0; z = r₀H/(r₀ − H).
 * Notes: exact inverse of the pressure formulas (round trip ≈1e-12 relative).
 * Source: U.S. Standard Atmosphere 1976, eqs. 19, 33a–b, solved for H.
 *
 * @param pressurePa pressure, Pa, between p(86 km) ≈ 0.3734 Pa and p(−5 km′) ≈ 177 687 Pa
 * @returns geometric height, m
 */
export function usStandardAtmosphere1976HeightAtPressureM(pressurePa: number): number {
  const topPressurePa = TOP_PRESSURE_PA
  const bottomPressurePa = BOTTOM_PRESSURE_PA
  if (!Number.isFinite(pressurePa) || pressurePa < topPressurePa || pressurePa > bottomPressurePa) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `pressurePa = ${pressurePa} is outside the 1976 standard's range [${topPressurePa}, ${bottomPressurePa}]`,
      { name: 'pressurePa', value: pressurePa, min: topPressurePa, max: bottomPressurePa },
    )
  }
  let b = 0
  while (b + 1 < LAYER_BASES.length && pressurePa <= LAYER_BASES[b + 1].pressurePa) b++
  const base = LAYER_BASES[b]
  const ratio = pressurePa / base.pressurePa
  const geopotentialHeightM =
    base.lapseRateKPerM === 0
      ? base.geopotentialHeightM - (base.temperatureK / GMR_K_PER_M) * Math.log(ratio)
      : base.geopotentialHeightM +
        (base.temperatureK / base.lapseRateKPerM) *
          (ratio ** (-base.lapseRateKPerM / GMR_K_PER_M) - 1)
  return geopotentialToGeometricHeightM(geopotentialHeightM)
}
