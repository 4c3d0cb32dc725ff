/**
 * Rotational line strengths of asymmetric-top transitions (a-, b- or c-type) from direction-cosine
 * matrix elements in the symmetric-top basis, nuclear-spin weights, and the intensity formulas of
 * the database convention (S at 296 K in cm⁻¹/(molecule cm⁻²), Einstein A).
 */
import { C2_CM_K, PLANCK_J_S, SPEED_OF_LIGHT_CM_PER_S } from '../../physics/constants'
import { PhysicsError, assertFiniteInRange } from '../../physics/errors'
import type { SpinWeights, TransitionType } from './constants/types'
import { wigner3j } from './wigner-3j'

/** Planck constant in cgs units, erg s (CODATA 2018, exact). */
const PLANCK_ERG_S = PLANCK_J_S * 1e7

/** 8π³/(3hc) in cgs, erg⁻¹ cm⁻¹: S = this · ν · (populations) · |R|² with |R|² in esu² cm². */
export const RADIATIVE_PREFACTOR_CGS =
  (8 * Math.PI ** 3) / (3 * PLANCK_ERG_S * SPEED_OF_LIGHT_CM_PER_S)

/** 1 debye² in esu² cm² (1 D = 1e-18 esu cm). */
export const DEBYE_SQUARED_CGS = 1e-36

/**
 * Precomputed direction-cosine weights for one (J″, J′) pair and one transition type:
 * for q = −1, 0, +1, weights[q + 1][K″ + J″] = c_q · (−1)^{K′} (J′ 1 J″; −K′ q K″), K′ = K″ + q,
 * where c_q are the spherical components of the unit dipole along the axis of the type.
 */
export interface DirectionCosineKernel {
  jLower: number
  jUpper: number
  type: TransitionType
  /** Weights for q = −1, 0, +1 (length 2J″ + 1 each; all zero when c_q = 0). */
  weights: [Float64Array, Float64Array, Float64Array]
}

/**
 * Spherical components (q = −1, 0, +1) of a unit dipole along the a (= z), b (= x) or c (= y)
 * axis in the I^r representation, up to a global phase: μ_{±1} = ∓(μ_x ± iμ_y)/√2, μ_0 = μ_z.
 * For c the global factor −i is dropped (only |amplitude|² is used).
 */
function dipoleComponents(type: TransitionType): [number, number, number] {
  switch (type) {
    case 'a':
      return [0, 1, 0]
    case 'b':
      return [Math.SQRT1_2, 0, -Math.SQRT1_2]
    case 'c':
      return [Math.SQRT1_2, 0, Math.SQRT1_2]
  }
}

/**
 * Direction-cosine kernel for transitions J″ → J′ (|J′ − J″| ≤ 1) of one dipole type.
 *
 * Method: in the symmetric-top basis (Zare's phase convention, |J K M⟩ ∝ D^J_{MK}*),
 * ⟨J′K′M′|D^1_{pq}*|J″K″M″⟩ = √[(2J′+1)(2J″+1)] (−1)^{M′−K′} (J′ 1 J″; −M′ p M″)(J′ 1 J″; −K′ q K″),
 * and the space-fixed dipole μ_p = Σ_q D^1_{pq}* μ_q. The kernel stores the K-dependent factor
 * times the molecule-fixed components μ_q of a unit dipole along the type axis.
 * Notes: |J′ − J″| ≤ 1, J′ + J″ ≥ 1. See `rotationalLineStrength`.
 * Source: Zare, Angular Momentum (1988), eqs. (3.118)–(3.125) (integral of three D functions);
 * Gordy & Cook, Microwave Molecular Spectra (1984), ch. 7 (direction cosine matrix elements);
 * from memory.
 * @param logFactorial ln k! table, length > J′ + J″ + 2
 */
export function createDirectionCosineKernel(
  jLower: number,
  jUpper: number,
  type: TransitionType,
  logFactorial: Float64Array,
): DirectionCosineKernel {
  if (
    !Number.isInteger(jLower) ||
    !Number.isInteger(jUpper) ||
    jLower < 0 ||
    jUpper < 0 ||
    Math.abs(jUpper - jLower) > 1 ||
    jUpper + jLower < 1
  ) {
    throw new PhysicsError('INVALID_ARGUMENT', 'dipole transitions need |ΔJ| ≤ 1 and J′ + J″ ≥ 1', {
      jLower,
      jUpper,
    })
  }
  const components = dipoleComponents(type)
  const n = 2 * jLower + 1
  const weights: [Float64Array, Float64Array, Float64Array] = [
    new Float64Array(n),
    new Float64Array(n),
    new Float64Array(n),
  ]
  for (let q = -1; q <= 1; q++) {
    const c = components[q + 1]
    if (c === 0) continue
    const row = weights[q + 1]
    for (let k = -jLower; k <= jLower; k++) {
      const kUpper = k + q
      if (Math.abs(kUpper) > jUpper) continue
      const phase = kUpper % 2 === 0 ? 1 : -1
      row[k + jLower] = c * phase * wigner3j(jUpper, 1, jLower, -kUpper, q, k, logFactorial)
    }
  }
  return { jLower, jUpper, type, weights }
}

/**
 * Line strength of one asymmetric-top transition (dimensionless, per unit dipole).
 *
 * Method: with the eigenvectors c″_K, c′_K in the |J,K⟩ basis,
 * λ = (2J″+1)(2J′+1) |Σ_{K″,q} c″_{K″} w_q(K″) c′_{K″+q}|², w from `createDirectionCosineKernel`.
 * λ is the sum over M″, M′ and the three space-fixed components of |⟨J′τ′M′|Φ_Fg|J″τ″M″⟩|²,
 * symmetric in upper and lower level; Σ over all upper levels (J′ = J″, J″ ± 1) equals 2J″ + 1
 * (sum rule), and for a prolate symmetric top (B = C) it reduces to the Hönl–London factors.
 * Notes: no allocation. Dimensionless; multiply by μ² for |R|².
 * Source: Gordy & Cook (1984) ch. 7; Bunker & Jensen, Molecular Symmetry and Spectroscopy,
 * 2nd ed. (1998), ch. 14 (line strength); from memory.
 * @param lowerVector eigenvector of the lower level, length 2J″ + 1 (index K + J″)
 * @param upperVector eigenvector of the upper level, length 2J′ + 1 (index K + J′)
 */
export function rotationalLineStrength(
  kernel: DirectionCosineKernel,
  lowerVector: Float64Array,
  upperVector: Float64Array,
): number {
  const jl = kernel.jLower
  const ju = kernel.jUpper
  if (lowerVector.length !== 2 * jl + 1 || upperVector.length !== 2 * ju + 1) {
    throw new PhysicsError('INVALID_ARGUMENT', 'eigenvector length does not match the kernel J', {
      jLower: jl,
      jUpper: ju,
    })
  }
  const [wm, w0, wp] = kernel.weights
  let amplitude = 0
  for (let k = -jl; k <= jl; k++) {
    const cl = lowerVector[k + jl]
    if (cl === 0) continue
    const i = k + jl
    let inner = 0
    if (k - 1 >= -ju && k - 1 <= ju) inner += wm[i] * upperVector[k - 1 + ju]
    if (k >= -ju && k <= ju) inner += w0[i] * upperVector[k + ju]
    if (k + 1 >= -ju && k + 1 <= ju) inner += wp[i] * upperVector[k + 1 + ju]
    amplitude += cl * inner
  }
  return (2 * jl + 1) * (2 * ju + 1) * amplitude * amplitude
}

/**
 * Whether a transition between J″_{Ka″,Kc″} and J′_{Ka′,Kc′} is allowed by the symmetry of the
 * dipole component.
 *
 * Method: a-type: ΔKa even, ΔKc odd; b-type: ΔKa odd, ΔKc odd; c-type: ΔKa odd, ΔKc even
 * (parity changes of Ka and Kc). |ΔJ| ≤ 1 is not checked here.
 * Source: Gordy & Cook (1984), ch. 7, asymmetric-rotor selection rules (from memory).
 */
export function isAllowedBySymmetry(
  type: TransitionType,
  kaLower: number,
  kcLower: number,
  kaUpper: number,
  kcUpper: number,
): boolean {
  const dKaOdd = Math.abs(kaUpper - kaLower) % 2 === 1
  const dKcOdd = Math.abs(kcUpper - kcLower) % 2 === 1
  switch (type) {
    case 'a':
      return !dKaOdd && dKcOdd
    case 'b':
      return dKaOdd && dKcOdd
    case 'c':
      return dKaOdd && !dKcOdd
  }
}

/**
 * Nuclear-spin statistical weight of the level J_{Ka,Kc} in a vibronic state.
 *
 * Method: the weight for the parity of Ka + Kc (the character of the rotational function under
 * the C2 rotation about the b axis is (−1)^{Ka+Kc}).
 * Notes: H2O (two protons, I = ½): ortho (Ka + Kc odd in symmetric vibrational states) weight 3,
 * para weight 1. ¹⁶O₃ (spin-0 end nuclei, bosons): levels antisymmetric under the exchange are
 * missing (weight 0). Dimensionless.
 * Source: Herzberg, Infrared and Raman Spectra (1945), ch. I.4 (statistical weights of asymmetric
 * tops); Townes & Schawlow, Microwave Spectroscopy (1955), ch. 4 (from memory).
 */
export function spinWeight(weights: SpinWeights, ka: number, kc: number): number {
  return (ka + kc) % 2 === 0 ? weights.evenKaPlusKc : weights.oddKaPlusKc
}

/**
 * Absolute line intensity of an electric-dipole transition in the database convention.
 *
 * Method: S = (8π³/3hc) · I_a · ν · g_ns e^{−c₂E″/T} (1 − e^{−c₂ν/T}) / Q(T) · μ² λ · 10⁻³⁶,
 * with 1 − e^{−x} evaluated as −expm1(−x) (no cancellation for small ν).
 * Notes: cgs units inside (h in erg s, c in cm s⁻¹, μ in debye → esu cm via 10⁻¹⁸); the result is in
 * cm⁻¹/(molecule cm⁻²) = cm molecule⁻¹. λ is the dimensionless line strength of
 * `rotationalLineStrength` (which contains the M degeneracies); g_ns the nuclear-spin weight of the
 * levels; Q the total internal partition function including the same spin weights.
 * Source: Gordy & Cook (1984), ch. 3 (absorption coefficient); Rothman et al. 1998, JQSRT 60, 665,
 * Appendix; Šimečková et al. 2006, JQSRT 98, 130, eq. (20) (from memory).
 * @param wavenumberCm ν > 0
 * @param lowerStateEnergyCm E″ ≥ 0
 * @param spinWeightValue g_ns ≥ 0
 * @param lineStrength λ ≥ 0 (dimensionless)
 * @param dipoleDebye μ, debye
 * @param partitionFunctionValue Q(T) > 0
 * @param abundance I_a, 0 < I_a ≤ 1
 * @param temperatureK T > 0
 */
export function dipoleLineIntensityCmPerMolecule(
  wavenumberCm: number,
  lowerStateEnergyCm: number,
  spinWeightValue: number,
  lineStrength: number,
  dipoleDebye: number,
  partitionFunctionValue: number,
  abundance: number,
  temperatureK: number,
): number {
  assertFiniteInRange('wavenumberCm', wavenumberCm, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('lowerStateEnergyCm', lowerStateEnergyCm, 0, Infinity)
  assertFiniteInRange('spinWeightValue', spinWeightValue, 0, Infinity)
  assertFiniteInRange('lineStrength', lineStrength, 0, Infinity)
  assertFiniteInRange('dipoleDebye', dipoleDebye, 0, Infinity)
  assertFiniteInRange('partitionFunctionValue', partitionFunctionValue, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('abundance', abundance, Number.MIN_VALUE, 1)
  assertFiniteInRange('temperatureK', temperatureK, Number.MIN_VALUE, Infinity)
  return (
    RADIATIVE_PREFACTOR_CGS *
    abundance *
    wavenumberCm *
    spinWeightValue *
    Math.exp((-C2_CM_K * lowerStateEnergyCm) / temperatureK) *
    -Math.expm1((-C2_CM_K * wavenumberCm) / temperatureK) *
    ((dipoleDebye * dipoleDebye * DEBYE_SQUARED_CGS * lineStrength) / partitionFunctionValue)
  )
}

/**
 * Relative (unnormalised) intensity weight of a rovibrational line, for bands normalised to a
 * published band intensity.
 *
 * Method: w = ν · g_ns e^{−c₂E″/T} (1 − e^{−c₂ν/T}) · λ (the absolute formula of
 * `dipoleLineIntensityCmPerMolecule` without the constant factor (8π³/3hc) I_a |μ_v|²/Q, which
 * cancels in the normalisation S_i = S_band · w_i / Σ w).
 * Notes: the vibrational transition moment is taken as constant (no Herman–Wallis factor).
 * Units: cm⁻¹ (arbitrary scale).
 * Source: as `dipoleLineIntensityCmPerMolecule`.
 */
export function relativeLineWeight(
  wavenumberCm: number,
  lowerStateEnergyCm: number,
  spinWeightValue: number,
  lineStrength: number,
  temperatureK: number,
): number {
  return (
    wavenumberCm *
    spinWeightValue *
    Math.exp((-C2_CM_K * lowerStateEnergyCm) / temperatureK) *
    -Math.expm1((-C2_CM_K * wavenumberCm) / temperatureK) *
    lineStrength
  )
}

/**
 * Einstein A coefficient from the line intensity (database convention).
 *
 * Method: S = I_a A g′ e^{−c₂E″/T}(1 − e^{−c₂ν/T}) / (8πcν² Q), solved for A:
 * A = 8πcν² Q S / (I_a g′ e^{−c₂E″/T}(1 − e^{−c₂ν/T})).
 * Notes: g′ = g_ns(2J′+1) the upper-state statistical weight (with spin). c in cm s⁻¹, ν in cm⁻¹,
 * S in cm molecule⁻¹ → A in s⁻¹. The exponential is evaluated as exp(+c₂E″/T), finite for the
 * energies of this catalogue (E″ < 10⁵ cm⁻¹ at T ≥ 200 K).
 * Source: Šimečková et al. 2006, JQSRT 98, 130, eq. (20) (from memory).
 */
export function einsteinAFromIntensityPerS(
  intensityCmPerMolecule: number,
  wavenumberCm: number,
  lowerStateEnergyCm: number,
  upperStatisticalWeight: number,
  partitionFunctionValue: number,
  abundance: number,
  temperatureK: number,
): number {
  assertFiniteInRange('upperStatisticalWeight', upperStatisticalWeight, Number.MIN_VALUE, Infinity)
  const value =
    (8 *
      Math.PI *
      SPEED_OF_LIGHT_CM_PER_S *
      wavenumberCm *
      wavenumberCm *
      partitionFunctionValue *
      intensityCmPerMolecule *
      Math.exp((C2_CM_K * lowerStateEnergyCm) / temperatureK)) /
    (abundance * upperStatisticalWeight * -Math.expm1((-C2_CM_K * wavenumberCm) / temperatureK))
  if (!Number.isFinite(value)) {
    throw new PhysicsError('OUT_OF_RANGE', 'Einstein A overflows', {
      intensityCmPerMolecule,
      lowerStateEnergyCm,
    })
  }
  return value
}
