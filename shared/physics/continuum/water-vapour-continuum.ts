/**
 * Water-vapour continuum of the 8–12 µm window in the empirical form of Roberts, Selby & Biberman
 * (1976): a self term (∝ e) and a foreign term (∝ γ(P − e)) sharing one spectral coefficient.
 *
 *   k(ν) = C_s(ν, T) · n_w · [e + γ(P − e)]                      (absorption coefficient, cm⁻¹)
 *   C_s(ν, 296 K) = a + b·exp(−βν),   C_s(ν, T) = C_s(ν, 296 K) · exp[T₀ (1/T − 1/296)]
 *
 * with n_w the water number density (cm⁻³), e the water partial pressure and P the total pressure
 * (atm), a = 1.25e-22 and b = 1.67e-19 cm² molecule⁻¹ atm⁻¹, β = 7.87e-3 cm, γ = 0.002 and
 * T₀ = 1800 K. Along a homogeneous path n_w·L is the water column, so a layer's optical depth is
 *   τ(ν) = C_s(ν, T) · N_w · [e + γ(P − e)],   N_w in molecule cm⁻²,
 * with e = x_w P from the layer's mean pressure P and mean water mixing ratio x_w.
 *
 * Range. The parameterisation was fitted to window data; it is used here on 700–1250 cm⁻¹
 * (`WATER_CONTINUUM_RANGE_CM`, the range it is usually applied to; the fitted data lie in the
 * 8–12 µm window proper, ≈830–1250 cm⁻¹, from memory). Outside, the term is TAPERED to zero over
 * 50 cm⁻¹ with a sin² ramp (650–700 and 1250–1300 cm⁻¹) and is zero beyond — a choice of this
 * module, not part of the published form: the continuum there is real but not described by this
 * formula, and the taper avoids a step in the spectrum. Near 650–700 cm⁻¹ the CO2 band and above
 * 1250 cm⁻¹ the H2O ν₂ band dominate the opacity, so the missing continuum matters little there.
 */
import { STANDARD_ATMOSPHERE_PA } from '../constants'
import { PhysicsError, assertFiniteInRange } from '../errors'
import type { AtmosphereLayer } from '../types'

/**
 * Coefficients of the Roberts form (from memory: the formula is widely reproduced; check the
 * units convention against the paper). Source: Roberts, Selby & Biberman 1976, Appl. Opt. 15(9),
 * 2085–2090.
 */
export const ROBERTS_WATER_CONTINUUM = {
  /** Constant part a of C_s(ν, 296 K), cm² molecule⁻¹ atm⁻¹. */
  aCm2PerMoleculeAtm: 1.25e-22,
  /** Amplitude b of the exponential part of C_s(ν, 296 K), cm² molecule⁻¹ atm⁻¹. */
  bCm2PerMoleculeAtm: 1.67e-19,
  /** Decay constant β of the exponential part, cm (multiplies ν in cm⁻¹). */
  betaCm: 7.87e-3,
  /** Foreign-broadening efficiency γ relative to self-broadening (dimensionless). */
  foreignEfficiency: 0.002,
  /** Temperature coefficient T₀ of exp[T₀(1/T − 1/296)], K. */
  temperatureCoefficientK: 1800,
  /** Reference temperature of C_s, K. */
  referenceTemperatureK: 296,
} as const

/** Wavenumber range where the full Roberts continuum is applied, cm⁻¹ (see the module comment). */
export const WATER_CONTINUUM_RANGE_CM = { min: 700, max: 1250 } as const

/** Width of the sin² taper to zero on each side of `WATER_CONTINUUM_RANGE_CM`, cm⁻¹. */
export const WATER_CONTINUUM_TAPER_CM = 50

/** Temperatures accepted by the water continuum, K (an extrapolation far from 296 K). */
export const WATER_CONTINUUM_TEMPERATURE_RANGE_K = { min: 100, max: 500 } as const

/** Which parts of the continuum to include. */
export interface WaterContinuumParts {
  /** Self term C_s N_w e (default true). */
  self?: boolean
  /** Foreign term C_s N_w γ(P − e) (default true). */
  foreign?: boolean
}

/**
 * Self-continuum coefficient C_s(ν) of water vapour at 296 K.
 *
 * Method: C_s(ν, 296 K) = a + b·exp(−βν), a = 1.25e-22, b = 1.67e-19 cm² molecule⁻¹ atm⁻¹,
 * β = 7.87e-3 cm.
 * Notes: the published form, evaluated for any ν ≥ 0 (no range handling: see
 * `waterContinuumWindowWeight`). Values: 4.33e-22 (800 cm⁻¹), 1.89e-22 (1000), 1.38e-22 (1200).
 * Units: ν in cm⁻¹; result in cm² molecule⁻¹ atm⁻¹.
 * Source: Roberts, Selby & Biberman 1976, Appl. Opt. 15, 2085 (coefficients from memory).
 * @param wavenumberCm ν, cm⁻¹ (finite, ≥ 0)
 */
export function waterContinuumCoefficient296Cm2PerMoleculeAtm(wavenumberCm: number): number {
  assertFiniteInRange('wavenumberCm', wavenumberCm, 0, Infinity)
  const { aCm2PerMoleculeAtm, bCm2PerMoleculeAtm, betaCm } = ROBERTS_WATER_CONTINUUM
  return aCm2PerMoleculeAtm + bCm2PerMoleculeAtm * Math.exp(-betaCm * wavenumberCm)
}

/**
 * Temperature factor of the water continuum relative to 296 K.
 *
 * Method: f(T) = exp[T₀ (1/T − 1/296)], T₀ = 1800 K.
 * Notes: strong negative temperature dependence (f(260 K) = 2.32). The published form applies it
 * to C_s and therefore to both the self and the foreign term; measurements show a much weaker
 * temperature dependence of the foreign part (from memory), which this form ignores.
 * Accepts 100–500 K; outside roughly 260–430 K it is an extrapolation. Dimensionless.
 * Source: Roberts, Selby & Biberman 1976, Appl. Opt. 15, 2085 (coefficients from memory).
 * @param temperatureK T, K
 */
export function waterContinuumTemperatureFactor(temperatureK: number): number {
  const { min, max } = WATER_CONTINUUM_TEMPERATURE_RANGE_K
  assertFiniteInRange('temperatureK', temperatureK, min, max)
  const { temperatureCoefficientK, referenceTemperatureK } = ROBERTS_WATER_CONTINUUM
  return Math.exp(temperatureCoefficientK * (1 / temperatureK - 1 / referenceTemperatureK))
}

/**
 * Self-continuum coefficient C_s(ν, T) of water vapour.
 *
 * Method: C_s(ν, T) = [a + b·exp(−βν)] · exp[T₀ (1/T − 1/296)]
 * (`waterContinuumCoefficient296Cm2PerMoleculeAtm` × `waterContinuumTemperatureFactor`).
 * Notes: no range handling in ν; T in 100–500 K. Units: cm² molecule⁻¹ atm⁻¹.
 * Source: Roberts, Selby & Biberman 1976, Appl. Opt. 15, 2085 (coefficients from memory).
 * @param wavenumberCm ν, cm⁻¹ (≥ 0)
 * @param temperatureK T, K
 */
export function waterContinuumCoefficientCm2PerMoleculeAtm(
  wavenumberCm: number,
  temperatureK: number,
): number {
  return (
    waterContinuumCoefficient296Cm2PerMoleculeAtm(wavenumberCm) *
    waterContinuumTemperatureFactor(temperatureK)
  )
}

/**
 * Weight of the water continuum at ν: 1 inside the range of use, a sin² taper at its edges, 0
 * beyond.
 *
 * Method: w = 1 on [700, 1250] cm⁻¹; w = sin²(π/2 · (ν − 650)/50) on (650, 700) and
 * sin²(π/2 · (1300 − ν)/50) on (1250, 1300); w = 0 elsewhere.
 * Notes: a choice of this module to confine the parameterisation to the window it was fitted to
 * (see the module comment); continuous with a continuous slope. Dimensionless.
 * Source: common practice (smooth spectral tapering of a band-limited term).
 * @param wavenumberCm ν, cm⁻¹ (finite)
 */
export function waterContinuumWindowWeight(wavenumberCm: number): number {
  assertFiniteInRange('wavenumberCm', wavenumberCm, -Infinity, Infinity)
  const { min, max } = WATER_CONTINUUM_RANGE_CM
  const taper = WATER_CONTINUUM_TAPER_CM
  if (wavenumberCm >= min && wavenumberCm <= max) return 1
  if (wavenumberCm <= min - taper || wavenumberCm >= max + taper) return 0
  const distance = wavenumberCm < min ? min - wavenumberCm : wavenumberCm - max
  const s = Math.sin((0.5 * Math.PI * (taper - distance)) / taper)
  return s * s
}

/**
 * The pressure term of the water continuum, atm: e (self), γ(P − e) (foreign), or their sum.
 *
 * Method: self: e; foreign: γ(P − e), γ = 0.002.
 * Notes: requires 0 ≤ e ≤ P. Units: atm.
 * Source: Roberts, Selby & Biberman 1976, Appl. Opt. 15, 2085 (coefficients from memory).
 * @param waterPressureAtm water partial pressure e, atm
 * @param totalPressureAtm total pressure P, atm
 * @param parts self and/or foreign (default both)
 */
export function waterContinuumPressureTermAtm(
  waterPressureAtm: number,
  totalPressureAtm: number,
  parts: WaterContinuumParts = {},
): number {
  assertFiniteInRange('totalPressureAtm', totalPressureAtm, 0, Infinity)
  assertFiniteInRange('waterPressureAtm', waterPressureAtm, 0, totalPressureAtm)
  const self = parts.self ?? true
  const foreign = parts.foreign ?? true
  let term = 0
  if (self) term += waterPressureAtm
  if (foreign) {
    term += ROBERTS_WATER_CONTINUUM.foreignEfficiency * (totalPressureAtm - waterPressureAtm)
  }
  return term
}

/** Input of `waterContinuumOpticalDepth`. */
export interface WaterContinuumPath {
  /** Temperature, K (100–500). */
  temperatureK: number
  /** Water column along the path, molecule cm⁻² (≥ 0). */
  waterColumnMoleculesPerCm2: number
  /** Water partial pressure e, atm (0 ≤ e ≤ P). */
  waterPressureAtm: number
  /** Total pressure P, atm (≥ 0). */
  totalPressureAtm: number
}

/**
 * Water-continuum optical depth of a homogeneous path at one wavenumber.
 *
 * Method: τ = w(ν) · C_s(ν, T) · N_w · [e + γ(P − e)], with w the window weight
 * (`waterContinuumWindowWeight`), C_s from `waterContinuumCoefficientCm2PerMoleculeAtm` and the
 * pressure term from `waterContinuumPressureTermAtm` (self and/or foreign).
 * Notes: equals k·L of the published absorption coefficient for a path of length L with
 * N_w = n_w L. Worked example (computed by hand from the same formula): 1 km at
 * 296 K, e = 20 hPa, P = 1013.25 hPa gives τ(1000 cm⁻¹) ≈ 0.20. Accuracy: that of the 1976
 * parameterisation (coefficients from memory; the modern self continuum near 1000 cm⁻¹ differs by
 * tens of percent). Units: ν in cm⁻¹; τ dimensionless.
 * Source: Roberts, Selby & Biberman 1976, Appl. Opt. 15, 2085 (coefficients from memory).
 * @param wavenumberCm ν, cm⁻¹ (≥ 0)
 * @param path temperature, water column and pressures
 * @param parts self and/or foreign (default both)
 */
export function waterContinuumOpticalDepth(
  wavenumberCm: number,
  path: WaterContinuumPath,
  parts: WaterContinuumParts = {},
): number {
  assertFiniteInRange('waterColumnMoleculesPerCm2', path.waterColumnMoleculesPerCm2, 0, Infinity)
  const pressureTerm = waterContinuumPressureTermAtm(
    path.waterPressureAtm,
    path.totalPressureAtm,
    parts,
  )
  const coefficient = waterContinuumCoefficientCm2PerMoleculeAtm(wavenumberCm, path.temperatureK)
  return (
    waterContinuumWindowWeight(wavenumberCm) *
    coefficient *
    path.waterColumnMoleculesPerCm2 *
    pressureTerm
  )
}

/**
 * The homogeneous path of a layer as seen by the water continuum: mean temperature, water column,
 * and e = x_w P, P from the layer's mean pressure and mean water mixing ratio.
 *
 * Method: P = p̄ / 101325 Pa atm⁻¹, e = x̄_w P, N_w = layer water column (0 when absent).
 * Notes: uses the layer's Curtis–Godson means, as the line optics do. Throws OUT_OF_RANGE for a
 * negative or non-finite pressure, a mixing ratio outside [0, 1] or a negative column.
 * Source: Curtis–Godson approximation, Goody & Yung 1989, Atmospheric Radiation, 2nd ed., §6.2
 * (from memory).
 * @param layer the layer
 */
export function waterContinuumPathOfLayer(layer: AtmosphereLayer): WaterContinuumPath {
  const pressurePa = layer.meanPressurePa
  if (!(Number.isFinite(pressurePa) && pressurePa >= 0)) {
    throw new PhysicsError('OUT_OF_RANGE', 'meanPressurePa must be finite and ≥ 0', {
      value: pressurePa,
    })
  }
  const vmr = layer.meanVmr.H2O ?? 0
  assertFiniteInRange('meanVmr.H2O', vmr, 0, 1)
  const column = layer.gasColumnMoleculesPerCm2.H2O ?? 0
  assertFiniteInRange('gasColumnMoleculesPerCm2.H2O', column, 0, Infinity)
  const totalPressureAtm = pressurePa / STANDARD_ATMOSPHERE_PA
  return {
    temperatureK: layer.meanTemperatureK,
    waterColumnMoleculesPerCm2: column,
    waterPressureAtm: vmr * totalPressureAtm,
    totalPressureAtm,
  }
}

/**
 * Adds the water-continuum optical depth of a layer to `out` on a wavenumber grid.
 *
 * Method: τ(ν) = w(ν) · [a + b·exp(−βν)] · F, with the ν-independent factor
 * F = exp[T₀(1/T − 1/296)] · N_w · [e + γ(P − e)] computed once (`waterContinuumOpticalDepth`
 * per point, factored); points with w = 0 are skipped, no allocation.
 * Notes: a layer without water (zero or absent column, or zero mixing ratio with the foreign part
 * off) adds nothing and does not check its temperature. Units: ν in cm⁻¹; τ dimensionless.
 * Source: Roberts, Selby & Biberman 1976, Appl. Opt. 15, 2085 (coefficients from memory).
 * @param wavenumberCm grid, cm⁻¹ (finite, ≥ 0)
 * @param layer the layer (mean T, mean P, water column and mixing ratio)
 * @param out optical depth to add to, same length as the grid
 * @param parts self and/or foreign (default both)
 */
export function addWaterContinuumOpticalDepth(
  wavenumberCm: Float64Array,
  layer: AtmosphereLayer,
  out: Float64Array,
  parts: WaterContinuumParts = {},
): void {
  if (out.length !== wavenumberCm.length) {
    throw new PhysicsError('INVALID_ARGUMENT', 'output and wavenumber grid differ in length', {
      outLength: out.length,
      gridLength: wavenumberCm.length,
    })
  }
  const path = waterContinuumPathOfLayer(layer)
  const pressureTerm = waterContinuumPressureTermAtm(
    path.waterPressureAtm,
    path.totalPressureAtm,
    parts,
  )
  if (path.waterColumnMoleculesPerCm2 === 0 || pressureTerm === 0) return
  const factor =
    waterContinuumTemperatureFactor(path.temperatureK) *
    path.waterColumnMoleculesPerCm2 *
    pressureTerm
  const { aCm2PerMoleculeAtm, bCm2PerMoleculeAtm, betaCm } = ROBERTS_WATER_CONTINUUM
  const lower = WATER_CONTINUUM_RANGE_CM.min - WATER_CONTINUUM_TAPER_CM
  const upper = WATER_CONTINUUM_RANGE_CM.max + WATER_CONTINUUM_TAPER_CM
  for (let i = 0; i < wavenumberCm.length; i++) {
    const nu = wavenumberCm[i]
    if (!(nu > lower && nu < upper)) {
      if (!Number.isFinite(nu)) {
        throw new PhysicsError('INVALID_ARGUMENT', `wavenumber ${i} is not finite`, { value: nu })
      }
      continue
    }
    const weight = waterContinuumWindowWeight(nu)
    out[i] += weight * (aCm2PerMoleculeAtm + bCm2PerMoleculeAtm * Math.exp(-betaCm * nu)) * factor
  }
}
