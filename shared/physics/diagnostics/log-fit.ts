/**
 * Logarithmic fit of forcing against concentration for concentration sweeps,
 * ΔF = a ln(C/C₀) + b (the form of Myhre et al. 1998, GRL 25, 2715, ΔF = 5.35 ln(C/C₀) for CO₂).
 */
import { PhysicsError } from '../errors'

/** Result of the logarithmic fit. */
export interface LogFitResult {
  /** Slope a, W m⁻² per unit ln(C/C₀). */
  slopeWPerM2: number
  /** Intercept b, W m⁻² (0 when fitted through the origin). */
  interceptWPerM2: number
  /** Coefficient of determination R² = 1 − SS_res/SS_tot (1 for a perfect fit). */
  rSquared: number
  /** Forcing per doubling, a ln 2, W m⁻². */
  perDoublingWPerM2: number
  /** Number of points used. */
  points: number
}

/**
 * Least-squares fit ΔF = a ln(C/C₀) + b.
 *
 * Method: ordinary least squares in x = ln(C/C₀): a = Σ(x − x̄)(y − ȳ)/Σ(x − x̄)², b = ȳ − a x̄;
 * through the origin (b = 0): a = Σxy/Σx². R² = 1 − Σ(y − ŷ)²/Σ(y − ȳ)² (for the origin fit
 * SS_tot is still taken about the mean). When all y are equal and the fit is exact, R² = 1.
 * Notes: concentrations must be > 0 and not all equal; at least 2 points (3 for a meaningful R²).
 * Source: least squares, e.g. Press et al., Numerical Recipes 3rd ed. (2007), §15.2; the
 * logarithmic form: Myhre, Highwood, Shine & Stordal 1998, GRL 25, 2715.
 *
 * @param concentrations C, any unit (same as C₀), > 0
 * @param forcingWPerM2 ΔF, W m⁻²
 * @param referenceConcentration C₀, > 0
 * @param throughOrigin force b = 0 (default false)
 * @returns slope, intercept, R², per-doubling forcing
 */
export function fitLogarithmicForcing(
  concentrations: ArrayLike<number>,
  forcingWPerM2: ArrayLike<number>,
  referenceConcentration: number,
  throughOrigin = false,
): LogFitResult {
  const n = concentrations.length
  if (n < 2 || forcingWPerM2.length !== n) {
    throw new PhysicsError('INVALID_ARGUMENT', 'need ≥ 2 points and one forcing per concentration')
  }
  if (!(referenceConcentration > 0 && referenceConcentration < Infinity)) {
    throw new PhysicsError('OUT_OF_RANGE', 'reference concentration must be > 0')
  }
  let sx = 0
  let sy = 0
  for (let i = 0; i < n; i++) {
    const c = concentrations[i]
    const y = forcingWPerM2[i]
    if (!(c > 0 && c < Infinity) || !Number.isFinite(y)) {
      throw new PhysicsError('OUT_OF_RANGE', 'concentrations must be > 0 and forcings finite', {
        index: i,
      })
    }
    sx += Math.log(c / referenceConcentration)
    sy += y
  }
  const xm = sx / n
  const ym = sy / n
  let sxx = 0
  let sxy = 0
  let sxxOrigin = 0
  let sxyOrigin = 0
  let syy = 0
  for (let i = 0; i < n; i++) {
    const x = Math.log(concentrations[i] / referenceConcentration)
    const y = forcingWPerM2[i]
    sxx += (x - xm) * (x - xm)
    sxy += (x - xm) * (y - ym)
    sxxOrigin += x * x
    sxyOrigin += x * y
    syy += (y - ym) * (y - ym)
  }
  const denominator = throughOrigin ? sxxOrigin : sxx
  if (!(denominator > 0)) {
    throw new PhysicsError('INVALID_ARGUMENT', 'concentrations must not all equal the same value')
  }
  const a = throughOrigin ? sxyOrigin / sxxOrigin : sxy / sxx
  const b = throughOrigin ? 0 : ym - a * xm
  let ssRes = 0
  for (let i = 0; i < n; i++) {
    const r = forcingWPerM2[i] - (a * Math.log(concentrations[i] / referenceConcentration) + b)
    ssRes += r * r
  }
  const scale = Math.max(1, ym * ym) * n
  const rSquared = syy > 0 ? 1 - ssRes / syy : ssRes <= 1e-24 * scale ? 1 : 0
  return {
    slopeWPerM2: a,
    interceptWPerM2: b,
    rSquared,
    perDoublingWPerM2: a * Math.LN2,
    points: n,
  }
}
