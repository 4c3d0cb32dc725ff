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
export function createPgPool(databaseUrl: string, max = 5): pg.Pool {
  return new pg.Pool({ connectionString: databaseUrl, max })
}
