/**
 * Test inputs for the optics: a synthetic CO2-like ν₂ band (P, Q, R branches of the fundamental
 * plus a weaker hot band) and a 5-layer atmosphere from 1000 to 1 hPa.
 *
 * The numbers are representative, not a catalogue: band origin 667.38 cm⁻¹ and B = 0.39022 cm⁻¹
 * (Rothman et al. 1992, JQSRT 48, 537; from memory), even J″ only so P/R lines are 4B ≈ 1.56 cm⁻¹
 * apart (nuclear-spin statistics, Herzberg 1945, Infrared and Raman Spectra; from memory), peak
 * intensity 1e-19 cm/molecule, γ_air ≈ 0.07, γ_self ≈ 0.09 cm⁻¹ atm⁻¹, n = 0.75 (from memory),
 * E″ up to ≈ 2000 cm⁻¹.
 */
import { C2_CM_K } from '../../../../shared/physics/constants'
import { levelsToLayers } from '../../../../shared/physics/atmosphere'
import {
  toLineTable,
  type LineTable,
  type SpectralLine,
} from '../../../../shared/physics/spectroscopy'
import type { AtmosphereLayer, AtmosphereProfile } from '../../../../shared/physics/types'

const B_CM = 0.39022
const ORIGIN_CM = 667.38
const HOT_ORIGIN_CM = 667.75
const HOT_LOWER_ENERGY_CM = 667.38
const DELTA_B_CM = -0.00042

function line(
  wavenumberCm: number,
  intensity: number,
  lowerStateEnergyCm: number,
  j: number,
): SpectralLine {
  return {
    moleculeId: 2,
    isotopologueId: 1,
    wavenumberCm,
    intensityCmPerMolecule: intensity,
    einsteinAPerS: 1,
    airHalfWidthCmPerAtm: 0.08 - 0.0003 * j,
    selfHalfWidthCmPerAtm: 0.11 - 0.0004 * j,
    lowerStateEnergyCm,
    temperatureExponentAir: 0.75,
    pressureShiftCmPerAtm: -0.002,
  }
}

/** Rotational population weight (2J + 1) exp(−c₂ E″/296 K), normalised to 1 at its maximum. */
function population(j: number): number {
  const energy = B_CM * j * (j + 1)
  return ((2 * j + 1) * Math.exp((-C2_CM_K * energy) / 296)) / 30.2
}

/** The synthetic band as line records (unsorted). */
export function syntheticBandLines(maxJ = 70): SpectralLine[] {
  const lines: SpectralLine[] = []
  for (let j = 0; j <= maxJ; j += 2) {
    const energy = B_CM * j * (j + 1)
    const s = 1e-19 * population(j)
    lines.push(line(ORIGIN_CM + 2 * B_CM * (j + 1), 0.5 * s, energy, j))
    if (j > 0) lines.push(line(ORIGIN_CM - 2 * B_CM * j, 0.5 * s, energy, j))
    if (j > 0) lines.push(line(ORIGIN_CM + DELTA_B_CM * j * (j + 1), s, energy, j))
    // Hot band: weaker, lower state 667 cm⁻¹ up, all J.
    const hot = 0.08 * s
    lines.push(
      line(HOT_ORIGIN_CM + 2 * B_CM * (j + 2), 0.5 * hot, energy + HOT_LOWER_ENERGY_CM, j + 1),
    )
    lines.push(
      line(HOT_ORIGIN_CM - 2 * B_CM * (j + 1), 0.5 * hot, energy + HOT_LOWER_ENERGY_CM, j + 1),
    )
  }
  return lines
}

/** The synthetic band as a sorted line table. */
export function syntheticBandTable(maxJ = 70): LineTable {
  return toLineTable(syntheticBandLines(maxJ))
}

/** Six levels from 1000 to 1 hPa (equal steps in ln p), 400 ppmv CO2 → five layers. */
export function fiveLayerProfile(): AtmosphereProfile {
  const pressuresHpa = [1000, 251.19, 63.096, 15.849, 3.9811, 1]
  const temperaturesK = [288, 240, 218, 216, 235, 255]
  return {
    name: 'five-layer test column',
    surfaceTemperatureK: 288,
    surfaceEmissivity: 1,
    levels: pressuresHpa.map((p, i) => ({
      pressurePa: p * 100,
      temperatureK: temperaturesK[i],
      // Hypsometric heights with a 7 km scale height (only used for gravity).
      heightM: -7000 * Math.log(p / 1000),
      vmr: { CO2: 400e-6 },
    })),
  }
}

/** The five layers of `fiveLayerProfile`. */
export function fiveLayers(): AtmosphereLayer[] {
  return levelsToLayers(fiveLayerProfile())
}

/** One homogeneous layer at given mean pressure/temperature with a CO2 column. */
export function singleLayer(
  pressurePa: number,
  temperatureK: number,
  co2ColumnMoleculesPerCm2: number,
  co2Vmr = 400e-6,
): AtmosphereLayer {
  return {
    pressureBottomPa: pressurePa * 1.01,
    pressureTopPa: pressurePa * 0.99,
    heightBottomM: 0,
    heightTopM: 100,
    meanPressurePa: pressurePa,
    meanTemperatureK: temperatureK,
    airColumnMoleculesPerCm2: co2ColumnMoleculesPerCm2 / co2Vmr,
    gasColumnMoleculesPerCm2: { CO2: co2ColumnMoleculesPerCm2 },
    meanVmr: { CO2: co2Vmr },
  }
}
