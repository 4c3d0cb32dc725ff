// Generates the built-in line catalogue file data/builtin-catalogue.json from the constants tables
// in shared/catalogue and prints a summary table. Deterministic: running it twice writes the same
// bytes. Usage: node --import tsx scripts/generate-catalogue.ts [--check]
//   --check  do not write; exit 1 when the committed file differs from a fresh build.
import { createHash } from 'node:crypto'
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { buildBuiltInCatalogue, parseCatalogue, serialiseCatalogue } from '../shared/catalogue'

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..')
const BUILT_IN_CATALOGUE_PATH = join(ROOT, 'data', 'builtin-catalogue.json')

const catalogue = buildBuiltInCatalogue()
const text = serialiseCatalogue(catalogue)

// Cross-check the pure-TS SHA-256 of the file against node:crypto.
const parsed = parseCatalogue(text, {
  hash: (body) => createHash('sha256').update(body, 'utf8').digest('hex'),
})

const rows = catalogue.bands.map((band) => [
  band.id,
  String(band.lineCount),
  `${band.minWavenumberCm.toFixed(2)}–${band.maxWavenumberCm.toFixed(2)}`,
  band.intensitySumCmPerMolecule.toExponential(4),
  band.publishedBandIntensityCmPerMolecule?.toExponential(4) ?? '—',
  band.confidence ?? '—',
])
const header = ['band', 'lines', 'range cm⁻¹', 'ΣS cm/molec', 'S_band', 'tag']
const widths = header.map((h, c) => Math.max(h.length, ...rows.map((r) => r[c].length)))
const format = (r: string[]) => r.map((cell, c) => cell.padEnd(widths[c])).join('  ')
const out = [format(header), format(widths.map((w) => '-'.repeat(w))), ...rows.map(format)]
out.push(
  '',
  `${parsed.header.lineCount} lines, ${parsed.header.bandCount} bands, generator ${parsed.header.generatorVersion}, ${(Buffer.byteLength(text) / 1024).toFixed(0)} KiB, ${parsed.header.checksum}`,
)
process.stdout.write(out.join('\n') + '\n')

if (process.argv.includes('--check')) {
  const committed = existsSync(BUILT_IN_CATALOGUE_PATH)
    ? readFileSync(BUILT_IN_CATALOGUE_PATH, 'utf8')
    : ''
  if (committed !== text) {
    process.stderr.write(`${BUILT_IN_CATALOGUE_PATH} is stale: run scripts/generate-catalogue.ts\n`)
    process.exit(1)
  }
  process.stdout.write(`${BUILT_IN_CATALOGUE_PATH} is up to date\n`)
} else {
  mkdirSync(dirname(BUILT_IN_CATALOGUE_PATH), { recursive: true })
  writeFileSync(BUILT_IN_CATALOGUE_PATH, text)
  process.stdout.write(`wrote ${BUILT_IN_CATALOGUE_PATH}\n`)
}
