/**
 * Hydrostatic balance: gravity models, virtual temperature, heights from pressures by the
 * hypsometric equation, and pressures at given heights.
 *
 * Units: pressure Pa, temperature K, height m, geopotential J kg⁻¹ (= m² s⁻²), water vapour as
 * volume mixing ratio of moist air (mol/mol).
 */
import {
  DRY_AIR_MOLAR_MASS_KG_PER_MOL,
  GAS_CONSTANT_J_PER_MOL_K,
  STANDARD_GRAVITY_M_PER_S2,
} from '../constants'
import { PhysicsError } from '../errors'
import { EPSILON_WATER_DRY_AIR } from './humidity'

/** Specific gas constant of dry air R_d = R/M_d ≈ 287.057 J kg⁻¹ K⁻¹ (CODATA R, M_d 28.9644). */
export const DRY_AIR_GAS_CONSTANT_J_PER_KG_K =
  GAS_CONSTANT_J_PER_MOL_K / DRY_AIR_MOLAR_MASS_KG_PER_MOL

/**
 * Mean Earth radius R₁ = 6 371 008.8 m (IUGG; Moritz 1980, Geodetic Reference System 1980,
 * Bull. Géodésique 54, 395 — value from memory), used for the 1/r² decrease of gravity with height.
 */
export const MEAN_EARTH_RADIUS_M = 6371008.8

/**
 * How gravity is modelled.
 * - 'standard': constant g₀ = 9.806 65 m s⁻² at all heights; heights are then geopotential metres
 *   (the usual convention of meteorology and of the U.S. Standard Atmosphere).
 * - { latitudeDeg }: WGS 84 normal gravity at the surface for that latitude, decreasing with
 *   height as (R/(R + z))²; heights are geometric.
 */
export type GravityModel = 'standard' | { latitudeDeg: number }

function assertFinite(name: string, value: number): void {
  if (!Number.isFinite(value)) {
    throw new PhysicsError('INVALID_ARGUMENT', `${name} = ${value} must be finite`, { name, value })
  }
}

function surfaceGravity(model: GravityModel): number {
  return model === 'standard' ? STANDARD_GRAVITY_M_PER_S2 : normalGravityMPerS2(model.latitudeDeg)
}

/**
 * Normal (ellipsoidal) gravity at the surface of the WGS 84 ellipsoid.
 *
 * Method: Somigliana's closed form γ(φ) = γ_e (1 + k sin²φ)/√(1 − e² sin²φ), γ_e = 9.780 325 335 9
 * m s⁻², k = 0.001 931 852 652 41, e² = 0.006 694 379 990 13.
 * Notes: includes the centrifugal term; 9.7803 at the equator, 9.8322 at the poles.
 * Source: NIMA TR8350.2 (WGS 84), eq. (4-1) (constants from memory).
 *
 * @param latitudeDeg geodetic latitude, degrees, [−90, 90]
 * @returns normal gravity, m s⁻²
 */
export function normalGravityMPerS2(latitudeDeg: number): number {
  if (!Number.isFinite(latitudeDeg) || Math.abs(latitudeDeg) > 90) {
    throw new PhysicsError('OUT_OF_RANGE', `latitudeDeg = ${latitudeDeg} is outside [−90, 90]`, {
      name: 'latitudeDeg',
      value: latitudeDeg,
    })
  }
  const s2 = Math.sin((latitudeDeg * Math.PI) / 180) ** 2
  return (9.7803253359 * (1 + 0.00193185265241 * s2)) / Math.sqrt(1 - 0.00669437999013 * s2)
}

/**
 * Gravitational acceleration at a height for a gravity model.
 *
 * Method: 'standard' → g₀; { latitudeDeg } → γ(φ) (R/(R + z))², R = 6 371 008.8 m.
 * Notes: the inverse-square height term neglects the ellipsoid's flattening and the height
 * dependence of the centrifugal term (≲ 0.1 % of the height correction).
 * Source: Newton's law of gravitation; WGS 84 normal gravity (NIMA TR8350.2).
 *
 * @param model gravity model
 * @param heightM height above the ellipsoid, m
 * @returns gravity, m s⁻²
 */
export function gravityMPerS2(model: GravityModel, heightM: number): number {
  assertFinite('heightM', heightM)
  if (model === 'standard') return STANDARD_GRAVITY_M_PER_S2
  const ratio = MEAN_EARTH_RADIUS_M / (MEAN_EARTH_RADIUS_M + heightM)
  return normalGravityMPerS2(model.latitudeDeg) * ratio * ratio
}

/**
 * Geopotential Φ(z) = ∫₀ᶻ g dz′ for a gravity model.
 *
 * Method: 'standard' → g₀ z; otherwise γ(φ) R z/(R + z) (integral of the inverse-square law).
 * Source: definition of geopotential (e.g. Wallace & Hobbs 2006, ch. 3).
 *
 * @param model gravity model
 * @param heightM height, m (> −R)
 * @returns geopotential, J kg⁻¹
 */
export function geopotentialFromHeight(model: GravityModel, heightM: number): number {
  assertFinite('heightM', heightM)
  if (model === 'standard') return STANDARD_GRAVITY_M_PER_S2 * heightM
  return (surfaceGravity(model) * MEAN_EARTH_RADIUS_M * heightM) / (MEAN_EARTH_RADIUS_M + heightM)
}

/**
 * Height for a geopotential; inverse of `geopotentialFromHeight`.
 *
 * Method: 'standard' → Φ/g₀; otherwise z = RΦ/(γR − Φ).
 * Source: inverse of the definition above.
 *
 * @param model gravity model
 * @param geopotential J kg⁻¹ (< γR)
 * @returns height, m
 */
export function heightFromGeopotential(model: GravityModel, geopotential: number): number {
  assertFinite('geopotential', geopotential)
  if (model === 'standard') return geopotential / STANDARD_GRAVITY_M_PER_S2
  const gR = surfaceGravity(model) * MEAN_EARTH_RADIUS_M
  if (geopotential >= gR) {
    throw new PhysicsError('OUT_OF_RANGE', `geopotential = ${geopotential} exceeds escape value`, {
      geopotential,
    })
  }
  return (MEAN_EARTH_RADIUS_M * geopotential) / (gR - geopotential)
}

/**
 * Virtual temperature of moist air.
 *
 * Method: T_v = T / [1 − x(1 − ε)], with x the water-vapour volume mixing ratio (= e/p) and
 * ε = M_w/M_d; equivalent to T_v = T/[1 − (e/p)(1 − ε)].
 * Notes: exact for an ideal-gas mixture; ≈ T(1 + 0.608 q) for small q.
 * Source: Wallace & Hobbs 2006, Atmospheric Science, 2nd ed., ch. 3 (virtual temperature).
 *
 * @param temperatureK temperature, K
 * @param waterVmr water-vapour volume mixing ratio, mol/mol, [0, 1)
 * @returns virtual temperature, K
 */
export function virtualTemperatureK(temperatureK: number, waterVmr: number): number {
  if (!Number.isFinite(temperatureK) || temperatureK <= 0) {
    throw new PhysicsError('OUT_OF_RANGE', `temperatureK = ${temperatureK} must be > 0`, {
      name: 'temperatureK',
      value: temperatureK,
    })
  }
  if (!Number.isFinite(waterVmr) || waterVmr < 0 || waterVmr >= 1) {
    throw new PhysicsError('OUT_OF_RANGE', `waterVmr = ${waterVmr} must be in [0, 1)`, {
      name: 'waterVmr',
      value: waterVmr,
    })
  }
  return temperatureK / (1 - waterVmr * (1 - EPSILON_WATER_DRY_AIR))
}

/** Options shared by the hydrostatic integrations. */
export interface HydrostaticOptions {
  /** Gravity model, default 'standard'. */
  gravity?: GravityModel
}

function checkColumn(name: string, values: ArrayLike<number>, length: number): void {
  if (values.length !== length) {
    throw new PhysicsError(
      'INVALID_ARGUMENT',
      `${name} has length ${values.length}, expected ${length}`,
      {
        name,
      },
    )
  }
}

function virtualTemperatureAt(
  temperatureK: ArrayLike<number>,
  waterVmr: ArrayLike<number> | undefined,
  i: number,
): number {
  return virtualTemperatureK(temperatureK[i], waterVmr ? waterVmr[i] : 0)
}

/**
 * Heights of pressure levels from the hypsometric equation with virtual temperature.
 *
 * Method: Φᵢ = Φᵢ₋₁ + R_d T̄_v ln(pᵢ₋₁/pᵢ), T̄_v = (T_v,ᵢ₋₁ + T_v,ᵢ)/2, which is exact when T_v
 * is linear in ln p between levels; heights from Φ by the gravity model (Φ₀ from the surface
 * height). R_d = R/M_d with CODATA R.
 * Notes: error O(Δ(ln p)² · curvature of T_v(ln p)); with ~1 km level spacing it is a few metres
 * at 50 km. Levels must be ordered with strictly decreasing pressure.
 * Source: hypsometric equation, Wallace & Hobbs 2006, eq. (3.29) (number from memory);
 * Holton 2004, An Introduction to Dynamic Meteorology, ch. 1.
 *
 * @param pressurePa level pressures, Pa, strictly decreasing
 * @param temperatureK level temperatures, K
 * @param waterVmr water-vapour vmr per level (mol/mol), or undefined for dry air
 * @param surfaceHeightM height of the first level, m (default 0)
 * @param options gravity model (default 'standard', heights then geopotential metres)
 * @param out optional output array of the same length
 * @returns heights, m
 */
export function hypsometricHeightsM(
  pressurePa: ArrayLike<number>,
  temperatureK: ArrayLike<number>,
  waterVmr: ArrayLike<number> | undefined,
  surfaceHeightM = 0,
  options: HydrostaticOptions = {},
  out: Float64Array = new Float64Array(pressurePa.length),
): Float64Array {
  const n = pressurePa.length
  checkColumn('temperatureK', temperatureK, n)
  if (waterVmr) checkColumn('waterVmr', waterVmr, n)
  checkColumn('out', out, n)
  if (n === 0) return out
  const gravity = options.gravity ?? 'standard'
  let geopotential = geopotentialFromHeight(gravity, surfaceHeightM)
  let tvPrevious = virtualTemperatureAt(temperatureK, waterVmr, 0)
  if (!(pressurePa[0] > 0) || !Number.isFinite(pressurePa[0])) {
    throw new PhysicsError('OUT_OF_RANGE', `pressurePa[0] = ${pressurePa[0]} must be > 0`, {})
  }
  out[0] = surfaceHeightM
  for (let i = 1; i < n; i++) {
    if (!(pressurePa[i] > 0 && pressurePa[i] < pressurePa[i - 1])) {
      throw new PhysicsError('NOT_MONOTONIC', `pressurePa must decrease strictly (index ${i})`, {
        index: i,
        value: pressurePa[i],
      })
    }
    const tv = virtualTemperatureAt(temperatureK, waterVmr, i)
    geopotential +=
      DRY_AIR_GAS_CONSTANT_J_PER_KG_K *
      0.5 *
      (tvPrevious + tv) *
      Math.log(pressurePa[i - 1] / pressurePa[i])
    out[i] = heightFromGeopotential(gravity, geopotential)
    tvPrevious = tv
  }
  return out
}

/**
 * Pressures at given heights by integrating hydrostatic balance upward from the surface pressure.
 *
 * Method: ln(pᵢ₋₁/pᵢ) = ΔΦ / (R_d T̃_v), ΔΦ from the gravity model, with the logarithmic mean
 * T̃_v = (T_v,ᵢ − T_v,ᵢ₋₁)/ln(T_v,ᵢ/T_v,ᵢ₋₁), which is exact when T_v is linear in Φ between levels
 * (∫ dΦ/T_v for a linear T_v).
 * Notes: the interpolation assumption differs from `hypsometricHeightsM` (linear in ln p), so a
 * round trip is exact only for isothermal layers; otherwise the difference is second order in the
 * layer thickness. Heights must increase strictly.
 * Source: hydrostatic equation dp/p = −dΦ/(R_d T_v) (Holton 2004, ch. 1; Wallace & Hobbs 2006, ch. 3).
 *
 * @param heightM level heights, m, strictly increasing
 * @param temperatureK level temperatures, K
 * @param waterVmr water-vapour vmr per level (mol/mol), or undefined for dry air
 * @param surfacePressurePa pressure at the first level, Pa
 * @param options gravity model (default 'standard')
 * @param out optional output array of the same length
 * @returns pressures, Pa
 */
export function hydrostaticPressuresPa(
  heightM: ArrayLike<number>,
  temperatureK: ArrayLike<number>,
  waterVmr: ArrayLike<number> | undefined,
  surfacePressurePa: number,
  options: HydrostaticOptions = {},
  out: Float64Array = new Float64Array(heightM.length),
): Float64Array {
  const n = heightM.length
  checkColumn('temperatureK', temperatureK, n)
  if (waterVmr) checkColumn('waterVmr', waterVmr, n)
  checkColumn('out', out, n)
  if (!Number.isFinite(surfacePressurePa) || surfacePressurePa <= 0) {
    throw new PhysicsError('OUT_OF_RANGE', `surfacePressurePa = ${surfacePressurePa} must be > 0`, {
      name: 'surfacePressurePa',
      value: surfacePressurePa,
    })
  }
  if (n === 0) return out
  const gravity = options.gravity ?? 'standard'
  out[0] = surfacePressurePa
  let geopotentialPrevious = geopotentialFromHeight(gravity, heightM[0])
  let tvPrevious = virtualTemperatureAt(temperatureK, waterVmr, 0)
  let logPressure = Math.log(surfacePressurePa)
  for (let i = 1; i < n; i++) {
    if (!(heightM[i] > heightM[i - 1])) {
      throw new PhysicsError('NOT_MONOTONIC', `heightM must increase strictly (index ${i})`, {
        index: i,
        value: heightM[i],
      })
    }
    const geopotential = geopotentialFromHeight(gravity, heightM[i])
    const tv = virtualTemperatureAt(temperatureK, waterVmr, i)
    const ratio = tv / tvPrevious
    // Logarithmic mean; when the two temperatures agree to 1e-6 it equals the arithmetic mean
    // to ~1e-13 and the quotient would lose digits, so use the arithmetic mean there.
    const meanTv =
      Math.abs(ratio - 1) < 1e-6 ? 0.5 * (tv + tvPrevious) : (tv - tvPrevious) / Math.log(ratio)
    logPressure -=
      (geopotential - geopotentialPrevious) / (DRY_AIR_GAS_CONSTANT_J_PER_KG_K * meanTv)
    out[i] = Math.exp(logPressure)
    geopotentialPrevious = geopotential
    tvPrevious = tv
  }
  return out
}
