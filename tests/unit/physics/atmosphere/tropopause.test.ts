import { describe, expect, it } from 'vitest'
import { buildClimatologyProfile, CLIMATOLOGY_PRESETS } from '../../../../shared/physics/atmosphere/climatology'
import { buildUsStandard1976Profile } from '../../../../shared/physics/atmosphere/us-standard-1976-profile'
import { findTropopause } from '../../../../shared/physics/atmosphere/tropopause'
import type { AtmosphereProfile } from '../../../../shared/physics/types'

describe('findTropopause (WMO lapse-rate definition)', () => {
  it.each(CLIMATOLOGY_PRESETS.map((p) => [p.id, p.parameters.tropopausePressurePa] as const))(
    'when given the %s climatology, finds the tropopause it was built with, within one level',
    (id, tropopausePa) => {
      const profile = buildClimatologyProfile(id, { levelCount: 121 })
      const found = findTropopause(profile)
      expect(found.method).toBe('lapse-rate')
      // 121 levels spaced evenly in ln p from ~1013 hPa to 0.1 hPa: one level is a factor ~1.08 in p.
      expect(Math.abs(Math.log(found.pressurePa / tropopausePa))).toBeLessThan(0.09)
    },
  )

  it('when given the U.S. Standard Atmosphere 1976, finds the 11 km′ tropopause (22 632 Pa, the 1976 layer table)', () => {
    const profile = buildUsStandard1976Profile({ levelCount: 241, topHeightM: 80_000 })
    const found = findTropopause(profile)
    expect(found.method).toBe('lapse-rate')
    expect(Math.abs(found.pressurePa - 22632) / 22632).toBeLessThan(0.05)
  })

  it('when no level meets the lapse-rate rule, falls back to the level nearest 100 hPa and says so', () => {
    const levels = [100000, 50000, 20000, 10000, 5000, 1000].map((p, i) => ({
      pressurePa: p,
      temperatureK: 250,
      heightM: i * 5000,
      vmr: {},
    }))
    const profile: AtmosphereProfile = { name: 'iso', surfaceTemperatureK: 250, surfaceEmissivity: 1, levels }
    // An isothermal column has lapse rate 0 ≤ 2 K/km everywhere in the search window, so the
    // first level inside it (500 hPa) qualifies under the WMO rule.
    expect(findTropopause(profile).pressurePa).toBe(50000)
    const warmingAloft = levels.map((l) => ({ ...l, temperatureK: 200 + l.heightM * 0.01 }))
    expect(findTropopause({ ...profile, levels: warmingAloft }).method).toBe('lapse-rate')
    const steep = levels.map((l) => ({ ...l, temperatureK: 300 - l.heightM * 0.006 }))
    const fallback = findTropopause({ ...profile, levels: steep })
    expect(fallback.method).toBe('fallback-100hPa')
    expect(fallback.pressurePa).toBe(10000)
  })
})
