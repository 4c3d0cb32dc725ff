/**
 * Line widths and pressure shifts: Lorentz (collisional) and Doppler half widths, the
 * pressure-shifted line centre, and the Voigt half width approximation.
 *
 * Pressures here are in atm because the line parameters are per atm
 * (1 atm = 101 325 Pa, STANDARD_ATMOSPHERE_PA); convert at the call site.
 */
import {
  GAS_CONSTANT_J_PER_MOL_K,
  LINE_REFERENCE_TEMPERATURE_K,
  SPEED_OF_LIGHT_M_PER_S,
} from '../constants'
import { PhysicsError, assertFiniteInRange } from '../errors'
import { isotopologueMolarMassGPerMol } from './isotopologue-lookup'
import type { LineTable } from './line'

/** Molar mass look-up, g mol⁻¹, by database molecule and isotopologue number. */
export type MolarMassLookup = (moleculeId: number, isotopologueId: number) => number

/** √(2 ln2 R / (1e-3 kg/g)) / c: α_D = ν · DOPPLER_FACTOR · √(T/M), M in g mol⁻¹, T in K. */
const DOPPLER_FACTOR =
  Math.sqrt((2 * Math.LN2 * GAS_CONSTANT_J_PER_MOL_K) / 1e-3) / SPEED_OF_LIGHT_M_PER_S

function checkOut(out: Float64Array, table: LineTable): void {
  if (out.length < table.length) {
    throw new PhysicsError('INVALID_ARGUMENT', 'output array shorter than the line table', {
      outLength: out.length,
      tableLength: table.length,
    })
  }
}

function checkPressures(pressureAtm: number, selfPressureAtm: number): void {
  assertFiniteInRange('pressureAtm', pressureAtm, 0, Infinity)
  assertFiniteInRange('selfPressureAtm', selfPressureAtm, 0, pressureAtm)
}

/**
 * Lorentz (collisional) half width at half maximum.
 *
 * Method: γ(p, T) = (T_ref/T)ⁿ · [γ_air (p − p_self) + γ_self p_self].
 * Notes: the one exponent n (the air value) is applied to both terms, the common practice when
 * the record has no separate self exponent. Impact approximation; linear in pressure.
 * Units: γ_air, γ_self cm⁻¹ atm⁻¹; p, p_self atm; T K; result cm⁻¹.
 * Source: Rothman et al. 1998, JQSRT 60, 665, Appendix (pressure-broadened half width; from memory).
 * @param airHalfWidthCmPerAtm γ_air at T_ref, ≥ 0
 * @param selfHalfWidthCmPerAtm γ_self at T_ref, ≥ 0
 * @param temperatureExponentAir n (dimensionless)
 * @param pressureAtm total pressure p, atm, ≥ 0
 * @param selfPressureAtm partial pressure of the absorbing gas p_self, atm, 0 ≤ p_self ≤ p
 * @param temperatureK T, K (> 0)
 * @param referenceTemperatureK T_ref, K (default 296)
 */
export function lorentzHalfWidthCm(
  airHalfWidthCmPerAtm: number,
  selfHalfWidthCmPerAtm: number,
  temperatureExponentAir: number,
  pressureAtm: number,
  selfPressureAtm: number,
  temperatureK: number,
  referenceTemperatureK: number = LINE_REFERENCE_TEMPERATURE_K,
): number {
  assertFiniteInRange('airHalfWidthCmPerAtm', airHalfWidthCmPerAtm, 0, Infinity)
  assertFiniteInRange('selfHalfWidthCmPerAtm', selfHalfWidthCmPerAtm, 0, Infinity)
  assertFiniteInRange('temperatureExponentAir', temperatureExponentAir, -Infinity, Infinity)
  checkPressures(pressureAtm, selfPressureAtm)
  assertFiniteInRange('temperatureK', temperatureK, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('referenceTemperatureK', referenceTemperatureK, Number.MIN_VALUE, Infinity)
  return (
    (referenceTemperatureK / temperatureK) ** temperatureExponentAir *
    (airHalfWidthCmPerAtm * (pressureAtm - selfPressureAtm) +
      selfHalfWidthCmPerAtm * selfPressureAtm)
  )
}

/**
 * Lorentz half widths of every line of a table, written into `out`.
 *
 * Method: as `lorentzHalfWidthCm`, with p_self the partial pressure of each line's molecule.
 * Notes: no allocation in the loop. Units: out in cm⁻¹.
 * Source: Rothman et al. 1998, JQSRT 60, 665, Appendix (from memory).
 * @param table line table
 * @param pressureAtm total pressure, atm
 * @param selfPressureAtmByMoleculeId partial pressure (atm) indexed by database molecule number;
 *   every molecule in the table needs a finite entry 0 ≤ p_self ≤ p
 * @param temperatureK T, K
 * @param out output, length ≥ table.length
 */
export function lorentzHalfWidths(
  table: LineTable,
  pressureAtm: number,
  selfPressureAtmByMoleculeId: ArrayLike<number>,
  temperatureK: number,
  out: Float64Array,
): void {
  assertFiniteInRange('pressureAtm', pressureAtm, 0, Infinity)
  assertFiniteInRange('temperatureK', temperatureK, Number.MIN_VALUE, Infinity)
  checkOut(out, table)
  const temperatureRatio = LINE_REFERENCE_TEMPERATURE_K / temperatureK
  for (let i = 0; i < table.length; i++) {
    const selfPressure = selfPressureAtmByMoleculeId[table.moleculeId[i]]
    if (!(selfPressure >= 0 && selfPressure <= pressureAtm)) {
      throw new PhysicsError(
        'OUT_OF_RANGE',
        `partial pressure of molecule ${table.moleculeId[i]} missing or outside [0, ${pressureAtm}] atm`,
        { moleculeId: table.moleculeId[i], selfPressureAtm: selfPressure },
      )
    }
    out[i] =
      temperatureRatio ** table.temperatureExponentAir[i] *
      (table.airHalfWidthCmPerAtm[i] * (pressureAtm - selfPressure) +
        table.selfHalfWidthCmPerAtm[i] * selfPressure)
  }
}

/**
 * Pressure-shifted line centre.
 *
 * Method: ν* = ν + δ p.
 * Notes: the shift is taken at the total pressure with the air coefficient and without a
 * temperature dependence (as in records that carry only δ_air). Units: cm⁻¹; δ cm⁻¹ atm⁻¹; p atm.
 * Source: Rothman et al. 1998, JQSRT 60, 665, Appendix (pressure shift; from memory).
 */
export function pressureShiftedWavenumberCm(
  wavenumberCm: number,
  pressureShiftCmPerAtm: number,
  pressureAtm: number,
): number {
  assertFiniteInRange('wavenumberCm', wavenumberCm, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('pressureShiftCmPerAtm', pressureShiftCmPerAtm, -Infinity, Infinity)
  assertFiniteInRange('pressureAtm', pressureAtm, 0, Infinity)
  return wavenumberCm + pressureShiftCmPerAtm * pressureAtm
}

/**
 * Pressure-shifted centres of every line of a table, written into `out` (cm⁻¹).
 *
 * Method: ν*_i = ν_i + δ_i p. Notes: the order of shifted centres can differ from the table order
 * for lines closer than |Δδ| p. Source: as `pressureShiftedWavenumberCm`.
 */
export function pressureShiftedWavenumbers(
  table: LineTable,
  pressureAtm: number,
  out: Float64Array,
): void {
  assertFiniteInRange('pressureAtm', pressureAtm, 0, Infinity)
  checkOut(out, table)
  for (let i = 0; i < table.length; i++) {
    out[i] = table.wavenumberCm[i] + table.pressureShiftCmPerAtm[i] * pressureAtm
  }
}

/**
 * Doppler half width at half maximum.
 *
 * Method: α_D = (ν/c) √(2 ln2 k T / m), m = M/N_A, i.e. (ν/c) √(2 ln2 R T / M).
 * Notes: Maxwellian velocities; exact for the Gaussian profile. Units: ν cm⁻¹ → α_D cm⁻¹;
 * T K; M g mol⁻¹.
 * Source: e.g. Goody & Yung 1989, Atmospheric Radiation, 2nd ed., ch. 3, Doppler broadening
 * (from memory).
 * @param wavenumberCm line centre, cm⁻¹ (> 0)
 * @param temperatureK T, K (> 0)
 * @param molarMassGPerMol molar mass of the isotopologue, g mol⁻¹ (> 0)
 */
export function dopplerHalfWidthCm(
  wavenumberCm: number,
  temperatureK: number,
  molarMassGPerMol: number,
): number {
  assertFiniteInRange('wavenumberCm', wavenumberCm, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('temperatureK', temperatureK, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('molarMassGPerMol', molarMassGPerMol, Number.MIN_VALUE, Infinity)
  return wavenumberCm * DOPPLER_FACTOR * Math.sqrt(temperatureK / molarMassGPerMol)
}

/**
 * Doppler half widths of every line of a table, written into `out` (cm⁻¹).
 *
 * Method: as `dopplerHalfWidthCm`, with the molar mass of each line's isotopologue.
 * Notes: the molar mass is looked up once per change of (molecule, isotopologue) along the table.
 * Source: as `dopplerHalfWidthCm`.
 * @param molarMass molar mass look-up (default: the isotopologue table; throws for unknown ones)
 */
export function dopplerHalfWidths(
  table: LineTable,
  temperatureK: number,
  out: Float64Array,
  molarMass: MolarMassLookup = isotopologueMolarMassGPerMol,
): void {
  assertFiniteInRange('temperatureK', temperatureK, Number.MIN_VALUE, Infinity)
  checkOut(out, table)
  let lastMolecule = -1
  let lastIsotopologue = -1
  let factor = 0
  for (let i = 0; i < table.length; i++) {
    const molecule = table.moleculeId[i]
    const isotopologue = table.isotopologueId[i]
    if (molecule !== lastMolecule || isotopologue !== lastIsotopologue) {
      const mass = molarMass(molecule, isotopologue)
      assertFiniteInRange('molarMassGPerMol', mass, Number.MIN_VALUE, Infinity)
      factor = DOPPLER_FACTOR * Math.sqrt(temperatureK / mass)
      lastMolecule = molecule
      lastIsotopologue = isotopologue
    }
    out[i] = table.wavenumberCm[i] * factor
  }
}

/**
 * Approximate half width at half maximum of the Voigt profile.
 *
 * Method: α_V ≈ 0.5346 α_L + √(0.2166 α_L² + α_D²).
 * Notes: accuracy about 0.02 % over all α_L/α_D (as quoted by the authors, from memory);
 * measured against a bisection of `voigtProfileAccurate`: max relative error 2.4e-4, near
 * α_L/α_D ≈ 0.3 (asserted in the unit test). Exact in both
 * limits to the 4-digit coefficients (α_L = 0 → α_D; α_D = 0 → 1.00000 α_L). Units: cm⁻¹.
 * Source: Olivero & Longbothum 1977, JQSRT 17, 233–236 (from memory).
 * @param dopplerHalfWidthCm α_D, ≥ 0
 * @param lorentzHalfWidthCm α_L, ≥ 0
 */
export function voigtHalfWidthCm(dopplerHalfWidthCm: number, lorentzHalfWidthCm: number): number {
  assertFiniteInRange('dopplerHalfWidthCm', dopplerHalfWidthCm, 0, Infinity)
  assertFiniteInRange('lorentzHalfWidthCm', lorentzHalfWidthCm, 0, Infinity)
  return (
    0.5346 * lorentzHalfWidthCm +
    Math.sqrt(
      0.2166 * lorentzHalfWidthCm * lorentzHalfWidthCm + dopplerHalfWidthCm * dopplerHalfWidthCm,
    )
  )
}
