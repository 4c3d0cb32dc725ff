// Seeds the demo team (idempotent) and prints how to sign in.
import { loadConfig } from '../server/config'
import { createSequelize } from '../server/db'
import { DEMO_ORGANISATION } from '../server/demo/demo-team'
import { seedDemoTeam, seedDemoWorkspace } from '../server/demo/seed'
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
  }
} finally {
  await sequelize.close()
}
