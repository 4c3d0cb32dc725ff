import { saturationVapourPressurePa } from '../physics/atmosphere/humidity'
import { PhysicsError } from '../physics/errors'
import { GAS_IDS, type AtmosphereProfile, type GasId } from '../physics/types'
import type { MixtureGases } from '../schemas/mixtures'

export interface MixtureWarning {
  levelIndex: number
  gas: GasId
  message: string
}

/**
 * Applies a gas mixture to a profile and returns a new profile (the input is not changed).
 *
 * Method: water vapour first (scale or set), then the other gases. A uniform value of a gas other
 * than water is a dry-air mole fraction, as concentrations are reported, and becomes the moist-air
 * fraction x·(1 − x_H₂O). A scale multiplies the profile's own amount; per-level values replace it.
 * Gases the mixture does not name keep the profile's own amounts.
 * Warnings flag water vapour above 110 % relative humidity over water after scaling.
 */
export function applyMixture(
  profile: AtmosphereProfile,
  gases: MixtureGases,
): { profile: AtmosphereProfile; warnings: MixtureWarning[] } {
  const n = profile.levels.length
  const warnings: MixtureWarning[] = []
  const levels = profile.levels.map((l) => ({ ...l, vmr: { ...l.vmr } }))
  const order: GasId[] = ['H2O', ...GAS_IDS.filter((g) => g !== 'H2O')]
  for (const gas of order) {
    const setting = gases[gas]
    if (!setting) continue
    if (setting.mode === 'per-level' && setting.vmr.length !== n) {
      throw new PhysicsError('INVALID_ARGUMENT', `${gas}: the mixture gives ${setting.vmr.length} levels but the profile has ${n}`, { field: `gases.${gas}` })
    }
    levels.forEach((level, i) => {
      const own = profile.levels[i].vmr[gas] ?? 0
      const water = gas === 'H2O' ? 0 : (level.vmr.H2O ?? 0)
      const value =
        setting.mode === 'scale' ? own * setting.factor : setting.mode === 'uniform' ? setting.vmr * (1 - water) : setting.vmr[i]
      level.vmr[gas] = value
    })
  }
  levels.forEach((level, i) => {
    const water = level.vmr.H2O ?? 0
    const saturated = saturationVapourPressurePa(level.temperatureK, 'water') / level.pressurePa
    if (water > 1.1 * saturated) {
      warnings.push({ levelIndex: i, gas: 'H2O', message: `Level ${i + 1} (${(level.pressurePa / 100).toFixed(1)} hPa): water vapour is ${Math.round((100 * water) / saturated)} % of saturation.` })
    }
  })
  return { profile: { ...profile, levels }, warnings }
}
