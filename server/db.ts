import { Sequelize } from 'sequelize'
import pg from 'pg'

/** One Sequelize instance per process; PostgreSQL only. */
export function createSequelize(databaseUrl: string, logSql = false): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: logSql ? (sql) => process.stderr.write(`${sql}\n`) : false,
    pool: { max: 10, min: 0, idle: 10_000 },
    define: { underscored: true },
  })
}

/** A plain pg pool for the session store (connect-pg-simple wants one). */
export function createPgPool(
  databaseUrl: string,
  onIdleError: (err: Error) => void = () => {},
  max = 5,
): pg.Pool {
  const pool = new pg.Pool({ connectionString: databaseUrl, max })
  // An idle connection the server closes (a restart, a dropped database) is discarded by the
  // pool; without a listener its 'error' event would end the process.
  pool.on('error', onIdleError)
  return pool
}
