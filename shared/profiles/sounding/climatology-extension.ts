/**
 * Extension of a sounding above its last level with a climatology, so that a balloon profile
 * that bursts at 20–30 km can still be used for radiative transfer to the top of the
 * atmosphere. The climatology is offset to match the sounding at the join and relaxes to the
 * climatology itself over two scale heights.
 */
import {
  getClimatologyPreset,
  climatologyTemperatureK,
  validateClimatologyParameters,
  type ClimatologyId,
  type ClimatologyParameters,
} from '../../physics/atmosphere/climatology'
import { saturationVapourPressurePa, type SaturationPhase } from '../../physics/atmosphere/humidity'
import { hypsometricHeightsM, type GravityModel } from '../../physics/atmosphere/hydrostatic'
import { greenOzoneVmr } from '../../physics/atmosphere/ozone'
import {
  manabeWetheraldRelativeHumidity,
  waterVapourVmrProfile,
} from '../../physics/atmosphere/water-vapour-profile'
import { PhysicsError } from '../../physics/errors'

/** The last (highest) level of the sounding, where the climatology is joined on. */
export interface ClimatologyJoin {
  pressurePa: number
  temperatureK: number
  heightM: number
  /** Water-vapour vmr at the join (mol/mol); undefined when the sounding has no humidity. */
  waterVmr?: number
  /** Ozone vmr at the join (mol/mol); undefined when the sounding has no ozone. */
  ozoneVmr?: number
  /** Height of the sounding's lowest level, m (the ground for the analytic ozone profile). */
  surfaceHeightM: number
}

/** Options of `extendWithClimatology`. */
export interface ClimatologyExtensionOptions {
  /** Top pressure of the extended profile, Pa, default 10 Pa (0.1 hPa); at least 1 Pa. */
  topPressurePa?: number
  /** Level spacing in ln p (scale heights), default 0.25 (≈ 1.7 km in the stratosphere). */
  levelSpacingLnP?: number
  /** Scale heights above the join over which the offsets die out, default 2. */
  relaxationScaleHeights?: number
  /** Gravity model of the heights, default 'standard' (geopotential metres). */
  gravity?: GravityModel
  /** Phase for the saturation cap of water vapour, default 'water'. */
  saturationPhase?: SaturationPhase
}

/** Levels added above the join (the join itself is not repeated), lowest first. */
export interface ClimatologyExtension {
  pressurePa: Float64Array
  temperatureK: Float64Array
  heightM: Float64Array
  waterVmr: Float64Array
  ozoneVmr: Float64Array
}

/** Default top of an extended profile, Pa. */
export const DEFAULT_EXTENSION_TOP_PA = 10

/**
 * Weight of the sounding's offset at a distance above the join, a raised-cosine taper.
 *
 * Method: w(s) = ½[1 + cos(π s/S)] for 0 ≤ s < S, w = 0 for s ≥ S, with s = ln(p_join/p) the
 * distance above the join in scale heights and S the relaxation depth.
 * Notes: w(0) = 1 (continuous at the join), w′(0) = 0, w and w′ vanish at s = S; so the
 * extended profile joins the sounding without a step and is the pure climatology from S up.
 * Source: our choice (a standard taper shape, e.g. the Tukey window's cosine lobe).
 *
 * @param scaleHeightsAboveJoin s = ln(p_join/p) ≥ 0
 * @param relaxationScaleHeights S > 0
 * @returns weight in [0, 1]
 */
export function relaxationWeight(
  scaleHeightsAboveJoin: number,
  relaxationScaleHeights: number,
): number {
  if (!(relaxationScaleHeights > 0) || !Number.isFinite(relaxationScaleHeights)) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `relaxationScaleHeights = ${relaxationScaleHeights} must be finite and > 0`,
      { relaxationScaleHeights },
    )
  }
  if (!Number.isFinite(scaleHeightsAboveJoin)) {
    throw new PhysicsError('INVALID_ARGUMENT', 'scaleHeightsAboveJoin must be finite', {
      scaleHeightsAboveJoin,
    })
  }
  if (scaleHeightsAboveJoin <= 0) return 1
  if (scaleHeightsAboveJoin >= relaxationScaleHeights) return 0
  return 0.5 * (1 + Math.cos((Math.PI * scaleHeightsAboveJoin) / relaxationScaleHeights))
}

/**
 * Temperature above a sounding's top: the climatology offset to match the sounding at the
 * join, the offset relaxing to zero over `relaxationScaleHeights`.
 *
 * Method: T(p) = T_c(p) + w(s) [T_join − T_c(p_join)], s = ln(p_join/p), w the raised-cosine
 * taper of `relaxationWeight`, T_c from `climatologyTemperatureK`.
 * Notes: equals T_join at p_join exactly and T_c(p) for s ≥ S.
 * Source: our blending choice; T_c from the parametric climatology (polytropic segments,
 * Wallace & Hobbs 2006, ch. 3).
 *
 * @param pressurePa pressure at or above the join, Pa
 * @param join join pressure (Pa) and temperature (K)
 * @param params climatology parameters
 * @param relaxationScaleHeights S, default 2
 * @returns temperature, K
 */
export function blendedClimatologyTemperatureK(
  pressurePa: number,
  join: { pressurePa: number; temperatureK: number },
  params: ClimatologyParameters,
  relaxationScaleHeights = 2,
): number {
  const offset = join.temperatureK - climatologyTemperatureK(join.pressurePa, params)
  const s = Math.log(join.pressurePa / pressurePa)
  return (
    climatologyTemperatureK(pressurePa, params) +
    relaxationWeight(s, relaxationScaleHeights) * offset
  )
}

function climatologyParameters(
  climatology: ClimatologyId | ClimatologyParameters,
): ClimatologyParameters {
  const params =
    typeof climatology === 'string' ? getClimatologyPreset(climatology).parameters : climatology
  validateClimatologyParameters(params)
  return params
}

/**
 * Levels above a sounding's last level taken from a climatology, continuous at the join.
 *
 * Method: N = ⌈ln(p_join/p_top)/Δ⌉ levels evenly spaced in ln p from just above the join to
 * p_top. Temperature from `blendedClimatologyTemperatureK`. Water vapour: the climatology's own
 * (Manabe–Wetherald RH below its tropopause, its stratospheric vmr above), scaled by
 * (x_join/x_c,join)^w so it is continuous at the join, then capped at saturation at the blended
 * temperature. Ozone: Green's analytic profile of the climatology at the level heights, scaled
 * the same way when the sounding has ozone, as is otherwise. Heights by the hypsometric equation
 * upward from the join height.
 * Notes: nothing is added when p_join ≤ p_top. The climatology's surface state is not used
 * except through its shape aloft.
 * Source: our blending choice; climatology physics as in `buildClimatologyProfile` (Manabe &
 * Wetherald 1967; Green 1964; hypsometric equation, Wallace & Hobbs 2006 eq. 3.29).
 *
 * @param join the sounding's top level and lowest height
 * @param climatology preset id or parameter set
 * @param options top pressure (Pa), spacing, relaxation depth, gravity, saturation phase
 * @returns the added levels, lowest first (possibly none)
 */
export function extendWithClimatology(
  join: ClimatologyJoin,
  climatology: ClimatologyId | ClimatologyParameters,
  options: ClimatologyExtensionOptions = {},
): ClimatologyExtension {
  const params = climatologyParameters(climatology)
  const topPressurePa = options.topPressurePa ?? DEFAULT_EXTENSION_TOP_PA
  const spacing = options.levelSpacingLnP ?? 0.25
  const relaxation = options.relaxationScaleHeights ?? 2
  if (!(topPressurePa >= 1) || !Number.isFinite(topPressurePa)) {
    throw new PhysicsError('OUT_OF_RANGE', `topPressurePa = ${topPressurePa} must be ≥ 1 Pa`, {
      topPressurePa,
    })
  }
  if (!(spacing >= 0.01 && spacing <= 2)) {
    throw new PhysicsError('OUT_OF_RANGE', `levelSpacingLnP = ${spacing} is outside [0.01, 2]`, {
      spacing,
    })
  }
  if (!(join.pressurePa > 0) || !Number.isFinite(join.pressurePa)) {
    throw new PhysicsError('OUT_OF_RANGE', `join pressure ${join.pressurePa} must be > 0`, {})
  }
  const depth = Math.log(join.pressurePa / topPressurePa)
  const n = depth > 1e-9 ? Math.ceil(depth / spacing - 1e-9) : 0
  const out: ClimatologyExtension = {
    pressurePa: new Float64Array(n),
    temperatureK: new Float64Array(n),
    heightM: new Float64Array(n),
    waterVmr: new Float64Array(n),
    ozoneVmr: new Float64Array(n),
  }
  if (n === 0) return out

  // Pressures, the join first (index 0) then the added levels.
  const pressurePa = new Float64Array(n + 1)
  const climatologyT = new Float64Array(n + 1)
  const blendedT = new Float64Array(n + 1)
  const weight = new Float64Array(n + 1)
  pressurePa[0] = join.pressurePa
  for (let k = 1; k <= n; k++) {
    pressurePa[k] = k === n ? topPressurePa : join.pressurePa * Math.exp((-depth * k) / n)
  }
  for (let k = 0; k <= n; k++) {
    climatologyT[k] = climatologyTemperatureK(pressurePa[k], params)
    weight[k] = relaxationWeight(Math.log(join.pressurePa / pressurePa[k]), relaxation)
    blendedT[k] =
      k === 0
        ? join.temperatureK
        : climatologyT[k] + weight[k] * (join.temperatureK - climatologyT[0])
  }

  // Water vapour: the climatology's, made continuous at the join, capped at saturation.
  const relativeHumidity = new Float64Array(n + 1)
  for (let k = 0; k <= n; k++) {
    relativeHumidity[k] = manabeWetheraldRelativeHumidity(
      pressurePa[k],
      params.surfacePressurePa,
      params.surfaceRelativeHumidity,
    )
  }
  const climatologyWater = waterVapourVmrProfile({
    pressurePa,
    temperatureK: climatologyT,
    relativeHumidity,
    tropopausePressurePa: params.tropopausePressurePa,
    stratosphericVmr: params.stratosphericWaterVmr,
    phase: options.saturationPhase,
  })
  const water = new Float64Array(n + 1)
  const waterRatio =
    join.waterVmr !== undefined && join.waterVmr > 0 && climatologyWater[0] > 0
      ? join.waterVmr / climatologyWater[0]
      : 1
  water[0] = join.waterVmr ?? climatologyWater[0]
  for (let k = 1; k <= n; k++) {
    let x = climatologyWater[k] * waterRatio ** weight[k]
    const t = blendedT[k]
    if (t >= 123 && t <= 332) {
      x = Math.min(x, saturationVapourPressurePa(t, options.saturationPhase) / pressurePa[k])
    }
    water[k] = x
  }

  const heightM = hypsometricHeightsM(pressurePa, blendedT, water, join.heightM, {
    gravity: options.gravity ?? 'standard',
  })

  const ozoneAt = (k: number, temperatureK: number) =>
    greenOzoneVmr(
      Math.max(0, heightM[k] - join.surfaceHeightM),
      pressurePa[k],
      temperatureK,
      params.ozone,
    )
  const climatologyOzoneAtJoin = ozoneAt(0, join.temperatureK)
  const ozoneRatio =
    join.ozoneVmr !== undefined && join.ozoneVmr > 0 && climatologyOzoneAtJoin > 0
      ? join.ozoneVmr / climatologyOzoneAtJoin
      : 1

  for (let k = 1; k <= n; k++) {
    out.pressurePa[k - 1] = pressurePa[k]
    out.temperatureK[k - 1] = blendedT[k]
    out.heightM[k - 1] = heightM[k]
    out.waterVmr[k - 1] = water[k]
    out.ozoneVmr[k - 1] = ozoneAt(k, blendedT[k]) * ozoneRatio ** weight[k]
  }
  return out
}

/** Number of levels `extendWithClimatology` adds above a join pressure (same rule). */
export function extensionLevelCount(
  joinPressurePa: number,
  topPressurePa = DEFAULT_EXTENSION_TOP_PA,
  levelSpacingLnP = 0.25,
): number {
  if (!(joinPressurePa > 0 && topPressurePa > 0)) return 0
  const depth = Math.log(joinPressurePa / topPressurePa)
  return depth > 1e-9 ? Math.ceil(depth / levelSpacingLnP - 1e-9) : 0
}
