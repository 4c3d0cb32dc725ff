import { describe, expect, it } from 'vitest'
import {
  levelsToLayers,
  totalGasColumnsMoleculesPerCm2,
} from '../../../../shared/physics/atmosphere/layers'
import { buildUsStandard1976Profile } from '../../../../shared/physics/atmosphere/us-standard-1976-profile'
import {
  CLIMATOLOGY_PRESETS,
  buildClimatologyProfile,
} from '../../../../shared/physics/atmosphere/climatology'
import {
  AVOGADRO_PER_MOL,
  DOBSON_UNIT_MOLECULES_PER_CM2,
  DRY_AIR_MOLAR_MASS_KG_PER_MOL,
  STANDARD_GRAVITY_M_PER_S2,
  WATER_MOLAR_MASS_KG_PER_MOL,
} from '../../../../shared/physics/constants'
import { PhysicsError } from '../../../../shared/physics/errors'
import type { AtmosphereProfile } from '../../../../shared/physics/types'

function expectRelClose(actual: number, expected: number, tol: number, label = ''): void {
  const rel = Math.abs(actual / expected - 1)
  expect(
    rel,
    `${label} actual=${actual} expected=${expected} rel=${rel} tol=${tol}`,
  ).toBeLessThanOrEqual(tol)
}

const g0 = STANDARD_GRAVITY_M_PER_S2
/** Dry-air molecule mass, kg. */
const mDry = DRY_AIR_MOLAR_MASS_KG_PER_MOL / AVOGADRO_PER_MOL
const mWater = WATER_MOLAR_MASS_KG_PER_MOL / AVOGADRO_PER_MOL

/** A dry US76 profile up to 86 km (no water vapour). */
function dryStandardProfile(levelCount = 61): AtmosphereProfile {
  return buildUsStandard1976Profile({
    levelCount,
    topHeightM: 86000,
    surfaceRelativeHumidity: 0,
    stratosphericWaterVmr: 0,
  })
}

function sum(values: number[]): number {
  return values.reduce((a, b) => a + b, 0)
}

describe('levelsToLayers — column amounts', () => {
  it('when the US76 column is dry, the total air column is p_s N_A/(g₀ M_d) = 2.1482e25 cm⁻²', () => {
    // COMPUTED (mpmath 1.2.1): 101 325 / (9.806 65 × 0.028 964 4 / 6.022 140 76e23) × 1e-4
    // = 2.148 237 546e25 molecule cm⁻²; the often-quoted round value is 2.15e25 (common practice).
    const profile = dryStandardProfile()
    const layers = levelsToLayers(profile)
    const topPa = profile.levels[profile.levels.length - 1].pressurePa
    const column = sum(layers.map((l) => l.airColumnMoleculesPerCm2)) + (topPa / (g0 * mDry)) * 1e-4
    expectRelClose(column, 2.1482375460417507e25, 1e-12)
  })

  it('when CO2 is 400 ppmv in dry air, its column is 400e-6 × the air column = 8.593e21 cm⁻²', () => {
    // COMPUTED (mpmath 1.2.1): 4e-4 × 2.148 237 546e25 = 8.592 950 18e21 molecule cm⁻², for the
    // column above the 86 km top added analytically (p_top/(g₀ m) is 1.7e-5 of the total).
    const profile = dryStandardProfile()
    const layers = levelsToLayers(profile)
    const topPa = profile.levels[profile.levels.length - 1].pressurePa
    const co2 = totalGasColumnsMoleculesPerCm2(layers).CO2! + ((4e-4 * topPa) / (g0 * mDry)) * 1e-4
    expectRelClose(co2, 8.592950184167003e21, 1e-12)
  })

  it('when water vapour is present, mass is conserved: Σ(N_dry m_d + N_w m_w) g = p_s − p_top', () => {
    // hydrostatic balance (Goody & Yung 1989 §6.2): weight of the column = pressure difference.
    const profile = buildClimatologyProfile('tropical', { levelCount: 61 })
    const layers = levelsToLayers(profile)
    let weight = 0
    for (const l of layers) {
      weight +=
        (l.dryAirColumnMoleculesPerCm2 * mDry + l.gasColumnMoleculesPerCm2.H2O! * mWater) *
        1e4 *
        l.gravityMPerS2
    }
    const dp = profile.levels[0].pressurePa - profile.levels[profile.levels.length - 1].pressurePa
    expectRelClose(weight, dp, 1e-12)
  })

  it('when water vapour is present, CO2 equals its dry mole fraction times the dry column', () => {
    // definition of a dry-air mole fraction; exact because both are interpolated linearly.
    const layers = levelsToLayers(
      buildClimatologyProfile('tropical', { levelCount: 41, co2Ppmv: 400 }),
    )
    for (const l of layers)
      expectRelClose(l.gasColumnMoleculesPerCm2.CO2!, 4e-4 * l.dryAirColumnMoleculesPerCm2, 1e-12)
    const humid = layers[0]
    expect(humid.airColumnMoleculesPerCm2).toBeGreaterThan(humid.dryAirColumnMoleculesPerCm2)
  })

  it('when summed, layer columns equal the column of the whole slab computed as one layer', () => {
    // additivity (conservation) for a dry, uniformly mixed slab: Δp/(g m) per layer.
    const profile = dryStandardProfile(31)
    const layers = levelsToLayers(profile)
    for (const l of layers) {
      expectRelClose(
        l.airColumnMoleculesPerCm2,
        ((l.pressureBottomPa - l.pressureTopPa) / (g0 * mDry)) * 1e-4,
        1e-13,
      )
    }
  })

  it('when a layer spans a factor 10 in pressure, the column is still exact to 1e-13', () => {
    // Gauss–Legendre accuracy claim of the module (analytic Δp/(g m) for dry air).
    const profile: AtmosphereProfile = {
      name: 'slab',
      surfaceTemperatureK: 280,
      surfaceEmissivity: 1,
      levels: [
        { pressurePa: 100000, temperatureK: 280, heightM: 0, vmr: { CO2: 4e-4 } },
        { pressurePa: 10000, temperatureK: 210, heightM: 16000, vmr: { CO2: 4e-4 } },
      ],
    }
    const [layer] = levelsToLayers(profile)
    expectRelClose(layer.airColumnMoleculesPerCm2, (90000 / (g0 * mDry)) * 1e-4, 1e-13)
  })
})

describe('levelsToLayers — Curtis–Godson means', () => {
  const pb = 50000
  const pt = 30000
  const tb = 260
  const tt = 235
  const ds = Math.log(pb / pt)
  const slab = (vmrBottom: number, vmrTop: number): AtmosphereProfile => ({
    name: 'slab',
    surfaceTemperatureK: tb,
    surfaceEmissivity: 1,
    levels: [
      { pressurePa: pb, temperatureK: tb, heightM: 5000, vmr: { CO2: 4e-4, O3: vmrBottom } },
      { pressurePa: pt, temperatureK: tt, heightM: 9000, vmr: { CO2: 4e-4, O3: vmrTop } },
    ],
  })

  it('when the gas is uniformly mixed in dry air, p̄ = (p_b + p_t)/2', () => {
    // analytic: dN ∝ dp, so ∫p dp/∫dp = (p_b + p_t)/2 (Goody & Yung 1989 §6.2).
    const [layer] = levelsToLayers(slab(1e-6, 1e-6))
    expectRelClose(layer.meanPressurePa, 0.5 * (pb + pt), 1e-14)
    expectRelClose(layer.gasMeanPressurePa.CO2!, 0.5 * (pb + pt), 1e-14)
  })

  it('when T is linear in ln p, T̄ = T_b + (T_t − T_b)(p_b − p_t(1 + Δs))/(Δs Δp)', () => {
    // analytic: ∫(s_b − s)eˢ ds over [s_t, s_b] = p_b − p_t(1 + Δs), Δs = ln(p_b/p_t).
    const [layer] = levelsToLayers(slab(1e-6, 1e-6))
    const expected = tb + ((tt - tb) * (pb - pt * (1 + ds))) / (ds * (pb - pt))
    expectRelClose(layer.meanTemperatureK, expected, 1e-14)
    expect(layer.meanTemperatureK).toBeLessThan(tb)
    expect(layer.meanTemperatureK).toBeGreaterThan(tt)
  })

  it('when the absorber vmr is linear in ln p, its Curtis–Godson pressure matches the closed form', () => {
    // analytic: with x = x_b + (x_t − x_b)f, f = (s_b − s)/Δs,
    //   ∫x dp   = x_b Δp + (x_t − x_b)(p_b − p_t(1 + Δs))/Δs
    //   ∫x p dp = x_b (p_b² − p_t²)/2 + (x_t − x_b)(p_b²/4 − p_t²(Δs/2 + 1/4))/Δs
    const xb = 1e-7
    const xt = 2e-6
    const [layer] = levelsToLayers(slab(xb, xt))
    const first = xb * (pb - pt) + ((xt - xb) * (pb - pt * (1 + ds))) / ds
    const second =
      (xb * (pb * pb - pt * pt)) / 2 +
      ((xt - xb) * ((pb * pb) / 4 - pt * pt * (ds / 2 + 0.25))) / ds
    expectRelClose(layer.gasMeanPressurePa.O3!, second / first, 1e-14)
    // an absorber increasing upward is weighted toward the top
    expect(layer.gasMeanPressurePa.O3!).toBeLessThan(layer.meanPressurePa)
    expectRelClose(layer.gasColumnMoleculesPerCm2.O3!, (first / (g0 * mDry)) * 1e-4, 1e-13)
    expectRelClose(layer.meanVmr.O3!, first / (pb - pt), 1e-13)
  })

  it('when built from every climatology, all layer means lie between the bounding levels', () => {
    for (const preset of CLIMATOLOGY_PRESETS) {
      const profile = buildClimatologyProfile(preset.id, { levelCount: 40 })
      const layers = levelsToLayers(profile)
      expect(layers).toHaveLength(39)
      layers.forEach((l, i) => {
        const t0 = profile.levels[i].temperatureK
        const t1 = profile.levels[i + 1].temperatureK
        expect(l.meanPressurePa).toBeLessThan(l.pressureBottomPa)
        expect(l.meanPressurePa).toBeGreaterThan(l.pressureTopPa)
        expect(l.meanTemperatureK).toBeGreaterThanOrEqual(Math.min(t0, t1) - 1e-9)
        expect(l.meanTemperatureK).toBeLessThanOrEqual(Math.max(t0, t1) + 1e-9)
        for (const gas of ['H2O', 'O3'] as const) {
          expect(l.gasMeanPressurePa[gas]!).toBeLessThanOrEqual(l.pressureBottomPa)
          expect(l.gasMeanPressurePa[gas]!).toBeGreaterThanOrEqual(l.pressureTopPa)
        }
      })
    }
  })
})

describe('levelsToLayers — ozone column of the climatologies', () => {
  it('when integrated with 121 levels, returns the preset total column within 0.5 %', () => {
    // the Green (1964) profile integrates to its total a (analytic); the residual is the level
    // discretisation, which shrinks with refinement (checked below).
    for (const preset of CLIMATOLOGY_PRESETS) {
      const gravity = { latitudeDeg: preset.parameters.latitudeDeg }
      const layers = levelsToLayers(buildClimatologyProfile(preset.id, { levelCount: 121 }), {
        gravity,
      })
      const du = totalGasColumnsMoleculesPerCm2(layers).O3! / DOBSON_UNIT_MOLECULES_PER_CM2
      expectRelClose(du, preset.parameters.ozone.totalColumnDu, 5e-3, preset.id)
    }
  })

  it('when the level count grows, the ozone column error shrinks', () => {
    const preset = CLIMATOLOGY_PRESETS[1]
    const gravity = { latitudeDeg: preset.parameters.latitudeDeg }
    const error = (n: number) => {
      const layers = levelsToLayers(buildClimatologyProfile(preset.id, { levelCount: n }), {
        gravity,
      })
      const du = totalGasColumnsMoleculesPerCm2(layers).O3! / DOBSON_UNIT_MOLECULES_PER_CM2
      return Math.abs(du / preset.parameters.ozone.totalColumnDu - 1)
    }
    expect(error(61)).toBeLessThan(error(31))
    expect(error(121)).toBeLessThan(error(61))
  })
})

describe('levelsToLayers — validation', () => {
  const level = (pressurePa: number, heightM: number) => ({
    pressurePa,
    temperatureK: 250,
    heightM,
    vmr: {},
  })
  const profileOf = (levels: ReturnType<typeof level>[]): AtmosphereProfile => ({
    name: 'x',
    surfaceTemperatureK: 250,
    surfaceEmissivity: 1,
    levels,
  })

  it('when fewer than two levels are given, throws PhysicsError', () => {
    expect(() => levelsToLayers(profileOf([level(1e5, 0)]))).toThrow(PhysicsError)
  })

  it('when pressure does not decrease or height does not increase, throws NOT_MONOTONIC', () => {
    try {
      levelsToLayers(profileOf([level(1e5, 0), level(1e5, 100)]))
      expect.unreachable()
    } catch (error) {
      expect((error as PhysicsError).code).toBe('NOT_MONOTONIC')
    }
    expect(() => levelsToLayers(profileOf([level(1e5, 100), level(9e4, 100)]))).toThrow(
      PhysicsError,
    )
  })

  it('when a vmr is negative or ≥ 1, throws PhysicsError', () => {
    const bad = profileOf([level(1e5, 0), level(9e4, 900)])
    bad.levels[1].vmr = { H2O: -1e-3 }
    expect(() => levelsToLayers(bad)).toThrow(PhysicsError)
  })
})
