/**
 * An `AtmosphereProfile` built on the U.S. Standard Atmosphere 1976 temperature and pressure, with
 * gases added: water vapour from a relative-humidity profile, uniform CO₂/N₂O/CH₄ and an analytic
 * (Green 1964) ozone profile. The 1976 standard itself is a dry atmosphere and prescribes no
 * water vapour; its ozone table is not reproduced here.
 */
import { PhysicsError } from '../errors'
import type { AtmosphereProfile } from '../types'
import type { SaturationPhase } from './humidity'
import { greenOzoneVmr, type GreenOzoneParameters } from './ozone'
import {
  assembleLevels,
  logPressureLevels,
  TYPICAL_PRESENT_DAY_WELL_MIXED_PPMV,
  type WellMixedGasesPpmv,
} from './profile-gases'
import {
  US76_SEA_LEVEL_PRESSURE_PA,
  US76_TOP_GEOMETRIC_HEIGHT_M,
  usStandardAtmosphere1976,
  usStandardAtmosphere1976AtGeopotential,
  usStandardAtmosphere1976HeightAtPressureM,
} from './us-standard-1976'
import {
  manabeWetheraldRelativeHumidity,
  MANABE_WETHERALD_STRATOSPHERIC_WATER_VMR,
  MANABE_WETHERALD_SURFACE_RELATIVE_HUMIDITY,
  waterVapourVmrProfile,
} from './water-vapour-profile'

/**
 * Ozone for the standard profile: 345 DU total (the column of the 1976 mid-latitude ozone model,
 * ≈345 DU; Krueger & Minzner 1976, JGR; from memory), density peak at 22 km, width 5 km (our
 * choice, close to the Lacis & Hansen 1974 mid-latitude b = 20 km, c = 5 km).
 */
export const US76_DEFAULT_OZONE: Readonly<GreenOzoneParameters> = {
  totalColumnDu: 345,
  peakHeightM: 22000,
  widthM: 5000,
}

/** Options of `buildUsStandard1976Profile`. */
export interface UsStandardProfileOptions {
  /** Number of levels (≥ 2), default 61. */
  levelCount?: number
  /** Top pressure, Pa (default 10 Pa = 0.1 hPa). Ignored when `topHeightM` is given. */
  topPressurePa?: number
  /** Top geometric height, m (≤ 86 000). */
  topHeightM?: number
  /** Level spacing: even in ln p (default) or even in geometric height. */
  spacing?: 'log-pressure' | 'height'
  /** Manabe–Wetherald RH* at the surface (default 0.77). */
  surfaceRelativeHumidity?: number
  /** Stratospheric water-vapour vmr, mol/mol (default 4.82e-6 = 3 mg/kg). */
  stratosphericWaterVmr?: number
  /** Reference phase for saturation, default 'water'. */
  saturationPhase?: SaturationPhase
  /** Dry-air mole fractions of CO₂, N₂O, CH₄ in ppmv (default 400, 0.33, 1.9). */
  wellMixed?: Partial<WellMixedGasesPpmv>
  /** Green ozone parameters (default 345 DU, 22 km, 5 km). */
  ozone?: GreenOzoneParameters
  /** Surface emissivity, default 1. */
  surfaceEmissivity?: number
  /** Profile name, default 'U.S. Standard Atmosphere 1976'. */
  name?: string
}

function levelPressures(options: UsStandardProfileOptions, levelCount: number): Float64Array {
  const surface = US76_SEA_LEVEL_PRESSURE_PA
  if (options.spacing === 'height' || options.topHeightM !== undefined) {
    const topHeightM =
      options.topHeightM ?? usStandardAtmosphere1976HeightAtPressureM(options.topPressurePa ?? 10)
    if (!(topHeightM > 0 && topHeightM <= US76_TOP_GEOMETRIC_HEIGHT_M)) {
      throw new PhysicsError('OUT_OF_RANGE', `topHeightM = ${topHeightM} is outside (0, 86000]`, {
        name: 'topHeightM',
        value: topHeightM,
      })
    }
    if (options.spacing === 'height') {
      const out = new Float64Array(levelCount)
      for (let i = 0; i < levelCount; i++) {
        out[i] = usStandardAtmosphere1976((topHeightM * i) / (levelCount - 1)).pressurePa
      }
      return out
    }
    return logPressureLevels(surface, usStandardAtmosphere1976(topHeightM).pressurePa, levelCount)
  }
  return logPressureLevels(surface, options.topPressurePa ?? 10, levelCount)
}

/**
 * Builds an N-level profile on the U.S. Standard Atmosphere 1976 with a gas mixture.
 *
 * Method: level pressures even in ln p (or heights even in z) from 101 325 Pa to the top; z from
 * the standard's inverse pressure law, T and p from the standard; H₂O from the Manabe–Wetherald
 * RH distribution below the 1976 tropopause (11 km′, 22 632 Pa) and a stratospheric constant
 * above (never supersaturated); O₃ from the Green analytic profile; CO₂/N₂O/CH₄ uniform in dry
 * air.
 * Notes: p, T and z are those of the dry standard; adding water vapour does not change them
 * (the virtual-temperature height change is < 0.3 % and is ignored here).
 * Source: U.S. Standard Atmosphere 1976; Manabe & Wetherald 1967; Green 1964.
 *
 * @param options level count, top, spacing and gas options
 * @returns profile, surface first; heights are geometric, m
 */
export function buildUsStandard1976Profile(
  options: UsStandardProfileOptions = {},
): AtmosphereProfile {
  const levelCount = options.levelCount ?? 61
  const pressurePa = levelPressures(options, levelCount)
  const n = pressurePa.length
  const heightM = new Float64Array(n)
  const temperatureK = new Float64Array(n)
  const relativeHumidity = new Float64Array(n)
  const ozoneVmr = new Float64Array(n)
  const ozone = options.ozone ?? US76_DEFAULT_OZONE
  for (let i = 0; i < n; i++) {
    heightM[i] = i === 0 ? 0 : usStandardAtmosphere1976HeightAtPressureM(pressurePa[i])
    temperatureK[i] = usStandardAtmosphere1976(heightM[i]).temperatureK
    relativeHumidity[i] = manabeWetheraldRelativeHumidity(
      pressurePa[i],
      US76_SEA_LEVEL_PRESSURE_PA,
      options.surfaceRelativeHumidity ?? MANABE_WETHERALD_SURFACE_RELATIVE_HUMIDITY,
    )
    ozoneVmr[i] = greenOzoneVmr(heightM[i], pressurePa[i], temperatureK[i], ozone)
  }
  const waterVmr = waterVapourVmrProfile({
    pressurePa,
    temperatureK,
    relativeHumidity,
    tropopausePressurePa: usStandardAtmosphere1976AtGeopotential(11000).pressurePa,
    stratosphericVmr: options.stratosphericWaterVmr ?? MANABE_WETHERALD_STRATOSPHERIC_WATER_VMR,
    phase: options.saturationPhase,
  })
  const surfaceEmissivity = options.surfaceEmissivity ?? 1
  if (!(surfaceEmissivity >= 0 && surfaceEmissivity <= 1)) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `surfaceEmissivity = ${surfaceEmissivity} is outside [0, 1]`,
      {
        name: 'surfaceEmissivity',
        value: surfaceEmissivity,
      },
    )
  }
  return {
    name: options.name ?? 'U.S. Standard Atmosphere 1976',
    surfaceTemperatureK: temperatureK[0],
    surfaceEmissivity,
    levels: assembleLevels(
      { pressurePa, temperatureK, heightM, waterVmr, ozoneVmr },
      { ...TYPICAL_PRESENT_DAY_WELL_MIXED_PPMV, ...options.wellMixed },
    ),
  }
}
