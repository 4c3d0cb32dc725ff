// Benchmark of the line-by-line engine (npm run bench [-- --quick] [-- --cases A,D]).
//
// Fixed cases (scripts/bench/cases.ts): A the realistic full-range run (mid-latitude summer, 60
// layers, 10–3000 cm⁻¹, the built-in catalogue), B line-count and layer scaling, C forcing and a
// concentration sweep, D brute force against the adaptive method on a narrow window. Every run is
// single-threaded (chunks in order, as computeRadiation). Reported per run: wall and CPU time,
// peak resident memory (sampled after every chunk, and the process maximum), (line, layer) pairs
// and grid points per second of wall time, Voigt evaluations, slowest chunk. The table goes to
// stdout and everything to bench-results/bench-<date>.json (git-ignored). --quick runs smaller
// versions of every case (a few minutes in all).
// Case F (scripts/bench/api-latency-case.ts) measures API latency instead: 50 signed-in clients
// against list and detail endpoints of the real app on a throwaway database; its rows give the
// server's CPU and memory, and the latency percentiles, requests/s and failures in the notes.
// Case G (scripts/bench/queue-case.ts) runs case A through the run queue on one and on two
// standalone worker processes; case H (scripts/bench/client-spectrum-case.ts) measures the run
// page in Chromium with 200 000-bin spectra and a 500 000-point full-resolution window.
import { mkdirSync, writeFileSync } from 'node:fs'
import { cpus, totalmem } from 'node:os'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { ENGINE_VERSION } from '../shared/version'
import { caseA, caseB, caseC, caseD, type BenchRow, type CaseOptions } from './bench/cases'
import { loadBuiltInCatalogue } from './bench/inputs'
import { caseF } from './bench/api-latency-case'
import { caseE } from './bench/parallel-case'
import { caseG } from './bench/queue-case'
import { caseH } from './bench/client-spectrum-case'

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..')

function parseArguments(argv: string[]): { quick: boolean; cases: string[] } {
  const quick = argv.includes('--quick')
  const index = argv.indexOf('--cases')
  const all = ['A', 'B', 'C', 'D', 'E', 'F', 'G', 'H']
  const cases = index >= 0 && argv[index + 1] ? argv[index + 1].toUpperCase().split(',') : all
  for (const name of cases) {
    if (!all.includes(name)) throw new Error(`unknown case '${name}' (${all.join(', ')})`)
  }
  return { quick, cases }
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

async function main(): Promise<void> {
  const { quick, cases } = parseArguments(process.argv.slice(2))
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
  process.stdout.write(table(rows) + '\n')

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
  log(`wrote ${file}`)
}

await main()
