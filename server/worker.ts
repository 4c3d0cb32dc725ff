// A standalone chunk worker: `npm run worker`, on this or any machine that reaches DATABASE_URL.
import { loadConfig } from './config'
import { createSequelize } from './db'
import { loadEnvFile } from './env-file'
import { createLogger } from './logger'
import { initModels } from './models/index'
import { startRunSystem } from './runs/run-system'

async function main() {
  loadEnvFile()
  const config = loadConfig()
  const logger = createLogger(config.logLevel)
  const sequelize = createSequelize(config.databaseUrl)
  await sequelize.authenticate()
  initModels(sequelize)
  const system = await startRunSystem(config, sequelize, logger, config.runs.workerThreads)
  const stop = async (signal: string) => {
    logger.info(`${signal}: finishing the current chunks, then stopping`)
    await system.stop()
    await sequelize.close()
    process.exit(0)
  }
  process.on('SIGTERM', () => void stop('SIGTERM'))
  process.on('SIGINT', () => void stop('SIGINT'))
}

main().catch((err) => {
  process.stderr.write(`Tauline worker failed to start: ${err instanceof Error ? err.message : String(err)}\n`)
  process.exit(1)
})
