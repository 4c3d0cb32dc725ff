import type { Migration } from '../migrator'

// Run results (megabytes of JSON per run) and chunk payloads are compressed when stored. lz4
// does it about three times faster than PostgreSQL's default pglz for a slightly larger size:
// storing a 10–3000 cm⁻¹ run's 8 MB took 160–250 ms instead of 530–680 ms (docs/PERFORMANCE.md).
// Only values written from now on use it. A server built without lz4 (or older than
// PostgreSQL 14) keeps pglz: the choice changes speed, never the numbers.
const COLUMNS = [
  ['run_results', 'data'],
  ['run_results', 'detail'],
  ['run_chunks', 'result'],
] as const

async function lz4Available(q: { query: (sql: string) => Promise<unknown> }): Promise<boolean> {
  const [rows] = (await q.query(
    "SELECT 1 FROM pg_settings WHERE name = 'default_toast_compression' AND 'lz4' = ANY(enumvals)",
  )) as [unknown[], unknown]
  return rows.length > 0
}

export const up: Migration = async ({ context: qi }) => {
  const q = qi.sequelize
  if (!(await lz4Available(q))) return
  for (const [table, column] of COLUMNS) await q.query(`ALTER TABLE ${table} ALTER COLUMN ${column} SET COMPRESSION lz4`)
}

export const down: Migration = async ({ context: qi }) => {
  const q = qi.sequelize
  if (!(await lz4Available(q))) return
  for (const [table, column] of COLUMNS) await q.query(`ALTER TABLE ${table} ALTER COLUMN ${column} SET COMPRESSION pglz`)
}
