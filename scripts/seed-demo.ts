// Seeds the demo team (idempotent) and prints how to sign in.
import { loadConfig } from '../server/config'
import { createSequelize } from '../server/db'
import { DEMO_ORGANISATION } from '../server/demo/demo-team'
import { seedDemoSweep } from '../server/demo/demo-sweep'
import { seedDemoTeam, seedDemoWorkspace } from '../server/demo/seed'
import { createLogger } from '../server/logger'
import { createRunQueue } from '../server/runs/run-queue'
import { loadEnvFile } from '../server/env-file'
import { initModels } from '../server/models/index'

loadEnvFile()
const config = loadConfig()
const sequelize = createSequelize(config.databaseUrl)
initModels(sequelize)
try {
  if (!config.seedDemo) {
    process.stderr.write('[tauline] SEED_DEMO=false: no demo data\n')
  } else {
    const { created } = await seedDemoTeam(config.demoPassword)
    process.stderr.write(`[tauline] demo team of ${DEMO_ORGANISATION}: ${created} account(s) created\n`)
    const workspace = await seedDemoWorkspace()
    process.stderr.write(`[tauline] demo workspace: ${workspace.profiles} profile(s), ${workspace.mixtures} mixture(s) created\n`)
    // The demo's first computation goes into the queue; the app computes it once it is up.
    const queue = await createRunQueue({ databaseUrl: config.databaseUrl, logger: createLogger('warn') })
    try {
      const queued = await seedDemoSweep(sequelize, queue)
      if (queued > 0) process.stderr.write(`[tauline] demo sweep of ${queued} CO₂ amounts queued; the app computes it after start\n`)
    } finally {
      await queue.stop()
    }
  }
} finally {
  await sequelize.close()
}
