import type { Migration } from '../migrator'

// Run results and chunk payloads are written once and read whole, never queried inside: plain
// `json` (the text as written) spares PostgreSQL the parse into `jsonb` on every write and the
// conversion back to text on every read (≈ 200 ms for a 10–3000 cm⁻¹ run's 7.5 MB).
export const up: Migration = async ({ context: qi }) => {
  const q = qi.sequelize
  await q.query('ALTER TABLE run_results ALTER COLUMN data TYPE json USING data::json')
  await q.query('ALTER TABLE run_results ALTER COLUMN detail TYPE json USING detail::json')
  await q.query('ALTER TABLE run_chunks ALTER COLUMN result TYPE json USING result::json')
}

export const down: Migration = async ({ context: qi }) => {
  const q = qi.sequelize
  await q.query('ALTER TABLE run_results ALTER COLUMN data TYPE jsonb USING data::jsonb')
  await q.query('ALTER TABLE run_results ALTER COLUMN detail TYPE jsonb USING detail::jsonb')
  await q.query('ALTER TABLE run_chunks ALTER COLUMN result TYPE jsonb USING result::jsonb')
}
