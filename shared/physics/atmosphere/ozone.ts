/**
 * Analytic ozone profile of Green (1964): the ozone column above height h is a logistic function
 * of h, so the number density is a symmetric bell peaking at height b.
 *
 *   u(h) = a (1 + e^{−b/c}) / (1 + e^{(h−b)/c})
 *
 * with a the total column above the ground (h = 0), b the height of the density maximum and c a
 * width. Source: Green 1964, Appl. Opt. 3, 203 (citation from memory), in the form used by
 * Lacis & Hansen 1974, J. Atmos. Sci. 31, 118, eq. (A1) (equation number from memory), with
 * a = 0.4 cm STP, b = 20 km, c = 5 km for mid-latitudes.
 */
import { BOLTZMANN_J_PER_K, DOBSON_UNIT_MOLECULES_PER_CM2 } from '../constants'
import { PhysicsError } from '../errors'

/** Parameters of the Green analytic ozone profile. */
export interface GreenOzoneParameters {
  /** Total column above h = 0, Dobson units (1 DU = 2.6867 × 10¹⁶ molecule cm⁻²). */
  totalColumnDu: number
  /** Height of the number-density maximum b, m. */
  peakHeightM: number
  /** Width parameter c, m (density full width at half maximum = 2 ln(3 + 2√2) c ≈ 3.53 c). */
  widthM: number
}

/** Mid-latitude values of Lacis & Hansen 1974 (a = 0.4 cm STP = 400 DU, b = 20 km, c = 5 km). */
export const GREEN_OZONE_MIDLATITUDE: Readonly<GreenOzoneParameters> = {
  totalColumnDu: 400,
  peakHeightM: 20000,
  widthM: 5000,
}

function checkParameters(params: GreenOzoneParameters): void {
  const { totalColumnDu, peakHeightM, widthM } = params
  if (!Number.isFinite(totalColumnDu) || totalColumnDu < 0 || totalColumnDu > 2000) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `totalColumnDu = ${totalColumnDu} is outside [0, 2000]`,
      {
        name: 'totalColumnDu',
        value: totalColumnDu,
      },
    )
  }
  if (!Number.isFinite(peakHeightM) || peakHeightM < 0 || peakHeightM > 80000) {
    throw new PhysicsError('OUT_OF_RANGE', `peakHeightM = ${peakHeightM} is outside [0, 80000]`, {
      name: 'peakHeightM',
      value: peakHeightM,
    })
  }
  if (!Number.isFinite(widthM) || widthM < 100 || widthM > 50000) {
    throw new PhysicsError('OUT_OF_RANGE', `widthM = ${widthM} is outside [100, 50000]`, {
      name: 'widthM',
      value: widthM,
    })
  }
}

/** Column normalisation a(1 + e^{−b/c}), molecule cm⁻². */
function normalisation(params: GreenOzoneParameters): number {
  return (
    params.totalColumnDu *
    DOBSON_UNIT_MOLECULES_PER_CM2 *
    (1 + Math.exp(-params.peakHeightM / params.widthM))
  )
}

/**
 * Ozone column above a height in the Green (1964) analytic profile.
 *
 * Method: u(h) = a(1 + e^{−b/c})/(1 + e^{(h−b)/c}), so u(0) = a; evaluated with e^{−(h−b)/c} for
 * h > b to avoid overflow.
 * Notes: a smooth idealisation; real profiles differ by tens of percent locally.
 * Source: Green 1964; Lacis & Hansen 1974, J. Atmos. Sci. 31, 118, appendix.
 *
 * @param heightM height above the surface, m (≥ 0)
 * @param params total column (DU), peak height and width (m)
 * @returns ozone column above heightM, molecule cm⁻²
 */
export function greenOzoneColumnAboveMoleculesPerCm2(
  heightM: number,
  params: GreenOzoneParameters,
): number {
  checkParameters(params)
  if (!Number.isFinite(heightM) || heightM < 0) {
    throw new PhysicsError('OUT_OF_RANGE', `heightM = ${heightM} must be ≥ 0`, { heightM })
  }
  const y = (heightM - params.peakHeightM) / params.widthM
  const a = normalisation(params)
  if (y > 0) {
    const w = Math.exp(-y)
    return (a * w) / (1 + w)
  }
  return a / (1 + Math.exp(y))
}

/**
 * Ozone number density in the Green (1964) analytic profile.
 *
 * Method: n(h) = −du/dh = [a(1 + e^{−b/c})/c] · e^{−|y|}/(1 + e^{−|y|})², y = (h − b)/c
 * (symmetric in y, maximum a(1 + e^{−b/c})/(4c) at h = b).
 * Source: derivative of Green 1964 / Lacis & Hansen 1974 column formula.
 *
 * @param heightM height above the surface, m (≥ 0)
 * @param params total column (DU), peak height and width (m)
 * @returns ozone number density, molecule cm⁻³
 */
export function greenOzoneNumberDensityPerCm3(
  heightM: number,
  params: GreenOzoneParameters,
): number {
  checkParameters(params)
  if (!Number.isFinite(heightM) || heightM < 0) {
    throw new PhysicsError('OUT_OF_RANGE', `heightM = ${heightM} must be ≥ 0`, { heightM })
  }
  const w = Math.exp(-Math.abs(heightM - params.peakHeightM) / params.widthM)
  const widthCm = params.widthM * 100
  return ((normalisation(params) / widthCm) * w) / ((1 + w) * (1 + w))
}

/**
 * Ozone volume mixing ratio at a level from the Green (1964) density and the air number density.
 *
 * Method: x = n_O₃(h) / n_air, n_air = p/(k_B T) (ideal gas, moist air).
 * Notes: the column integrated from these mixing ratios reproduces the total only as well as the
 * level heights are hydrostatically consistent with p and T (to ~1 % with ~1 km levels).
 * Source: Green 1964; ideal-gas law.
 *
 * @param heightM level height above the surface, m
 * @param pressurePa level pressure, Pa
 * @param temperatureK level temperature, K
 * @param params total column (DU), peak height and width (m)
 * @returns volume mixing ratio, mol/mol
 */
export function greenOzoneVmr(
  heightM: number,
  pressurePa: number,
  temperatureK: number,
  params: GreenOzoneParameters,
): number {
  if (
    !Number.isFinite(pressurePa) ||
    pressurePa <= 0 ||
    !Number.isFinite(temperatureK) ||
    temperatureK <= 0
  ) {
    throw new PhysicsError('OUT_OF_RANGE', 'pressurePa and temperatureK must be finite and > 0', {
      pressurePa,
      temperatureK,
    })
  }
  const airPerCm3 = (pressurePa / (BOLTZMANN_J_PER_K * temperatureK)) * 1e-6
  return greenOzoneNumberDensityPerCm3(heightM, params) / airPerCm3
}
