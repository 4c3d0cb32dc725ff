import type { Sequelize } from 'sequelize'

/**
 * How a worker thread reaches the database: plain pg connection settings (a worker thread cannot
 * share the main thread's Sequelize instance), sent along with each chunk task.
 */
export interface WorkerDatabase {
  host?: string
  port?: number
  user?: string
  password?: string
  database?: string
  ssl?: boolean | Record<string, unknown>
}

/** The connection settings of a Sequelize instance (built from the database URL), for worker threads. */
export function workerDatabaseOf(sequelize: Sequelize): WorkerDatabase {
  const c = sequelize.config as unknown as {
    host?: string
    port?: string | number
    username?: string
    password?: string | null
    database?: string
    dialectOptions?: { ssl?: boolean | Record<string, unknown> }
  }
  return {
    host: c.host,
    port: c.port === undefined ? undefined : Number(c.port),
    user: c.username,
    password: c.password ?? undefined,
    database: c.database,
    ssl: c.dialectOptions?.ssl,
  }
}
