import { describe, expect, it } from 'vitest'
import { buildClimatologyProfile, getClimatologyPreset } from '../../../../shared/physics/atmosphere/climatology'
import { summariseColumn } from '../../../../shared/physics/atmosphere/column-summary'
import type { AtmosphereProfile } from '../../../../shared/physics/types'

describe('summariseColumn', () => {
  it('when a column holds 1 g cm⁻² of water, reports 1 cm of precipitable water (definition)', () => {
    // Uniform water vmr x over 1000 hPa → 0: column N = x·p/(g·m_air); choose x so that N·M_w/N_A = 1 g cm⁻².
    const g = 9.80665
    const airColumn = (100000 / (g * (0.0289644 / 6.02214076e23))) / 1e4 // molecule cm⁻² (dry-air approximation)
    const x = 6.02214076e23 / 18.01528 / airColumn
    const levels = [100000, 50000, 10000, 1000, 10].map((p, i) => ({ pressurePa: p, temperatureK: 250, heightM: i * 10000, vmr: { H2O: x } }))
    const profile: AtmosphereProfile = { name: 't', surfaceTemperatureK: 250, surfaceEmissivity: 1, levels }
    // Moist air is lighter than dry air, so the exact column is slightly larger than the dry estimate.
    expect(summariseColumn(profile).precipitableWaterCm).toBeCloseTo(1, 1)
  })

  it('when given a climatology, reports its ozone column close to the preset total (Green 1964 profile)', () => {
    const preset = getClimatologyPreset('mid-latitude-summer')
    const summary = summariseColumn(buildClimatologyProfile('mid-latitude-summer', { levelCount: 121 }))
    expect(Math.abs(summary.ozoneColumnDu - preset.parameters.ozone.totalColumnDu) / preset.parameters.ozone.totalColumnDu).toBeLessThan(0.02)
    expect(summary.levelCount).toBe(121)
    expect(summary.topPressurePa).toBeCloseTo(10, 6)
  })
})
