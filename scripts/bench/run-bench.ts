// The benchmark runner behind `npm run bench` and `tauline bench`.
import { mkdirSync, writeFileSync } from 'node:fs'
import { cpus, totalmem } from 'node:os'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { ENGINE_VERSION } from '../../shared/version'
import { caseA, caseB, caseC, caseD, type BenchRow, type CaseOptions } from './cases'
import { loadBuiltInCatalogue } from './inputs'
import { caseF } from './api-latency-case'
import { caseE } from './parallel-case'
import { caseG } from './queue-case'
import { caseH } from './client-spectrum-case'

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..')

export const BENCH_CASES = ['A', 'B', 'C', 'D', 'E', 'F', 'G', 'H'] as const

export interface BenchArguments {
  quick: boolean
  cases: string[]
  /** Print the JSON record on stdout instead of the table. */
  json: boolean
}

/** Reads --quick, --cases A,D and --json; throws on an unknown case. */
export function parseBenchArguments(argv: string[]): BenchArguments {
  const quick = argv.includes('--quick')
  const json = argv.includes('--json')
  const index = argv.indexOf('--cases')
  const all: readonly string[] = BENCH_CASES
  const cases = index >= 0 && argv[index + 1] ? argv[index + 1].toUpperCase().split(',') : [...all]
  for (const name of cases) {
    if (!all.includes(name)) throw new Error(`unknown case '${name}' (${all.join(', ')})`)
  }
  return { quick, cases, json }
}

function formatNumber(value: number, digits = 3): string {
  if (!Number.isFinite(value) || value === 0) return value === 0 ? '0' : '—'
  if (Number.isInteger(value) && Math.abs(value) < 1e5) return String(value)
  const magnitude = Math.abs(value)
  if (magnitude >= 1e5 || magnitude < 1e-2) return value.toExponential(2)
  return value.toFixed(digits)
}

function table(rows: BenchRow[]): string {
  const header = [
    'case',
    'run',
    'wall s',
    'CPU s',
    'peak MiB',
    'points',
    'points/s',
    'pairs/s',
    'Voigt evals',
    'notes',
  ]
  const body = rows.map((r) => [
    r.case,
    r.label,
    r.measurement.wallS.toFixed(2),
    r.measurement.cpuS.toFixed(2),
    r.measurement.peakRssMiB.toFixed(0),
    String(r.measurement.gridPointCount),
    formatNumber(r.measurement.gridPointsPerS, 0),
    r.measurement.lineLayerPairs > 0 ? formatNumber(r.measurement.lineLayerPairsPerS, 0) : '—',
    formatNumber(r.measurement.voigtEvaluations, 0),
    Object.entries(r.notes)
      .map(([k, v]) => `${k}=${typeof v === 'number' ? formatNumber(v, 4) : v}`)
      .join(' '),
  ])
  const widths = header.map((h, c) => Math.max(h.length, ...body.map((row) => row[c].length)))
  const line = (cells: string[]) => cells.map((cell, c) => cell.padEnd(widths[c])).join('  ')
  return [line(header), line(widths.map((w) => '-'.repeat(w))), ...body.map(line)].join('\n')
}

/** Runs the chosen cases, prints the table (or the JSON record) and writes bench-results/. */
export async function runBench({ quick, cases, json }: BenchArguments): Promise<void> {
  const log = (line: string) => process.stderr.write(line + '\n')
  const catalogue = loadBuiltInCatalogue()
  log(
    `Tauline bench (${quick ? 'quick' : 'full'}), engine ${ENGINE_VERSION}, ${catalogue.table.length} lines, cases ${cases.join(',')}`,
  )
  const options: CaseOptions = { quick, catalogue, log }
  const runners: Record<string, (o: CaseOptions) => BenchRow[] | Promise<BenchRow[]>> = {
    A: caseA,
    B: caseB,
    C: caseC,
    D: caseD,
    E: caseE,
    F: caseF,
    G: caseG,
    H: caseH,
  }
  const rows: BenchRow[] = []
  for (const name of cases) {
    log(`case ${name}`)
    rows.push(...(await runners[name](options)))
  }
  if (!json) process.stdout.write(table(rows) + '\n')

  const startedAt = new Date()
  const record = {
    date: startedAt.toISOString(),
    quick,
    engineVersion: ENGINE_VERSION,
    node: process.version,
    cpu: cpus()[0]?.model ?? 'unknown',
    cpuCount: cpus().length,
    totalMemoryMiB: Math.round(totalmem() / 2 ** 20),
    catalogue: catalogue.header,
    processMaxRssMiB: process.resourceUsage().maxRSS / 1024,
    rows,
  }
  const directory = join(ROOT, 'bench-results')
  mkdirSync(directory, { recursive: true })
  const file = join(directory, `bench-${startedAt.toISOString().replace(/[:.]/g, '-')}.json`)
  writeFileSync(file, JSON.stringify(record, null, 2) + '\n')
  if (json) process.stdout.write(JSON.stringify(record, null, 2) + '\n')
  log(`wrote ${file}`)
}
