// The fixed benchmark cases. Each returns rows for the table and a JSON record.
//
// A  realistic run: mid-latitude summer, 60 layers to 10 Pa, 10–3000 cm⁻¹, every gas of the
//    built-in catalogue, default settings (adaptive method), fluxes at every level and OLR spectrum.
// B  scaling on a sub-range: the catalogue ×1, ×4, ×16 (lines duplicated at small offsets, S/k),
//    and 30 / 60 / 120 layers.
// C  forcing and sweep on sub-ranges: CO₂ ×1 and ×2 (compareRuns), and a CO₂ sweep of 8
//    amounts, each as independent runs and computed together (shared optics), with the speed-up
//    and the largest differences between the two.
// D  brute force against the adaptive method on a narrow window: speed ratio and the flux and
//    heating-rate errors (the brute-force 'reference' method sums every line at every point of a
//    uniform grid of a quarter of the narrowest half width); the engine's previous fast path
//    ('uniform': same grid, multi-level optics) is timed too.
import { compareRuns } from '../../shared/physics/engine'
import type { ComputeSettings, RadiationResult } from '../../shared/physics/engine'
import type { LineTable } from '../../shared/physics/spectroscopy/line'
import type { AtmosphereProfile } from '../../shared/physics/types'
import { midLatitudeSummer, scaledCatalogue, withCo2Scaled, type Catalogue } from './inputs'
import { compareResults, measureRun, measureSweep, type RunMeasurement } from './measure'

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

/** Largest flux and heating-rate differences of each sweep member from its own run. */
function sweepAgreement(together: readonly RadiationResult[], alone: readonly RadiationResult[]) {
  let flux = 0
  let heating = 0
  together.forEach((member, m) => {
    const d = compareResults(member, alone[m])
    flux = Math.max(flux, d.maxFluxErrorWPerM2)
    heating = Math.max(heating, d.maxHeatingErrorKPerDay)
  })
  return { maxFluxDifferenceWPerM2: flux, maxHeatingDifferenceKPerDay: heating }
}

/** Sums the measurements of runs done one after the other. */
function totalOf(measurements: readonly RunMeasurement[]): RunMeasurement {
  const sum = (pick: (m: RunMeasurement) => number) => measurements.reduce((s, m) => s + pick(m), 0)
  const wallS = sum((m) => m.wallS)
  return {
    wallS,
    cpuS: sum((m) => m.cpuS),
    peakRssMiB: Math.max(...measurements.map((m) => m.peakRssMiB)),
    chunkCount: sum((m) => m.chunkCount),
    gridPointCount: sum((m) => m.gridPointCount),
    lineLayerPairs: sum((m) => m.lineLayerPairs),
    voigtEvaluations: sum((m) => m.voigtEvaluations),
    lineLayerPairsPerS: sum((m) => m.lineLayerPairs) / wallS,
    gridPointsPerS: sum((m) => m.gridPointCount) / wallS,
    slowestChunk: { startCm: NaN, cpuS: NaN },
  }
}

/**
 * Case C: forcing of doubled CO₂ and an 8-amount CO₂ sweep on sub-ranges, each computed twice —
 * as independent runs and with the members together (engine/compute-sweep.ts) — with the speed
 * ratio and the largest differences between the two.
 */
export function caseC(options: CaseOptions): BenchRow[] {
  const range = options.quick ? { startCm: 640, endCm: 700 } : { startCm: 500, endCm: 850 }
  const profile = midLatitudeSummer(60)
  const rows: BenchRow[] = []
  const pair = [profile, withCo2Scaled(profile, 2)]
  const alone = pair.map((p, i) =>
    run(`CO₂ ×${i + 1}, ${range.startCm}–${range.endCm}`, 'C', p, options.catalogue.table, range, options),
  )
  const forcing = compareRuns(alone[0].result, alone[1].result)
  alone[1].row.notes = {
    toaForcingWPerM2: forcing.toaWPerM2,
    tropopauseForcingWPerM2: forcing.tropopauseWPerM2,
    surfaceForcingWPerM2: forcing.surfaceWPerM2,
  }
  rows.push(alone[0].row, alone[1].row)
  options.log(`  C: CO₂ ×1 and ×2 together …`)
  const together = measureSweep(pair, options.catalogue.table, range, 'CO2')
  const forcingTogether = compareRuns(together.results[0], together.results[1])
  rows.push({
    case: 'C',
    label: `CO₂ ×1 and ×2 together, ${range.startCm}–${range.endCm}`,
    measurement: together.measurement,
    notes: {
      toaForcingWPerM2: forcingTogether.toaWPerM2,
      toaForcingDifferenceWPerM2: forcingTogether.toaWPerM2 - forcing.toaWPerM2,
      speedUpOverIndependent:
        (alone[0].row.measurement.wallS + alone[1].row.measurement.wallS) / together.measurement.wallS,
      ...sweepAgreement(together.results, [alone[0].result, alone[1].result]),
    },
  })
  options.log(`    ${together.measurement.wallS.toFixed(2)} s wall`)

  const sweepRange = options.quick ? { startCm: 660, endCm: 680 } : { startCm: 600, endCm: 750 }
  const factors = options.quick ? [0.5, 2] : [0.25, 0.5, 1, 1.5, 2, 4, 8, 16]
  const profiles = factors.map((factor) => withCo2Scaled(profile, factor))
  const members = profiles.map((p, m) =>
    run(`sweep CO₂ ×${factors[m]}`, 'C', p, options.catalogue.table, sweepRange, options),
  )
  const label = `sweep of ${factors.length} CO₂ amounts, ${sweepRange.startCm}–${sweepRange.endCm}`
  const independent = totalOf(members.map((m) => m.row.measurement))
  rows.push({
    case: 'C',
    label: `${label}, independent runs`,
    measurement: independent,
    notes: {
      co2Factors: factors.join(' '),
      olrWPerM2: members.map((m) => m.result.olrWPerM2.toFixed(4)).join(' '),
    },
  })
  options.log(`  C: ${label} together …`)
  const sweep = measureSweep(profiles, options.catalogue.table, sweepRange, 'CO2')
  rows.push({
    case: 'C',
    label: `${label}, together`,
    measurement: sweep.measurement,
    notes: {
      co2Factors: factors.join(' '),
      olrWPerM2: sweep.results.map((r) => r.olrWPerM2.toFixed(4)).join(' '),
      speedUpOverIndependent: independent.wallS / sweep.measurement.wallS,
      ...sweepAgreement(
        sweep.results,
        members.map((m) => m.result),
      ),
    },
  })
  options.log(`    ${sweep.measurement.wallS.toFixed(2)} s wall`)
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
