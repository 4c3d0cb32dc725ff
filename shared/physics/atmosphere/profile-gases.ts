/**
 * Assembly of atmosphere levels with their gas mixing ratios: water vapour and ozone per level,
 * and uniformly mixed CO₂, N₂O and CH₄ given as dry-air mole fractions.
 */
import { PhysicsError } from '../errors'
import type { AtmosphereLevel } from '../types'

/** Dry-air mole fractions of the well-mixed gases, ppmv (µmol/mol). */
export interface WellMixedGasesPpmv {
  co2Ppmv: number
  n2oPpmv: number
  ch4Ppmv: number
}

/**
 * Typical present-day values (common practice, rounded): CO₂ 400 ppmv, N₂O 0.33 ppmv,
 * CH₄ 1.9 ppmv. Not a dated observation; change them for a specific year or scenario.
 */
export const TYPICAL_PRESENT_DAY_WELL_MIXED_PPMV: Readonly<WellMixedGasesPpmv> = {
  co2Ppmv: 400,
  n2oPpmv: 0.33,
  ch4Ppmv: 1.9,
}

/** Per-level inputs of `assembleLevels`, all the same length, surface first. */
export interface LevelColumns {
  pressurePa: ArrayLike<number>
  temperatureK: ArrayLike<number>
  heightM: ArrayLike<number>
  waterVmr: ArrayLike<number>
  ozoneVmr: ArrayLike<number>
}

function checkPpmv(name: string, value: number): void {
  if (!Number.isFinite(value) || value < 0 || value > 1e5) {
    throw new PhysicsError('OUT_OF_RANGE', `${name} = ${value} is outside [0, 1e5] ppmv`, {
      name,
      value,
    })
  }
}

/**
 * Builds `AtmosphereLevel` records from level columns and well-mixed gas amounts.
 *
 * Method: H₂O and O₃ are taken as given (moist-air vmr); a well-mixed gas with dry-air mole
 * fraction x_d has moist-air vmr x = x_d (1 − x_H₂O).
 * Notes: monitoring networks report CO₂, N₂O and CH₄ as dry-air mole fractions (common practice).
 * Source: definition of mole fraction in a mixture.
 *
 * @param columns level pressures (Pa), temperatures (K), heights (m), H₂O and O₃ vmr (mol/mol)
 * @param wellMixed dry-air mole fractions in ppmv
 * @returns levels, surface first
 */
export function assembleLevels(
  columns: LevelColumns,
  wellMixed: WellMixedGasesPpmv = TYPICAL_PRESENT_DAY_WELL_MIXED_PPMV,
): AtmosphereLevel[] {
  checkPpmv('co2Ppmv', wellMixed.co2Ppmv)
  checkPpmv('n2oPpmv', wellMixed.n2oPpmv)
  checkPpmv('ch4Ppmv', wellMixed.ch4Ppmv)
  const n = columns.pressurePa.length
  const levels: AtmosphereLevel[] = []
  for (let i = 0; i < n; i++) {
    const water = columns.waterVmr[i]
    const dryFraction = 1 - water
    levels.push({
      pressurePa: columns.pressurePa[i],
      temperatureK: columns.temperatureK[i],
      heightM: columns.heightM[i],
      vmr: {
        H2O: water,
        CO2: wellMixed.co2Ppmv * 1e-6 * dryFraction,
        O3: columns.ozoneVmr[i],
        N2O: wellMixed.n2oPpmv * 1e-6 * dryFraction,
        CH4: wellMixed.ch4Ppmv * 1e-6 * dryFraction,
      },
    })
  }
  return levels
}

/**
 * Level pressures evenly spaced in ln p from the surface to the top.
 *
 * Method: pᵢ = p_s (p_top/p_s)^{i/(N−1)}, i = 0…N−1 (the ends are set exactly).
 * Source: common practice for radiative-transfer grids.
 *
 * @param surfacePressurePa surface pressure, Pa
 * @param topPressurePa top pressure, Pa (< surface)
 * @param levelCount number of levels N ≥ 2
 * @returns pressures, Pa, decreasing
 */
export function logPressureLevels(
  surfacePressurePa: number,
  topPressurePa: number,
  levelCount: number,
): Float64Array {
  if (!Number.isInteger(levelCount) || levelCount < 2 || levelCount > 10000) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `levelCount = ${levelCount} must be an integer in [2, 10000]`,
      {
        name: 'levelCount',
        value: levelCount,
      },
    )
  }
  if (!(
    topPressurePa > 0 &&
    topPressurePa < surfacePressurePa &&
    Number.isFinite(surfacePressurePa)
  )) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `topPressurePa = ${topPressurePa} must be > 0 and below surfacePressurePa = ${surfacePressurePa}`,
      { topPressurePa, surfacePressurePa },
    )
  }
  const out = new Float64Array(levelCount)
  const logRatio = Math.log(topPressurePa / surfacePressurePa)
  for (let i = 0; i < levelCount; i++) {
    out[i] = surfacePressurePa * Math.exp((logRatio * i) / (levelCount - 1))
  }
  out[0] = surfacePressurePa
  out[levelCount - 1] = topPressurePa
  return out
}
