import type { Express } from 'express'
import type pg from 'pg'
import type { Sequelize } from 'sequelize'
import { createApp } from '../../server/app'
import { loadConfig, type AppConfig } from '../../server/config'
import { createPgPool, createSequelize } from '../../server/db'
import { createLogger } from '../../server/logger'
import { initModels } from '../../server/models/index'
import { seedDemoTeam, seedDemoWorkspace } from '../../server/demo/seed'
import { DEMO_TEAM } from '../../server/demo/demo-team'
import type { Role } from '../../shared/schemas/auth'
import { startRunSystem, type RunSystem } from '../../server/runs/run-system'
import { createTestDatabase } from './database'

export const TEST_PASSWORD = 'test-password-123'

export interface TestApp {
  app: Express
  config: AppConfig
  sequelize: Sequelize
  sessionPool: pg.Pool
  /** The demo account of a role, with the test password. */
  account: (role: Role) => { email: string; password: string }
  /** The run queue and workers, when started with `runs`. */
  runSystem?: RunSystem
  close: () => Promise<void>
}

/** An app on its own fresh database with the demo team seeded (password TEST_PASSWORD). */
export async function createTestApp(
  options: {
    env?: Record<string, string>
    clientDistDir?: string
    /** Start the run queue with this many chunk threads in-process (0 = queue only). */
    runs?: { threads: number }
    /** Also seed the demo profiles, soundings and mixtures. */
    seedWorkspace?: boolean
  } = {},
): Promise<TestApp> {
  const db = await createTestDatabase()
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: db.url,
    SESSION_SECRET: 'test-session-secret-0123456789',
    COOKIE_SECURE: 'false',
    LOG_LEVEL: 'silent',
    ...options.env,
  })
  const sequelize = createSequelize(config.databaseUrl)
  initModels(sequelize)
  await seedDemoTeam(TEST_PASSWORD)
  if (options.seedWorkspace) await seedDemoWorkspace()
  const sessionPool = createPgPool(config.databaseUrl)
  const logger = createLogger('silent')
  const runSystem = options.runs ? await startRunSystem(config, sequelize, logger, options.runs.threads) : undefined
  const app = createApp({
    config,
    sequelize,
    sessionPool,
    logger,
    clientDistDir: options.clientDistDir,
    getRunQueue: () => runSystem?.queue,
  })
  return {
    app,
    config,
    sequelize,
    sessionPool,
    account: (role) => ({ email: DEMO_TEAM.find((m) => m.role === role)!.email, password: TEST_PASSWORD }),
    runSystem,
    close: async () => {
      await runSystem?.stop()
      await sequelize.close()
      await sessionPool.end()
      await db.drop()
    },
  }
}
