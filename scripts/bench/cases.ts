// The fixed benchmark cases. Each returns rows for the table and a JSON record.
//
// A  realistic run: mid-latitude summer, 60 layers to 10 Pa, 10–3000 cm⁻¹, every gas of the
//    built-in catalogue, default settings (adaptive method), fluxes at every level and OLR spectrum.
// B  scaling on a sub-range: the catalogue ×1, ×4, ×16 (lines duplicated at small offsets, S/k),
//    and 30 / 60 / 120 layers.
// C  forcing and sweep on a sub-range: CO₂ ×1 and ×2 (two runs, compareRuns), and a CO₂ sweep
//    of 8 runs.
// D  brute force against the adaptive method on a narrow window: speed ratio and the flux and
//    heating-rate errors (the brute-force 'reference' method sums every line at every point of a
//    uniform grid of a quarter of the narrowest half width); the engine's previous fast path
//    ('uniform': same grid, multi-level optics) is timed too.
import { compareRuns } from '../../shared/physics/engine'
import type { ComputeSettings } from '../../shared/physics/engine'
import type { LineTable } from '../../shared/physics/spectroscopy/line'
import type { AtmosphereProfile } from '../../shared/physics/types'
import { midLatitudeSummer, scaledCatalogue, withCo2Scaled, type Catalogue } from './inputs'
import { compareResults, measureRun, type RunMeasurement } from './measure'

export interface BenchRow {
  case: string
  label: string
  measurement: RunMeasurement
  notes: Record<string, number | string>
}

export interface CaseOptions {
  quick: boolean
  catalogue: Catalogue
  log: (line: string) => void
}

function run(
  label: string,
  caseName: string,
  profile: AtmosphereProfile,
  lines: LineTable,
  settings: Partial<ComputeSettings>,
  options: CaseOptions,
  notes: (
    r: ReturnType<typeof measureRun>['result'],
  ) => Record<string, number | string> = () => ({}),
): { row: BenchRow; result: ReturnType<typeof measureRun>['result'] } {
  options.log(`  ${caseName}: ${label} …`)
  const { result, measurement } = measureRun(profile, lines, settings)
  const row = { case: caseName, label, measurement, notes: notes(result) }
  options.log(
    `    ${measurement.wallS.toFixed(2)} s wall, ${measurement.cpuS.toFixed(2)} s CPU, ${measurement.peakRssMiB.toFixed(0)} MiB`,
  )
  return { row, result }
}

/** Case A: the realistic full-range run (quick: 600–1100 cm⁻¹). */
export function caseA(options: CaseOptions): BenchRow[] {
  const range = options.quick ? { startCm: 600, endCm: 1100 } : { startCm: 10, endCm: 3000 }
  const profile = midLatitudeSummer(60)
  const { row } = run(
    `MLS 60 layers, ${range.startCm}–${range.endCm} cm⁻¹, ${options.catalogue.table.length} lines`,
    'A',
    profile,
    options.catalogue.table,
    range,
    options,
    (r) => ({
      olrWPerM2: r.olrWPerM2,
      surfaceDownWPerM2: r.surfaceDownWPerM2,
      maxHeatingRateKPerDay: Math.max(...Array.from(r.heatingRateKPerDay, Math.abs)),
      bins: r.wavenumberCm.length,
    }),
  )
  return [row]
}

/** Case B: line-count and layer scaling on a sub-range. */
export function caseB(options: CaseOptions): BenchRow[] {
  const range = options.quick ? { startCm: 990, endCm: 1010 } : { startCm: 960, endCm: 1040 }
  const rows: BenchRow[] = []
  const profile = midLatitudeSummer(60)
  for (const factor of options.quick ? [1, 4] : [1, 4, 16]) {
    const lines = scaledCatalogue(options.catalogue.lines, factor)
    rows.push(
      run(
        `lines ×${factor} (${lines.length}), 60 layers, ${range.startCm}–${range.endCm}`,
        'B',
        profile,
        lines,
        range,
        options,
        () => ({ lineFactor: factor }),
      ).row,
    )
  }
  const layerRange = options.quick ? { startCm: 660, endCm: 680 } : { startCm: 600, endCm: 700 }
  for (const layers of options.quick ? [30, 60] : [30, 60, 120]) {
    rows.push(
      run(
        `${layers} layers, lines ×1, ${layerRange.startCm}–${layerRange.endCm}`,
        'B',
        midLatitudeSummer(layers),
        options.catalogue.table,
        layerRange,
        options,
        () => ({ layers }),
      ).row,
    )
  }
  return rows
}

/** Case C: forcing of doubled CO₂ (two runs) and a CO₂ sweep (8 runs) on a sub-range. */
export function caseC(options: CaseOptions): BenchRow[] {
  const range = options.quick ? { startCm: 640, endCm: 700 } : { startCm: 500, endCm: 850 }
  const profile = midLatitudeSummer(60)
  const rows: BenchRow[] = []
  const before = run(
    `CO₂ ×1, ${range.startCm}–${range.endCm}`,
    'C',
    profile,
    options.catalogue.table,
    range,
    options,
  )
  const after = run(
    `CO₂ ×2, ${range.startCm}–${range.endCm}`,
    'C',
    withCo2Scaled(profile, 2),
    options.catalogue.table,
    range,
    options,
  )
  const forcing = compareRuns(before.result, after.result)
  after.row.notes = {
    toaForcingWPerM2: forcing.toaWPerM2,
    tropopauseForcingWPerM2: forcing.tropopauseWPerM2,
    surfaceForcingWPerM2: forcing.surfaceWPerM2,
  }
  rows.push(before.row, after.row)
  const sweepRange = options.quick ? { startCm: 660, endCm: 680 } : { startCm: 600, endCm: 750 }
  const factors = options.quick ? [0.5, 2] : [0.25, 0.5, 1, 1.5, 2, 4, 8, 16]
  let wallS = 0
  let cpuS = 0
  let peak = 0
  let points = 0
  let pairs = 0
  let evaluations = 0
  const olr: number[] = []
  for (const factor of factors) {
    const r = run(
      `sweep CO₂ ×${factor}`,
      'C',
      withCo2Scaled(profile, factor),
      options.catalogue.table,
      sweepRange,
      options,
    )
    wallS += r.row.measurement.wallS
    cpuS += r.row.measurement.cpuS
    peak = Math.max(peak, r.row.measurement.peakRssMiB)
    points += r.row.measurement.gridPointCount
    pairs += r.row.measurement.lineLayerPairs
    evaluations += r.row.measurement.voigtEvaluations
    olr.push(r.result.olrWPerM2)
  }
  rows.push({
    case: 'C',
    label: `sweep of ${factors.length} CO₂ amounts, ${sweepRange.startCm}–${sweepRange.endCm}`,
    measurement: {
      wallS,
      cpuS,
      peakRssMiB: peak,
      chunkCount: 0,
      gridPointCount: points,
      lineLayerPairs: pairs,
      voigtEvaluations: evaluations,
      lineLayerPairsPerS: pairs / wallS,
      gridPointsPerS: points / wallS,
      slowestChunk: { startCm: NaN, cpuS: NaN },
    },
    notes: { co2Factors: factors.join(' '), olrWPerM2: olr.map((v) => v.toFixed(4)).join(' ') },
  })
  return rows
}

/** Case D: brute force ('reference'), previous fast path ('uniform') and adaptive on one window. */
export function caseD(options: CaseOptions): BenchRow[] {
  const window = options.quick
    ? { startCm: 667, endCm: 668, chunkWidthCm: 1 }
    : { startCm: 666, endCm: 669, chunkWidthCm: 1 }
  const layers = options.quick ? 10 : 20
  const profile = midLatitudeSummer(layers)
  const label = `${layers} layers, ${window.startCm}–${window.endCm} cm⁻¹, all lines, cutoff 25 cm⁻¹`
  const reference = run(
    `reference (brute force), ${label}`,
    'D',
    profile,
    options.catalogue.table,
    { ...window, spectralMethod: 'reference' },
    options,
  )
  const uniform = run(
    `uniform (previous fast path), ${label}`,
    'D',
    profile,
    options.catalogue.table,
    { ...window, spectralMethod: 'uniform' },
    options,
  )
  const adaptive = run(
    `adaptive, ${label}`,
    'D',
    profile,
    options.catalogue.table,
    { ...window, spectralMethod: 'adaptive' },
    options,
  )
  const width = window.endCm - window.startCm
  for (const r of [uniform, adaptive]) {
    const errors = compareResults(r.result, reference.result)
    r.row.notes = {
      speedupOverReference: reference.row.measurement.wallS / r.row.measurement.wallS,
      maxFluxErrorWPerM2: errors.maxFluxErrorWPerM2,
      fluxTolerance: (0.05 * width) / 2990,
      olrErrorWPerM2: errors.olrErrorWPerM2,
      maxHeatingErrorKPerDay: errors.maxHeatingErrorKPerDay,
    }
  }
  return [reference.row, uniform.row, adaptive.row]
}
