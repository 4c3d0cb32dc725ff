/**
 * Preset atmospheres an analyst starts from: the U.S. Standard Atmosphere 1976 and the five
 * parametric climatologies, each adjustable before saving (surface temperature, humidity scale,
 * tropopause pressure, number of levels, top pressure, surface emissivity).
 */
import {
  buildClimatologyProfile,
  CLIMATOLOGY_PRESETS,
  getClimatologyPreset,
  type ClimatologyId,
} from '../physics/atmosphere/climatology'
import { buildUsStandard1976Profile } from '../physics/atmosphere/us-standard-1976-profile'
import type { AtmosphereProfile } from '../physics/types'
import type { PresetId, PresetRequest } from '../schemas/profiles'

export interface AtmospherePresetInfo {
  id: PresetId
  title: string
  description: string
  surfaceTemperatureK: number
  tropopausePressurePa: number
  /** Whether the tropopause and surface temperature can be moved (the 1976 standard is fixed). */
  adjustable: boolean
}

export const ATMOSPHERE_PRESETS: AtmospherePresetInfo[] = [
  {
    id: 'us-standard-1976',
    title: 'U.S. Standard Atmosphere 1976',
    description:
      'The 1976 standard temperature and pressure from its defining layer formulas, with a Manabe–Wetherald humidity profile and an analytic ozone layer.',
    surfaceTemperatureK: 288.15,
    tropopausePressurePa: 22632,
    adjustable: false,
  },
  ...CLIMATOLOGY_PRESETS.map((p) => ({
    id: p.id as PresetId,
    title: p.title,
    description: p.description,
    surfaceTemperatureK: p.parameters.surfaceTemperatureK,
    tropopausePressurePa: p.parameters.tropopausePressurePa,
    adjustable: true,
  })),
]

/** Builds the levels of a preset with the requested adjustments. */
export function buildPresetProfile(request: PresetRequest): { profile: AtmosphereProfile; details: Record<string, unknown> } {
  let profile: AtmosphereProfile
  if (request.preset === 'us-standard-1976') {
    profile = buildUsStandard1976Profile({
      levelCount: request.levelCount,
      topPressurePa: request.topPressurePa,
      surfaceEmissivity: request.surfaceEmissivity,
    })
  } else {
    const base = getClimatologyPreset(request.preset as ClimatologyId).parameters
    const tropopausePressurePa = request.tropopausePressurePa ?? base.tropopausePressurePa
    const params = {
      ...base,
      surfaceTemperatureK: request.surfaceTemperatureK ?? base.surfaceTemperatureK,
      tropopausePressurePa,
      stratosphere: {
        ...base.stratosphere,
        isothermalTopPressurePa: Math.min(base.stratosphere.isothermalTopPressurePa, tropopausePressurePa),
      },
    }
    profile = buildClimatologyProfile(params, {
      levelCount: request.levelCount,
      topPressurePa: request.topPressurePa,
      surfaceEmissivity: request.surfaceEmissivity,
      name: getClimatologyPreset(request.preset as ClimatologyId).title,
    })
  }
  if (request.humidityScale !== 1) {
    profile = {
      ...profile,
      levels: profile.levels.map((l) => ({ ...l, vmr: { ...l.vmr, H2O: (l.vmr.H2O ?? 0) * request.humidityScale } })),
    }
  }
  return { profile, details: { ...request } }
}
