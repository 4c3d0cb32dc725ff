import { fileURLToPath } from 'node:url'
import { createApp } from './app'
import { loadConfig } from './config'
import { createPgPool, createSequelize } from './db'
import { loadEnvFile } from './env-file'
import { createLogger } from './logger'
import { initModels } from './models/index'
import { createMigrator } from './migrator'
import { startRunSystem } from './runs/run-system'

/** Boots the server: validates settings, checks the database, refuses to run on a stale schema. */
async function main() {
  loadEnvFile()
  const config = loadConfig()
  const logger = createLogger(config.logLevel)
  const sequelize = createSequelize(config.databaseUrl)
  await sequelize.authenticate()
  initModels(sequelize)
  const pending = await createMigrator(sequelize).pending()
  if (pending.length > 0) {
    throw new Error(`Database has ${pending.length} pending migration(s); run npm run migrate first.`)
  }
  const sessionPool = createPgPool(config.databaseUrl, (err) => logger.warn(`session database connection closed: ${err.message}`))
  const clientDistDir = fileURLToPath(new URL('../dist', import.meta.url))
  const runSystem = await startRunSystem(config, sequelize, logger)
  const app = createApp({ config, sequelize, sessionPool, logger, clientDistDir, getRunQueue: () => runSystem.queue })
  const server = app.listen(config.port, config.host, () => {
    logger.info(`Tauline is serving http://${config.host}:${config.port}`)
  })

  const shutdown = (signal: string) => {
    logger.info(`${signal}: shutting down`)
    server.close(() => {
      runSystem
        .stop()
        .then(() => Promise.all([sequelize.close(), sessionPool.end()]))
        .finally(() => process.exit(0))
    })
    setTimeout(() => process.exit(1), 10_000).unref()
  }
  process.on('SIGTERM', () => shutdown('SIGTERM'))
  process.on('SIGINT', () => shutdown('SIGINT'))
}

main().catch((err) => {
  process.stderr.write(`Tauline failed to start: ${err instanceof Error ? err.message : String(err)}\n`)
  process.exit(1)
})
