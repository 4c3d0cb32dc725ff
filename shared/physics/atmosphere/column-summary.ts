/**
 * Column totals an analyst reads off a profile: precipitable water and total ozone.
 *
 * Method: precipitable water = water column N (molecule cm⁻²) × M_w/N_A (g), as a depth of liquid
 * water of density 1 g cm⁻³ (cm); total ozone = N_O₃ / (2.6867 × 10¹⁶ molecule cm⁻² per Dobson unit).
 * Source: definitions (the Dobson unit: 10⁻³ cm of pure ozone at 0 °C and 1 atm; Loschmidt number
 * CODATA 2018).
 */
import { AVOGADRO_PER_MOL, DOBSON_UNIT_MOLECULES_PER_CM2, WATER_MOLAR_MASS_KG_PER_MOL } from '../constants'
import { GAS_IDS, type AtmosphereProfile, type GasId } from '../types'
import { levelsToLayers, totalGasColumnsMoleculesPerCm2 } from './layers'
import { findTropopause } from './tropopause'

export interface ColumnSummary {
  levelCount: number
  surfacePressurePa: number
  topPressurePa: number
  topHeightM: number
  precipitableWaterCm: number
  ozoneColumnDu: number
  tropopausePressurePa: number
  tropopauseHeightM: number
  tropopauseMethod: string
  /** Gases with a non-zero amount somewhere in the column. */
  gasesPresent: GasId[]
}

export function summariseColumn(profile: AtmosphereProfile): ColumnSummary {
  const totals = totalGasColumnsMoleculesPerCm2(levelsToLayers(profile))
  const tropopause = findTropopause(profile)
  const top = profile.levels[profile.levels.length - 1]
  return {
    levelCount: profile.levels.length,
    surfacePressurePa: profile.levels[0].pressurePa,
    topPressurePa: top.pressurePa,
    topHeightM: top.heightM,
    precipitableWaterCm: ((totals.H2O ?? 0) * WATER_MOLAR_MASS_KG_PER_MOL * 1000) / AVOGADRO_PER_MOL,
    ozoneColumnDu: (totals.O3 ?? 0) / DOBSON_UNIT_MOLECULES_PER_CM2,
    tropopausePressurePa: tropopause.pressurePa,
    tropopauseHeightM: tropopause.heightM,
    tropopauseMethod: tropopause.method,
    gasesPresent: GAS_IDS.filter((g) => profile.levels.some((l) => (l.vmr[g] ?? 0) > 0)),
  }
}
