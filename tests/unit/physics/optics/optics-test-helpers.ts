/** Small helpers shared by the optics tests. */
import { dopplerHalfWidthCm, type SpectralLine } from '../../../../shared/physics/spectroscopy'

/** 1 atm in Pa, exact by definition (CGPM 1954). */
export const ATM_PA = 101325

/** A CO2 (626) line with the given overrides, no pressure shift, E″ = 0. */
export function co2Line(overrides: Partial<SpectralLine> = {}): SpectralLine {
  return {
    moleculeId: 2,
    isotopologueId: 1,
    wavenumberCm: 667.3828125,
    intensityCmPerMolecule: 1e-19,
    einsteinAPerS: 1,
    airHalfWidthCmPerAtm: 0.07,
    selfHalfWidthCmPerAtm: 0.07,
    lowerStateEnergyCm: 0,
    temperatureExponentAir: 0.75,
    pressureShiftCmPerAtm: 0,
    ...overrides,
  }
}

/** Trapezoid rule on a uniform grid of step h. */
export function trapezoid(values: ArrayLike<number>, stepCm: number): number {
  const n = values.length
  if (n < 2) return 0
  let sum = 0.5 * (values[0] + values[n - 1])
  for (let i = 1; i < n - 1; i++) sum += values[i]
  return sum * stepCm
}

/** Band absorption ∫(1 − e^{−τ}) dν by the trapezoid rule, cm⁻¹. */
export function bandAbsorptionCm(opticalDepth: ArrayLike<number>, stepCm: number): number {
  const a = new Float64Array(opticalDepth.length)
  for (let i = 0; i < a.length; i++) a[i] = -Math.expm1(-opticalDepth[i])
  return trapezoid(a, stepCm)
}

/**
 * Molar mass (g/mol) that gives a chosen Doppler HWHM at a line position and temperature:
 * α_D ∝ ν √(T/M) (Goody & Yung 1989 ch. 3, from memory), so M = T (ν α₁/α_D)² with α₁ the width
 * for ν = T = M = 1.
 */
export function molarMassForDopplerWidth(
  wavenumberCm: number,
  temperatureK: number,
  dopplerWidthCm: number,
): number {
  const unit = dopplerHalfWidthCm(1, 1, 1)
  return temperatureK * ((wavenumberCm * unit) / dopplerWidthCm) ** 2
}
