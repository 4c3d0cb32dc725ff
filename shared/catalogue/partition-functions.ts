/**
 * The partition-function look-up of the built-in catalogue: the level-sum functions of every
 * isotopologue the catalogue generates, and the approximate table functions for all others.
 */
import {
  defaultPartitionFunctionLookup,
  type PartitionFunction,
  type PartitionFunctionLookup,
} from '../physics/spectroscopy/partition-function'
import {
  createMethanePartitionFunction,
  createOzonePartitionFunction,
  createWaterPartitionFunction,
} from './asymmetric'
import { LINEAR_ISOTOPOLOGUES } from './constants/linear-levels'
import { findLinearIsotopologue, linearPartitionFunction } from './linear/partition-function'

/** Builders of the asymmetric-top and CH4 level-sum functions, by 'moleculeId/isotopologueId'. */
const ASYMMETRIC_BUILDERS: ReadonlyMap<string, () => PartitionFunction> = new Map([
  ['1/1', createWaterPartitionFunction],
  ['3/1', createOzonePartitionFunction],
  ['6/1', createMethanePartitionFunction],
])

/**
 * The isotopologues whose partition function comes from a catalogue level sum, as
 * [moleculeId, isotopologueId] pairs: the linear ones (CO2 626, 636, 628; N2O 446), then H2O 161,
 * O3 666, CH4 211.
 */
export const LEVEL_SUM_ISOTOPOLOGUES: readonly (readonly [number, number])[] = [
  ...LINEAR_ISOTOPOLOGUES.map((iso) => [iso.moleculeId, iso.isotopologueId] as const),
  [1, 1],
  [3, 1],
  [6, 1],
]

/**
 * The partition function of the catalogue's own level sum for an isotopologue, or undefined when
 * the catalogue does not generate it.
 * Source: as `linearPartitionFunction` and the `create*PartitionFunction` builders.
 */
function levelSumPartitionFunction(
  moleculeId: number,
  isotopologueId: number,
): PartitionFunction | undefined {
  const linear = findLinearIsotopologue(moleculeId, isotopologueId)
  if (linear) return linearPartitionFunction(linear)
  return ASYMMETRIC_BUILDERS.get(`${moleculeId}/${isotopologueId}`)?.()
}

/**
 * Creates the partition-function look-up of the built-in catalogue (keep it and pass it to the
 * optics as `partitionFunctionLookup`).
 *
 * Method: for CO2 626/636/628 and N2O 446, Q(T) by direct level summation
 * (`linearPartitionFunction`); for H2O 161, O3 666 and CH4 211, the rotational level sums of the
 * Watson / spherical-top levels times Q_vib (`createWaterPartitionFunction`,
 * `createOzonePartitionFunction`, `createMethanePartitionFunction`); for any other isotopologue of
 * the isotopologue table, `approximatePartitionFunction` (Q(296) · (T/296)^j · Q_vib ratio).
 * Each function is built on first request and kept by this look-up (the O3 build takes ~0.3–1 s),
 * so later requests return the same function object.
 * Notes: the level sums are the ones the generators used to set the 296 K line intensities, so
 * S(T) scaling is consistent with the catalogue. Q(296) against the published totals (tests):
 * linear, H2O and CH4 within 1e-4, O3 3469.6 against 3483.71 (−0.4 %). Accepted temperatures:
 * 10–1000 K (linear), 50–500 K (H2O, O3, CH4), 50–1000 K (approximate); outside, the function
 * throws OUT_OF_RANGE. Unknown isotopologues throw UNSUPPORTED when looked up (as the default
 * look-up). The returned functions are pure; the look-up's cache only avoids rebuilding them.
 * Dimensionless.
 * Source: published Q(296) for comparison: Gordon et al. 2022, JQSRT 277, 107949 (isotopologue
 * table); level sums: Herzberg 1945, Infrared and Raman Spectra, ch. V (from
 * memory).
 */
export function createBuiltInPartitionFunctionLookup(): PartitionFunctionLookup {
  const cache = new Map<string, PartitionFunction>()
  return (moleculeId: number, isotopologueId: number): PartitionFunction => {
    const key = `${moleculeId}/${isotopologueId}`
    let q = cache.get(key)
    if (q === undefined) {
      q = memoiseByTemperature(
        levelSumPartitionFunction(moleculeId, isotopologueId) ??
          defaultPartitionFunctionLookup(moleculeId, isotopologueId),
      )
      cache.set(key, q)
    }
    return q
  }
}

/** Most distinct temperatures remembered per function (a run has one per layer, plus 296 K). */
const MEMO_TEMPERATURES = 512

/**
 * Remembers Q(T) for the temperatures asked for: the level sums cost thousands of terms, and every
 * chunk of a run asks again for the same layer temperatures. Q is a pure function of T, so the
 * cached value is the same number bit for bit.
 */
function memoiseByTemperature(q: PartitionFunction): PartitionFunction {
  const values = new Map<number, number>()
  return (temperatureK: number): number => {
    let value = values.get(temperatureK)
    if (value === undefined) {
      value = q(temperatureK)
      if (values.size >= MEMO_TEMPERATURES) values.clear()
      values.set(temperatureK, value)
    }
    return value
  }
}
