/**
 * Shared data shapes of the physics engine. Units are fixed and written in the names:
 * pressure Pa, temperature K, height m, wavenumber cm⁻¹, volume mixing ratio mol/mol,
 * column amount molecule cm⁻².
 */

/** Gases the engine knows. Other gases in imported line lists are carried by their HITRAN-style id. */
export const GAS_IDS = ['H2O', 'CO2', 'O3', 'N2O', 'CH4'] as const
export type GasId = (typeof GAS_IDS)[number]

/** Volume mixing ratios (mol/mol of moist air) per gas at one level. Missing gas = 0. */
export type GasVmr = Partial<Record<GasId, number>>

/** One atmospheric level (an interface between layers). */
export interface AtmosphereLevel {
  pressurePa: number
  temperatureK: number
  heightM: number
  vmr: GasVmr
}

/**
 * A column of levels ordered from the surface (index 0, highest pressure) to the top.
 * The surface is a separate boundary with its own temperature and emissivity.
 */
export interface AtmosphereProfile {
  name: string
  surfaceTemperatureK: number
  surfaceEmissivity: number
  levels: AtmosphereLevel[]
}

/** A homogeneous layer between two levels, described by Curtis–Godson means. Index 0 is at the surface. */
export interface AtmosphereLayer {
  pressureBottomPa: number
  pressureTopPa: number
  heightBottomM: number
  heightTopM: number
  /** Absorber-weighted (Curtis–Godson) mean pressure, Pa. */
  meanPressurePa: number
  /** Absorber-weighted (Curtis–Godson) mean temperature, K. */
  meanTemperatureK: number
  /** Column of all air molecules in the layer, molecule cm⁻². */
  airColumnMoleculesPerCm2: number
  /** Column of each gas in the layer, molecule cm⁻². */
  gasColumnMoleculesPerCm2: Partial<Record<GasId, number>>
  /** Column-mean mixing ratio of each gas, mol/mol. */
  meanVmr: GasVmr
}
