/**
 * Parametric climatologies of our own: five idealised clear-sky columns (tropical, mid-latitude
 * summer and winter, subarctic summer and winter), each defined by a handful of parameters rather
 * than a table. The temperature is piecewise with constant lapse rates in height (troposphere,
 * isothermal lower stratosphere, warming upper stratosphere, cooling mesosphere), water vapour
 * follows a Manabe–Wetherald relative-humidity distribution with a stratospheric constant, and
 * ozone is Green's analytic profile.
 *
 * The parameter values are our own round choices, guided by the published surface temperatures
 * of the standard model atmospheres (Anderson et al. 1986, AFGL-TR-86-0110: 299.7, 294.2, 272.2,
 * 287.2, 257.2 K — from memory). They are not a reproduction of any table.
 */
import {
  DRY_AIR_MOLAR_MASS_KG_PER_MOL,
  GAS_CONSTANT_J_PER_MOL_K,
  STANDARD_GRAVITY_M_PER_S2,
} from '../constants'
import { PhysicsError } from '../errors'
import type { AtmosphereProfile } from '../types'
import type { SaturationPhase } from './humidity'
import { hypsometricHeightsM } from './hydrostatic'
import { greenOzoneVmr, type GreenOzoneParameters } from './ozone'
import {
  assembleLevels,
  logPressureLevels,
  TYPICAL_PRESENT_DAY_WELL_MIXED_PPMV,
  type WellMixedGasesPpmv,
} from './profile-gases'
import { manabeWetheraldRelativeHumidity, waterVapourVmrProfile } from './water-vapour-profile'

/** Identifiers of the built-in climatologies. */
export const CLIMATOLOGY_IDS = [
  'tropical',
  'mid-latitude-summer',
  'mid-latitude-winter',
  'subarctic-summer',
  'subarctic-winter',
] as const
export type ClimatologyId = (typeof CLIMATOLOGY_IDS)[number]

/** The parameters that define a climatology. */
export interface ClimatologyParameters {
  /** Surface pressure, Pa. */
  surfacePressurePa: number
  /** Air temperature at the surface (also the surface skin temperature), K. */
  surfaceTemperatureK: number
  /** Latitude for the gravity model (heights are geometric), degrees. */
  latitudeDeg: number
  /** Tropospheric lapse rate −dT/dz, K km⁻¹ (positive: cooling with height). */
  troposphereLapseRateKPerKm: number
  /** Tropopause pressure, Pa. */
  tropopausePressurePa: number
  /** Stratosphere: isothermal from the tropopause up to `isothermalTopPressurePa`, then warming. */
  stratosphere: {
    /** Top of the isothermal lower stratosphere, Pa (≤ tropopause pressure). */
    isothermalTopPressurePa: number
    /** Warming rate dT/dz above the isothermal part, K km⁻¹ (positive: warming with height). */
    warmingRateKPerKm: number
    /** Stratopause pressure, Pa (≈ 100 Pa = 1 hPa). */
    stratopausePressurePa: number
  }
  /** Mesospheric lapse rate −dT/dz above the stratopause, K km⁻¹. */
  mesosphereLapseRateKPerKm: number
  /** Manabe–Wetherald surface relative humidity RH* (fraction). */
  surfaceRelativeHumidity: number
  /** Stratospheric water-vapour volume mixing ratio (and tropospheric floor), mol/mol. */
  stratosphericWaterVmr: number
  /** Green analytic ozone: total column (DU), density-peak height and width (m). */
  ozone: GreenOzoneParameters
}

/** A named climatology with a human-readable title and description. */
export interface ClimatologyPreset {
  id: ClimatologyId
  title: string
  description: string
  parameters: Readonly<ClimatologyParameters>
}

const STRATOSPHERIC_WATER_VMR = 4.5e-6

/**
 * The five built-in climatologies. Parameters are our own plausible values (see file header);
 * temperatures stay within 150–350 K for tops down to 1 Pa.
 */
export const CLIMATOLOGY_PRESETS: readonly ClimatologyPreset[] = [
  {
    id: 'tropical',
    title: 'Tropical',
    description:
      'A warm, humid column near 15° latitude: 300 K surface, a high cold tropopause at 100 hPa ' +
      'near 190 K and a thin ozone layer peaking high in the stratosphere.',
    parameters: {
      surfacePressurePa: 101300,
      surfaceTemperatureK: 300,
      latitudeDeg: 15,
      troposphereLapseRateKPerKm: 6.5,
      tropopausePressurePa: 10000,
      stratosphere: {
        isothermalTopPressurePa: 10000,
        warmingRateKPerKm: 2.6,
        stratopausePressurePa: 100,
      },
      mesosphereLapseRateKPerKm: 2.5,
      surfaceRelativeHumidity: 0.8,
      stratosphericWaterVmr: STRATOSPHERIC_WATER_VMR,
      ozone: { totalColumnDu: 270, peakHeightM: 26000, widthM: 4500 },
    },
  },
  {
    id: 'mid-latitude-summer',
    title: 'Mid-latitude summer',
    description:
      'A temperate summer column near 45° latitude: 294 K surface, tropopause near 180 hPa, ' +
      'moderately moist, with about 330 DU of ozone.',
    parameters: {
      surfacePressurePa: 101300,
      surfaceTemperatureK: 294,
      latitudeDeg: 45,
      troposphereLapseRateKPerKm: 6.2,
      tropopausePressurePa: 18000,
      stratosphere: {
        isothermalTopPressurePa: 8000,
        warmingRateKPerKm: 1.9,
        stratopausePressurePa: 100,
      },
      mesosphereLapseRateKPerKm: 2.5,
      surfaceRelativeHumidity: 0.75,
      stratosphericWaterVmr: STRATOSPHERIC_WATER_VMR,
      ozone: { totalColumnDu: 330, peakHeightM: 22000, widthM: 5000 },
    },
  },
  {
    id: 'mid-latitude-winter',
    title: 'Mid-latitude winter',
    description:
      'A cold-season column near 45° latitude: 272 K surface, a weaker lapse rate, tropopause ' +
      'near 250 hPa, dry air and a thick, low ozone layer.',
    parameters: {
      surfacePressurePa: 101300,
      surfaceTemperatureK: 272,
      latitudeDeg: 45,
      troposphereLapseRateKPerKm: 5.5,
      tropopausePressurePa: 25000,
      stratosphere: {
        isothermalTopPressurePa: 3000,
        warmingRateKPerKm: 2.0,
        stratopausePressurePa: 100,
      },
      mesosphereLapseRateKPerKm: 2.0,
      surfaceRelativeHumidity: 0.75,
      stratosphericWaterVmr: STRATOSPHERIC_WATER_VMR,
      ozone: { totalColumnDu: 380, peakHeightM: 20000, widthM: 5000 },
    },
  },
  {
    id: 'subarctic-summer',
    title: 'Subarctic summer',
    description:
      'A high-latitude summer column near 60°: 287 K surface, tropopause near 230 hPa, ' +
      'a warm upper stratosphere and about 345 DU of ozone.',
    parameters: {
      surfacePressurePa: 101300,
      surfaceTemperatureK: 287,
      latitudeDeg: 60,
      troposphereLapseRateKPerKm: 6.0,
      tropopausePressurePa: 23000,
      stratosphere: {
        isothermalTopPressurePa: 5000,
        warmingRateKPerKm: 1.9,
        stratopausePressurePa: 100,
      },
      mesosphereLapseRateKPerKm: 2.5,
      surfaceRelativeHumidity: 0.75,
      stratosphericWaterVmr: STRATOSPHERIC_WATER_VMR,
      ozone: { totalColumnDu: 345, peakHeightM: 20000, widthM: 5000 },
    },
  },
  {
    id: 'subarctic-winter',
    title: 'Subarctic winter',
    description:
      'A polar-night column near 60°: a 257 K surface, a small lapse rate, tropopause near ' +
      '300 hPa, a cold lower stratosphere, very dry air and a thick ozone layer.',
    parameters: {
      surfacePressurePa: 101300,
      surfaceTemperatureK: 257,
      latitudeDeg: 60,
      troposphereLapseRateKPerKm: 4.5,
      tropopausePressurePa: 30000,
      stratosphere: {
        isothermalTopPressurePa: 2000,
        warmingRateKPerKm: 1.2,
        stratopausePressurePa: 100,
      },
      mesosphereLapseRateKPerKm: 1.5,
      surfaceRelativeHumidity: 0.75,
      stratosphericWaterVmr: STRATOSPHERIC_WATER_VMR,
      ozone: { totalColumnDu: 400, peakHeightM: 18000, widthM: 5000 },
    },
  },
]

/** R_d/g₀, m K⁻¹ — converts a height lapse rate (K m⁻¹) into the exponent of T ∝ p^{R_dΓ/g₀}. */
const DRY_GAS_CONSTANT_OVER_G0 =
  GAS_CONSTANT_J_PER_MOL_K / DRY_AIR_MOLAR_MASS_KG_PER_MOL / STANDARD_GRAVITY_M_PER_S2

/** Temperature range every climatology level must respect, K. */
const MIN_TEMPERATURE_K = 150
const MAX_TEMPERATURE_K = 350

function fail(message: string, details: Record<string, unknown>): never {
  throw new PhysicsError('INVALID_ARGUMENT', message, details)
}

/** Checks a parameter set for internal consistency; throws PhysicsError on the first problem. */
export function validateClimatologyParameters(params: ClimatologyParameters): void {
  const { surfacePressurePa: ps, tropopausePressurePa: pt, stratosphere: s } = params
  if (!(ps >= 30000 && ps <= 120000))
    fail(`surfacePressurePa = ${ps} is outside [30000, 120000]`, { ps })
  if (!(pt > 0 && pt < ps)) fail('tropopause must be above the surface', { pt, ps })
  if (!(s.isothermalTopPressurePa > 0 && s.isothermalTopPressurePa <= pt))
    fail('isothermal top must be at or above the tropopause', { ...s, pt })
  if (!(s.stratopausePressurePa > 0 && s.stratopausePressurePa <= s.isothermalTopPressurePa))
    fail('stratopause must be at or above the isothermal top', { ...s })
  const t = params.surfaceTemperatureK
  if (!(t >= 180 && t <= 340)) fail(`surfaceTemperatureK = ${t} is outside [180, 340]`, { t })
  const rates = [
    params.troposphereLapseRateKPerKm,
    s.warmingRateKPerKm,
    params.mesosphereLapseRateKPerKm,
  ]
  if (!rates.every((r) => Number.isFinite(r) && Math.abs(r) <= 12))
    fail('lapse and warming rates must be finite and within ±12 K/km', { rates })
  if (!(params.surfaceRelativeHumidity >= 0 && params.surfaceRelativeHumidity <= 1))
    fail('surfaceRelativeHumidity must be in [0, 1]', { value: params.surfaceRelativeHumidity })
  if (!(Math.abs(params.latitudeDeg) <= 90)) fail('latitudeDeg must be in [−90, 90]', {})
}

/** T at pressure p given T_b at p_b and a constant height lapse rate −dT/dz (K km⁻¹). */
function temperatureAlongLapse(
  pressurePa: number,
  basePressurePa: number,
  baseTemperatureK: number,
  lapseRateKPerKm: number,
): number {
  return (
    baseTemperatureK *
    (pressurePa / basePressurePa) ** (DRY_GAS_CONSTANT_OVER_G0 * lapseRateKPerKm * 1e-3)
  )
}

/**
 * Temperature of a parametric climatology at a pressure.
 *
 * Method: a constant lapse rate Γ = −dT/dz in a hydrostatic dry atmosphere with constant g₀ gives
 * T = T_b (p/p_b)^{R_dΓ/g₀} exactly; the profile chains four such segments with T continuous:
 * troposphere (Γ_trop) to the tropopause, isothermal to `isothermalTopPressurePa`, warming
 * (Γ = −warmingRate) to the stratopause, and Γ_meso above.
 * Notes: defined in pressure, so it does not depend on the humidity; actual layer thicknesses
 * (with virtual temperature and latitude-dependent gravity) differ from the nominal rates by ≲1 %.
 * Source: polytropic atmosphere, e.g. Wallace & Hobbs 2006, ch. 3; U.S. Standard Atmosphere 1976,
 * eq. 33a (same relation with the 1976 constants).
 *
 * @param pressurePa pressure, Pa (> 0)
 * @param params climatology parameters
 * @returns temperature, K
 */
export function climatologyTemperatureK(pressurePa: number, params: ClimatologyParameters): number {
  if (!Number.isFinite(pressurePa) || pressurePa <= 0) {
    throw new PhysicsError('OUT_OF_RANGE', `pressurePa = ${pressurePa} must be > 0`, { pressurePa })
  }
  const ps = params.surfacePressurePa
  const pt = params.tropopausePressurePa
  const s = params.stratosphere
  const tropopauseK = temperatureAlongLapse(
    pt,
    ps,
    params.surfaceTemperatureK,
    params.troposphereLapseRateKPerKm,
  )
  if (pressurePa >= pt) {
    return temperatureAlongLapse(
      pressurePa,
      ps,
      params.surfaceTemperatureK,
      params.troposphereLapseRateKPerKm,
    )
  }
  if (pressurePa >= s.isothermalTopPressurePa) return tropopauseK
  const stratopauseK = temperatureAlongLapse(
    s.stratopausePressurePa,
    s.isothermalTopPressurePa,
    tropopauseK,
    -s.warmingRateKPerKm,
  )
  if (pressurePa >= s.stratopausePressurePa) {
    return temperatureAlongLapse(
      pressurePa,
      s.isothermalTopPressurePa,
      tropopauseK,
      -s.warmingRateKPerKm,
    )
  }
  return temperatureAlongLapse(
    pressurePa,
    s.stratopausePressurePa,
    stratopauseK,
    params.mesosphereLapseRateKPerKm,
  )
}

/** Options of `buildClimatologyProfile`. */
export interface ClimatologyProfileOptions {
  /** Number of levels (≥ 2), default 61. */
  levelCount?: number
  /** Top pressure, Pa, default 10 Pa (0.1 hPa). */
  topPressurePa?: number
  /** Dry-air mole fractions in ppmv; defaults 400, 0.33, 1.9 (typical present-day values). */
  co2Ppmv?: number
  n2oPpmv?: number
  ch4Ppmv?: number
  /** Reference phase for relative humidity and saturation, default 'water'. */
  saturationPhase?: SaturationPhase
  /** Surface emissivity, default 1. */
  surfaceEmissivity?: number
  /** Profile name; defaults to the preset title or 'Custom climatology'. */
  name?: string
}

/** Looks up a built-in climatology by id; throws PhysicsError for an unknown id. */
export function getClimatologyPreset(id: ClimatologyId): ClimatologyPreset {
  const preset = CLIMATOLOGY_PRESETS.find((p) => p.id === id)
  if (!preset) throw new PhysicsError('INVALID_ARGUMENT', `unknown climatology '${id}'`, { id })
  return preset
}

/**
 * Builds an `AtmosphereProfile` from a climatology preset or a parameter set.
 *
 * Method: N levels evenly spaced in ln p from p_s to the top; T from `climatologyTemperatureK`;
 * RH = RH*(Q − 0.02)/0.98 (Manabe & Wetherald 1967) below the tropopause and a constant
 * stratospheric vmr above, capped at saturation; heights from the hypsometric equation with
 * virtual temperature and WGS 84 gravity at the preset latitude; O₃ from Green's analytic
 * profile at those heights; CO₂, N₂O, CH₄ uniform in dry air.
 * Notes: every level temperature is checked to lie within 150–350 K (PhysicsError otherwise).
 * Source: Manabe & Wetherald 1967, J. Atmos. Sci. 24, 241; Green 1964; Murphy & Koop 2005.
 *
 * @param climatology preset id or a full parameter set
 * @param options level count, top pressure, gas amounts, saturation phase, emissivity, name
 * @returns profile, surface first; heights geometric, m
 */
export function buildClimatologyProfile(
  climatology: ClimatologyId | ClimatologyParameters,
  options: ClimatologyProfileOptions = {},
): AtmosphereProfile {
  const preset = typeof climatology === 'string' ? getClimatologyPreset(climatology) : undefined
  const params = preset ? preset.parameters : (climatology as ClimatologyParameters)
  validateClimatologyParameters(params)
  const pressurePa = logPressureLevels(
    params.surfacePressurePa,
    options.topPressurePa ?? 10,
    options.levelCount ?? 61,
  )
  const n = pressurePa.length
  const temperatureK = new Float64Array(n)
  const relativeHumidity = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    const t = climatologyTemperatureK(pressurePa[i], params)
    if (!(t >= MIN_TEMPERATURE_K && t <= MAX_TEMPERATURE_K)) {
      throw new PhysicsError(
        'OUT_OF_RANGE',
        `climatology temperature ${t.toFixed(1)} K at ${pressurePa[i].toFixed(1)} Pa is outside [150, 350] K`,
        { pressurePa: pressurePa[i], temperatureK: t },
      )
    }
    temperatureK[i] = t
    relativeHumidity[i] = manabeWetheraldRelativeHumidity(
      pressurePa[i],
      params.surfacePressurePa,
      params.surfaceRelativeHumidity,
    )
  }
  const waterVmr = waterVapourVmrProfile({
    pressurePa,
    temperatureK,
    relativeHumidity,
    tropopausePressurePa: params.tropopausePressurePa,
    stratosphericVmr: params.stratosphericWaterVmr,
    phase: options.saturationPhase,
  })
  const heightM = hypsometricHeightsM(pressurePa, temperatureK, waterVmr, 0, {
    gravity: { latitudeDeg: params.latitudeDeg },
  })
  const ozoneVmr = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    ozoneVmr[i] = greenOzoneVmr(heightM[i], pressurePa[i], temperatureK[i], params.ozone)
  }
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
  const wellMixed: WellMixedGasesPpmv = {
    co2Ppmv: options.co2Ppmv ?? TYPICAL_PRESENT_DAY_WELL_MIXED_PPMV.co2Ppmv,
    n2oPpmv: options.n2oPpmv ?? TYPICAL_PRESENT_DAY_WELL_MIXED_PPMV.n2oPpmv,
    ch4Ppmv: options.ch4Ppmv ?? TYPICAL_PRESENT_DAY_WELL_MIXED_PPMV.ch4Ppmv,
  }
  return {
    name: options.name ?? preset?.title ?? 'Custom climatology',
    surfaceTemperatureK: params.surfaceTemperatureK,
    surfaceEmissivity,
    levels: assembleLevels({ pressurePa, temperatureK, heightM, waterVmr, ozoneVmr }, wellMixed),
  }
}
