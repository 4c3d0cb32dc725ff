import { createHash } from 'node:crypto'
import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { parseCatalogue, type ParsedCatalogue } from '../../shared/catalogue/catalogue-file'
import { toLineTable, type LineTable } from '../../shared/physics/spectroscopy/line'

export const BUILTIN_CATALOGUE_ID = 'builtin'
const FILE = fileURLToPath(new URL('../../data/builtin-catalogue.json', import.meta.url))

export interface LoadedCatalogue {
  id: string
  checksum: string
  generatorVersion: string
  lineCount: number
  parsed: ParsedCatalogue
  table: LineTable
}

let cached: LoadedCatalogue | undefined

/** The built-in line catalogue (data/builtin-catalogue.json), checksum-verified, loaded once per process. */
export function loadBuiltInCatalogue(): LoadedCatalogue {
  if (cached) return cached
  const parsed = parseCatalogue(readFileSync(FILE, 'utf8'), {
    hash: (text) => createHash('sha256').update(text, 'utf8').digest('hex'),
  })
  cached = {
    id: BUILTIN_CATALOGUE_ID,
    checksum: parsed.header.checksum,
    generatorVersion: parsed.header.generatorVersion,
    lineCount: parsed.header.lineCount,
    parsed,
    table: toLineTable(parsed.lines),
  }
  return cached
}
