import { randomBytes } from 'node:crypto'
import pg from 'pg'
import { inject } from 'vitest'

/** A fresh database cloned from the migrated template of this test project; drop() removes it. */
export async function createTestDatabase(): Promise<{ url: string; drop: () => Promise<void> }> {
  const adminUrl = inject('pgAdminUrl')
  const template = inject('pgTemplate')
  const name = `tauline_t_${randomBytes(6).toString('hex')}`
  const admin = new pg.Client({ connectionString: adminUrl })
  await admin.connect()
  await admin.query(`CREATE DATABASE ${name} TEMPLATE ${template}`)
  await admin.end()
  return {
    url: adminUrl.replace(/\/[^/]*$/, `/${name}`),
    drop: async () => {
      const c = new pg.Client({ connectionString: adminUrl })
      await c.connect()
      await c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`)
      await c.end()
    },
  }
}
