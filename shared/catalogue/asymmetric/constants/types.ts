/**
 * Record types of the asymmetric-top and spherical-top constants tables (data only).
 *
 * Confidence tags (the same scale as the linear-molecule tables, `../../constants/confidence.ts`):
 * VERIFIED — checked against the published source named in `source`; COMPUTED — derived in this
 * project from a stated formula and other tabulated values; MEMORY — recalled from the named
 * source ("from memory"), not checked against it; MEMORY-low — recalled with low confidence
 * (unsure of a digit or more), a plausibility value only.
 */

/** How far a number can be trusted. */
export type ConfidenceTag = 'VERIFIED' | 'COMPUTED' | 'MEMORY' | 'MEMORY-low'

/**
 * Rotational and centrifugal-distortion constants of one vibrational state in Watson's
 * A reduction, I^r representation (z = a, x = b, y = c). All values in cm⁻¹. Sextic constants
 * are optional (0 when absent).
 */
export interface WatsonConstantsCm {
  /** Rotational constant A (a axis, smallest moment of inertia). */
  A: number
  /** Rotational constant B. */
  B: number
  /** Rotational constant C. */
  C: number
  /** Quartic Δ_J. */
  DeltaJ: number
  /** Quartic Δ_JK. */
  DeltaJK: number
  /** Quartic Δ_K. */
  DeltaK: number
  /** Quartic δ_J. */
  deltaJ: number
  /** Quartic δ_K. */
  deltaK: number
  /** Sextic H_J. */
  HJ?: number
  /** Sextic H_JK. */
  HJK?: number
  /** Sextic H_KJ. */
  HKJ?: number
  /** Sextic H_K. */
  HK?: number
  /** Sextic h_J. */
  hJ?: number
  /** Sextic h_JK. */
  hJK?: number
  /** Sextic h_K. */
  hK?: number
}

/**
 * Nuclear-spin statistical weights of the rotational levels of one vibronic state, by the parity
 * of Ka + Kc (the symmetry of the rotational function under the C2 rotation about the b axis,
 * which exchanges the two identical end nuclei in H2O and O3). A weight 0 means the level does not
 * exist.
 */
export interface SpinWeights {
  /** Weight of levels with Ka + Kc even. */
  evenKaPlusKc: number
  /** Weight of levels with Ka + Kc odd. */
  oddKaPlusKc: number
}

/** One vibrational state of an asymmetric-top molecule. */
export interface AsymmetricTopState {
  /** Vibrational label v1v2v3, e.g. '000', '010'. */
  id: string
  /** Vibrational term value above the ground state, cm⁻¹. */
  vibrationalEnergyCm: number
  /** Watson A-reduction constants (I^r), cm⁻¹. */
  constants: WatsonConstantsCm
  /** Nuclear-spin weights of the rotational levels of this state. */
  spinWeights: SpinWeights
  /** Published source of the numbers. */
  source: string
  /** Confidence of the constants. */
  confidence: ConfidenceTag
}

/** Pressure-broadening parameters at 296 K as a simple function of the lower-state J. */
export interface BroadeningModel {
  /** γ_air(J″) = max(airMinCmPerAtm, airAtJ0CmPerAtm · exp(−airDecayPerJ · J″)), cm⁻¹ atm⁻¹. */
  airAtJ0CmPerAtm: number
  /** Decay rate of γ_air with J″, per unit J. */
  airDecayPerJ: number
  /** Floor of γ_air, cm⁻¹ atm⁻¹. */
  airMinCmPerAtm: number
  /** γ_self = selfToAirRatio · γ_air (dimensionless ratio). */
  selfToAirRatio: number
  /** n_air(J″) = max(nAirMin, nAirAtJ0 − nAirSlopePerJ · J″) (dimensionless). */
  nAirAtJ0: number
  /** Decrease of n_air per unit J″. */
  nAirSlopePerJ: number
  /** Floor of n_air. */
  nAirMin: number
  /** Air pressure shift δ_air, cm⁻¹ atm⁻¹ (one representative value per band). */
  pressureShiftCmPerAtm: number
  /** Source of the representative values. */
  source: string
  /** Confidence. */
  confidence: ConfidenceTag
}

/** Dipole component that carries a band: a-, b- or c-type transitions. */
export type TransitionType = 'a' | 'b' | 'c'

/** One band of an asymmetric top. */
export interface AsymmetricTopBand {
  /** Stable identifier, e.g. 'h2o-161-rotation'. */
  id: string
  /** Database molecule number (1 H2O, 3 O3). */
  moleculeId: number
  /** Isotopologue number (1 = most abundant). */
  isotopologueId: number
  /** Human-readable title. */
  title: string
  /** Lower vibrational state id. */
  lowerStateId: string
  /** Upper vibrational state id. */
  upperStateId: string
  /** Dipole component of the band. */
  transitionType: TransitionType
  /** Band origin, cm⁻¹ (0 for a pure-rotation band). */
  bandOriginCm: number
  /**
   * Band intensity at 296 K, cm⁻¹/(molecule cm⁻²) including the isotopic abundance (the line
   * intensities are normalised to it), or null when the band is computed absolutely from the
   * permanent dipole moment.
   */
  bandIntensityCmPerMolecule: number | null
  /** Permanent dipole moment, debye (for absolute pure-rotation intensities), or null. */
  dipoleMomentDebye: number | null
  /** Pressure-broadening model. */
  broadening: BroadeningModel
  /** Source of the band origin, intensity and dipole. */
  source: string
  /** Confidence of the band intensity (or dipole). */
  confidence: ConfidenceTag
}
