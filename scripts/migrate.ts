// Applies pending database migrations (used by npm start and npm run migrate).
import { loadConfig } from '../server/config'
import { createSequelize } from '../server/db'
import { loadEnvFile } from '../server/env-file'
import { migrateUp } from '../server/migrator'

loadEnvFile()
const config = loadConfig()
const sequelize = createSequelize(config.databaseUrl)
try {
  const applied = await migrateUp(sequelize, (msg) => process.stderr.write(`[tauline] ${msg}\n`))
  process.stderr.write(`[tauline] database schema up to date (${applied.length} migration(s) applied now)\n`)
} finally {
  await sequelize.close()
}
