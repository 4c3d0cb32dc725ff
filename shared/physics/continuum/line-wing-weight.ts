/**
 * Shape of a far-wing weight: a factor χ(|ν − ν*|, T) that multiplies a line profile beyond some
 * detuning (sub-Lorentzian wings). Evaluated by the optics per line and grid point, so it is
 * specialised once per temperature (per layer) and then called without allocation.
 */

/** A far-wing weight of the lines of one molecule. */
export interface LineWingWeight {
  /** Detuning |ν − ν*| up to which the weight is exactly 1, cm⁻¹. */
  onsetCm: number
  /**
   * Detunings where the weight has a slope discontinuity (onset included), ascending, cm⁻¹. A
   * multi-grid evaluation must treat them like the cutoff edges (evaluate exactly around them)
   * rather than interpolate across them.
   */
  kinksCm: readonly number[]
  /**
   * The weight at one temperature (validated here): returns χ(detuningCm), detuning in cm⁻¹ of
   * either sign, χ in (0, 1].
   */
  atTemperature(temperatureK: number): (detuningCm: number) => number
}
