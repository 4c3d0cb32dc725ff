import { execFileSync } from 'node:child_process'
import pg from 'pg'
import type { TestProject } from 'vitest/node'
import { createSequelize } from '../../server/db'
import { migrateUp } from '../../server/migrator'

/**
 * Once per test project: make sure a throwaway cluster exists (scripts/test.sh starts one; a bare
 * `vitest` run starts its own here), then build a migrated template database that every test file
 * clones, so files never share rows and never touch the demo data.
 */
export default async function setup(project: TestProject) {
  let ownClusterDir: string | undefined
  if (!process.env.TAULINE_TEST_PG_URL) {
    const out = execFileSync('bash', ['scripts/pg-temp.sh', 'start'], { encoding: 'utf8' })
    for (const m of out.matchAll(/export (\w+)=(\S+)/g)) process.env[m[1]] = m[2]
    ownClusterDir = process.env.TAULINE_TEST_PG_DIR
  }
  const adminUrl = process.env.TAULINE_TEST_PG_URL!
  const template = `tauline_tpl_${project.name.replace(/\W/g, '_')}`
  const client = new pg.Client({ connectionString: adminUrl })
  await client.connect()
  await client.query(`DROP DATABASE IF EXISTS ${template}`)
  await client.query(`CREATE DATABASE ${template}`)
  await client.end()

  const sequelize = createSequelize(adminUrl.replace(/\/[^/]*$/, `/${template}`))
  await migrateUp(sequelize)
  await sequelize.close()

  project.provide('pgAdminUrl', adminUrl)
  project.provide('pgTemplate', template)

  return async () => {
    if (ownClusterDir) execFileSync('bash', ['scripts/pg-temp.sh', 'stop', ownClusterDir])
  }
}

declare module 'vitest' {
  export interface ProvidedContext {
    pgAdminUrl: string
    pgTemplate: string
  }
}
