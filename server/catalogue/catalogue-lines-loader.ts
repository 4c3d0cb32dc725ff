/**
 * Loads the lines a run computes with, in a worker thread: the built-in catalogue from its file,
 * or an imported catalogue's blocks through a plain pg connection (no Sequelize models in worker
 * threads), verified against the checksum the run recorded and cached by that checksum.
 */
import { createHash } from 'node:crypto'
import pg from 'pg'
import { createLineTable, type LineTable } from '../../shared/physics/spectroscopy/line'
import type { RunInputs } from '../../shared/schemas/runs'
import { BUILTIN_CATALOGUE_ID, loadBuiltInCatalogue } from './builtin-catalogue'
import { runCatalogueChecksum } from './catalogue-checksum'
import { decodeBlockInto } from './line-block-codec'
import { mergeWithBuiltIn, sortedByWavenumber } from './line-table-ops'
import type { WorkerDatabase } from './worker-database'

/** The catalogue is gone or differs from the run's record: retrying cannot help. */
export class CatalogueUnavailableError extends Error {
  readonly code = 'CATALOGUE_UNAVAILABLE'
}

/** An imported catalogue's own lines (not merged), sorted by wavenumber, and its stored settings. */
export interface LoadedImportedLines {
  table: LineTable
  checksum: string
  mergeWithBuiltIn: boolean
}

/** Reads every block of an imported catalogue; checks line counts and the data checksum. */
export async function readImportedLines(
  database: WorkerDatabase,
  catalogueId: number,
): Promise<LoadedImportedLines> {
  const client = new pg.Client(database)
  await client.connect()
  try {
    const head = await client.query<{
      checksum: string
      merge_with_builtin: boolean
      line_count: number
      block_count: number
    }>(
      'SELECT checksum, merge_with_builtin, line_count, block_count FROM line_catalogues WHERE id = $1',
      [catalogueId],
    )
    const row = head.rows[0]
    if (!row) throw new CatalogueUnavailableError(`line catalogue ${catalogueId} no longer exists`)
    const table = createLineTable(row.line_count)
    const hash = createHash('sha256')
    let filled = 0
    // One block per query keeps the memory peak at one block besides the table.
    for (let b = 0; b < row.block_count; b++) {
      const block = await client.query<{ data: Buffer }>(
        'SELECT data FROM catalogue_line_blocks WHERE catalogue_id = $1 AND block_index = $2',
        [catalogueId, b],
      )
      const data = block.rows[0]?.data
      if (!data)
        throw new CatalogueUnavailableError(`line catalogue ${catalogueId} lacks block ${b}`)
      hash.update(data)
      if (filled + (data.readUInt32LE(4) >>> 0) > table.length)
        throw new CatalogueUnavailableError(
          `line catalogue ${catalogueId} holds more lines than it records`,
        )
      filled += decodeBlockInto(data, table, filled)
    }
    const checksum = `sha256:${hash.digest('hex')}`
    if (filled !== table.length || checksum !== row.checksum) {
      throw new CatalogueUnavailableError(
        `line catalogue ${catalogueId}: stored lines do not match its checksum`,
      )
    }
    return { table: sortedByWavenumber(table), checksum, mergeWithBuiltIn: row.merge_with_builtin }
  } finally {
    await client.end()
  }
}

// Line tables of imported catalogues by run checksum; a few, since each can hold a million lines.
const tablesByChecksum = new Map<string, LineTable>()
const MAX_CACHED_TABLES = 2

/**
 * The line table of a run's catalogue. Built-in: the process's copy, whose checksum must match.
 * Imported: loaded from the database on first use, merged with the built-in lines when the
 * catalogue says so, and refused (CatalogueUnavailableError) unless it matches the run's checksum.
 */
export async function loadRunCatalogueTable(
  catalogue: RunInputs['catalogue'],
  database: WorkerDatabase | undefined,
): Promise<LineTable> {
  const builtIn = loadBuiltInCatalogue()
  if (catalogue.id === BUILTIN_CATALOGUE_ID) {
    if (builtIn.checksum !== catalogue.checksum) {
      throw new Error(
        'the built-in catalogue on this worker differs from the one the run was submitted with',
      )
    }
    return builtIn.table
  }
  const cached = tablesByChecksum.get(catalogue.checksum)
  if (cached) return cached
  const id = Number(catalogue.id)
  if (!Number.isInteger(id) || id <= 0)
    throw new CatalogueUnavailableError(`unknown catalogue ${catalogue.id}`)
  if (!database)
    throw new Error('the chunk task carries no database connection for the imported catalogue')
  const loaded = await readImportedLines(database, id)
  const checksum = runCatalogueChecksum(
    loaded.checksum,
    loaded.mergeWithBuiltIn ? builtIn.checksum : null,
  )
  if (checksum !== catalogue.checksum) {
    throw new CatalogueUnavailableError(
      `line catalogue ${id} differs from the one the run was submitted with`,
    )
  }
  const table = loaded.mergeWithBuiltIn
    ? mergeWithBuiltIn(builtIn.table, loaded.table)
    : loaded.table
  tablesByChecksum.set(catalogue.checksum, table)
  if (tablesByChecksum.size > MAX_CACHED_TABLES)
    tablesByChecksum.delete(tablesByChecksum.keys().next().value!)
  return table
}
