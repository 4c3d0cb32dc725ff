import { describe, expect, it } from 'vitest'
import {
  CLIMATOLOGY_IDS,
  CLIMATOLOGY_PRESETS,
  buildClimatologyProfile,
  climatologyTemperatureK,
  getClimatologyPreset,
  type ClimatologyParameters,
} from '../../../../shared/physics/atmosphere/climatology'
import {
  saturationVapourPressureOverIcePa,
  saturationVapourPressureOverWaterPa,
} from '../../../../shared/physics/atmosphere/humidity'
import { hypsometricHeightsM } from '../../../../shared/physics/atmosphere/hydrostatic'
import { PhysicsError } from '../../../../shared/physics/errors'
import { GAS_CONSTANT_J_PER_MOL_K } from '../../../../shared/physics/constants'

function expectRelClose(actual: number, expected: number, tol: number, label = ''): void {
  const rel = Math.abs(actual / expected - 1)
  expect(
    rel,
    `${label} actual=${actual} expected=${expected} rel=${rel} tol=${tol}`,
  ).toBeLessThanOrEqual(tol)
}

describe('CLIMATOLOGY_PRESETS', () => {
  it('when listed, has the five ids with titles and descriptions', () => {
    expect(CLIMATOLOGY_PRESETS.map((p) => p.id)).toEqual([...CLIMATOLOGY_IDS])
    for (const p of CLIMATOLOGY_PRESETS) {
      expect(p.title.length).toBeGreaterThan(3)
      expect(p.description.length).toBeGreaterThan(40)
    }
  })

  it('when compared with published standard-atmosphere surface temperatures, lies within 1 K', () => {
    // Anderson et al. 1986, AFGL-TR-86-0110 (from memory): TRP 299.7, MLS 294.2,
    // MLW 272.2, SAS 287.2, SAW 257.2 K — used only as guides for our own round values.
    const guides: Record<string, number> = {
      tropical: 299.7,
      'mid-latitude-summer': 294.2,
      'mid-latitude-winter': 272.2,
      'subarctic-summer': 287.2,
      'subarctic-winter': 257.2,
    }
    for (const p of CLIMATOLOGY_PRESETS) {
      expect(Math.abs(p.parameters.surfaceTemperatureK - guides[p.id])).toBeLessThan(1)
    }
  })

  it('when an unknown id is requested, throws PhysicsError', () => {
    expect(() => getClimatologyPreset('martian' as never)).toThrow(PhysicsError)
  })
})

describe('climatologyTemperatureK', () => {
  const params = getClimatologyPreset('mid-latitude-summer').parameters

  it('when in the troposphere, follows T = T_s (p/p_s)^{R_dΓ/g₀} (constant lapse rate)', () => {
    // polytropic atmosphere (U.S. Standard Atmosphere 1976 eq. 33a form, with R_d and g₀).
    const exponent = ((GAS_CONSTANT_J_PER_MOL_K / 0.0289644) * 0.0062) / 9.80665
    expectRelClose(
      climatologyTemperatureK(50000, params),
      294 * (50000 / 101300) ** exponent,
      1e-12,
    )
  })

  it('when the profile is built, its hypsometric lapse rate matches the parameter within 2 %', () => {
    // dry, constant-g₀ heights from the same T(p): dT/dz = −Γ exactly in the polytrope; the
    // 2 % covers the trapezoid-in-ln p height error with 200 levels.
    const p = Array.from({ length: 200 }, (_, i) => 101300 * (20000 / 101300) ** (i / 199))
    const t = p.map((x) => climatologyTemperatureK(x, params))
    const z = hypsometricHeightsM(p, t, undefined)
    const lapse = ((t[0] - t[199]) / (z[199] - z[0])) * 1000
    expectRelClose(lapse, 6.2, 2e-3)
  })

  it('when across the segment boundaries, is continuous', () => {
    const s = params.stratosphere
    for (const pb of [
      params.tropopausePressurePa,
      s.isothermalTopPressurePa,
      s.stratopausePressurePa,
    ]) {
      const above = climatologyTemperatureK(pb * (1 - 1e-9), params)
      const below = climatologyTemperatureK(pb * (1 + 1e-9), params)
      expect(Math.abs(above - below)).toBeLessThan(1e-6)
    }
  })

  it('when between tropopause and isothermal top, is constant; above, warms up to the stratopause', () => {
    const tTrop = climatologyTemperatureK(params.tropopausePressurePa, params)
    expect(climatologyTemperatureK(10000, params)).toBeCloseTo(tTrop, 10)
    expect(climatologyTemperatureK(1000, params)).toBeGreaterThan(tTrop)
    expect(climatologyTemperatureK(100, params)).toBeGreaterThan(
      climatologyTemperatureK(1000, params),
    )
    expect(climatologyTemperatureK(10, params)).toBeLessThan(climatologyTemperatureK(100, params))
  })
})

describe('buildClimatologyProfile', () => {
  it('when built for every preset, spans the surface to 10 Pa evenly in ln p', () => {
    for (const id of CLIMATOLOGY_IDS) {
      const profile = buildClimatologyProfile(id, { levelCount: 51 })
      const levels = profile.levels
      expect(levels).toHaveLength(51)
      expect(levels[0].pressurePa).toBe(101300)
      expect(levels[50].pressurePa).toBe(10)
      const step = Math.log(levels[0].pressurePa / levels[1].pressurePa)
      for (let i = 1; i < 51; i++) {
        expectRelClose(Math.log(levels[i - 1].pressurePa / levels[i].pressurePa), step, 1e-12)
        expect(levels[i].heightM).toBeGreaterThan(levels[i - 1].heightM)
      }
      expect(levels[0].heightM).toBe(0)
      expect(profile.surfaceTemperatureK).toBe(levels[0].temperatureK)
    }
  })

  it('when built for every preset (top 1 Pa), keeps temperatures within 150–350 K', () => {
    // physical plausibility band required of the climatologies (design brief).
    for (const id of CLIMATOLOGY_IDS) {
      for (const level of buildClimatologyProfile(id, { levelCount: 121, topPressurePa: 1 })
        .levels) {
        expect(level.temperatureK).toBeGreaterThanOrEqual(150)
        expect(level.temperatureK).toBeLessThanOrEqual(350)
      }
    }
  })

  it('when built for every preset, is never supersaturated over water (or over ice when asked)', () => {
    for (const id of CLIMATOLOGY_IDS) {
      for (const level of buildClimatologyProfile(id).levels) {
        const e = level.vmr.H2O! * level.pressurePa
        expect(e).toBeLessThanOrEqual(
          saturationVapourPressureOverWaterPa(level.temperatureK) * (1 + 1e-12),
        )
      }
      for (const level of buildClimatologyProfile(id, { saturationPhase: 'ice-below-freezing' })
        .levels) {
        const e = level.vmr.H2O! * level.pressurePa
        const es =
          level.temperatureK < 273.15
            ? saturationVapourPressureOverIcePa(level.temperatureK)
            : saturationVapourPressureOverWaterPa(level.temperatureK)
        expect(e).toBeLessThanOrEqual(es * (1 + 1e-12))
      }
    }
  })

  it('when built, has surface humidity RH*·e_s(T_s)/p_s and the stratospheric value aloft', () => {
    const preset = getClimatologyPreset('tropical')
    const profile = buildClimatologyProfile('tropical')
    const { surfaceRelativeHumidity, surfaceTemperatureK, surfacePressurePa } = preset.parameters
    // Manabe & Wetherald 1967: RH(Q = 1) = RH*.
    expectRelClose(
      profile.levels[0].vmr.H2O!,
      (surfaceRelativeHumidity * saturationVapourPressureOverWaterPa(surfaceTemperatureK)) /
        surfacePressurePa,
      1e-14,
    )
    const top = profile.levels[profile.levels.length - 1]
    expect(top.vmr.H2O).toBe(preset.parameters.stratosphericWaterVmr)
  })

  it('when gas options are given, uses them as dry-air mole fractions', () => {
    const profile = buildClimatologyProfile('subarctic-winter', {
      co2Ppmv: 560,
      ch4Ppmv: 0.7,
      n2oPpmv: 0.27,
    })
    for (const level of profile.levels) {
      const dry = 1 - level.vmr.H2O!
      expectRelClose(level.vmr.CO2!, 560e-6 * dry, 1e-15)
      expectRelClose(level.vmr.CH4!, 0.7e-6 * dry, 1e-15)
      expectRelClose(level.vmr.N2O!, 0.27e-6 * dry, 1e-15)
    }
  })

  it('when the defaults are used, CO2/N2O/CH4 are 400/0.33/1.9 ppmv in dry air', () => {
    // typical present-day values (common practice)
    const level = buildClimatologyProfile('mid-latitude-summer').levels[30]
    const dry = 1 - level.vmr.H2O!
    expectRelClose(level.vmr.CO2! / dry, 400e-6, 1e-14)
    expectRelClose(level.vmr.N2O! / dry, 0.33e-6, 1e-14)
    expectRelClose(level.vmr.CH4! / dry, 1.9e-6, 1e-14)
  })

  it('when the ozone peak height is asked, the O3 number density peaks near it', () => {
    const preset = getClimatologyPreset('tropical')
    const levels = buildClimatologyProfile('tropical', { levelCount: 201 }).levels
    let best = 0
    let bestHeight = 0
    for (const l of levels) {
      const n = (l.vmr.O3! * l.pressurePa) / l.temperatureK
      if (n > best) {
        best = n
        bestHeight = l.heightM
      }
    }
    expect(Math.abs(bestHeight - preset.parameters.ozone.peakHeightM)).toBeLessThan(500)
  })

  it('when custom parameters are inconsistent or too cold, throws PhysicsError', () => {
    const base = getClimatologyPreset('mid-latitude-winter').parameters
    const badOrder: ClimatologyParameters = { ...base, tropopausePressurePa: 120000 }
    expect(() => buildClimatologyProfile(badOrder)).toThrow(PhysicsError)
    // 12 K/km up to 100 hPa gives T ≈ 272 × 0.0987^0.351 ≈ 120 K < 150 K
    const tooCold: ClimatologyParameters = {
      ...base,
      troposphereLapseRateKPerKm: 12,
      tropopausePressurePa: 10000,
    }
    expect(() => buildClimatologyProfile(tooCold)).toThrow(PhysicsError)
    expect(() => buildClimatologyProfile('tropical', { levelCount: 1 })).toThrow(PhysicsError)
  })

  it('when custom parameters are valid, builds a profile named "Custom climatology"', () => {
    const params = { ...getClimatologyPreset('tropical').parameters, surfaceTemperatureK: 303 }
    const profile = buildClimatologyProfile(params, { levelCount: 11 })
    expect(profile.name).toBe('Custom climatology')
    expect(profile.levels[0].temperatureK).toBe(303)
  })
})
