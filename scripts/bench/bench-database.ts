// A throwaway database for the cases that need the app's PostgreSQL: a fresh database on
// DATABASE_URL's cluster when set, else a temporary cluster from scripts/pg-temp.sh that is
// removed afterwards.
import { execFileSync } from 'node:child_process'
import { randomBytes } from 'node:crypto'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import pg from 'pg'

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..')

export interface BenchDatabase {
  url: string
  /** The temporary cluster's folder, when this benchmark started one. */
  clusterDir?: string
  drop(): Promise<void>
}

export async function createBenchDatabase(log: (line: string) => void): Promise<BenchDatabase> {
  let adminUrl = process.env.DATABASE_URL
  let clusterDir: string | undefined
  if (!adminUrl) {
    const out = execFileSync('bash', [join(ROOT, 'scripts/pg-temp.sh'), 'start'], {
      encoding: 'utf8',
    })
    const vars = Object.fromEntries(
      [...out.matchAll(/export (\w+)=(\S+)/g)].map((m) => [m[1], m[2]]),
    )
    adminUrl = vars.TAULINE_TEST_PG_URL
    clusterDir = vars.TAULINE_TEST_PG_DIR
    log(`    temporary PostgreSQL in ${clusterDir}`)
  }
  const stopCluster = () => {
    if (clusterDir) execFileSync('bash', [join(ROOT, 'scripts/pg-temp.sh'), 'stop', clusterDir])
  }
  const name = `tauline_bench_${randomBytes(5).toString('hex')}`
  const admin = new pg.Client({ connectionString: adminUrl })
  try {
    await admin.connect()
    await admin.query(`CREATE DATABASE ${name}`)
  } catch (err) {
    stopCluster()
    throw err
  } finally {
    await admin.end()
  }
  return {
    url: adminUrl.replace(/\/[^/]*$/, `/${name}`),
    clusterDir,
    drop: async () => {
      try {
        const c = new pg.Client({ connectionString: adminUrl })
        await c.connect()
        await c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`)
        await c.end()
      } finally {
        stopCluster()
      }
    },
  }
}
