import type { QueryInterface, Sequelize } from 'sequelize'
import { SequelizeStorage, Umzug, type MigrationFn } from 'umzug'
import { migrations } from './migrations/index'

export type Migration = MigrationFn<QueryInterface>

/** Umzug migrator recording applied migrations in the "schema_migrations" table. */
export function createMigrator(sequelize: Sequelize, log: (msg: string) => void = () => {}) {
  return new Umzug({
    migrations: migrations.map((m) => ({
      name: m.name,
      up: m.up,
      down: m.down,
    })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: {
      info: (e) => {
        const ev = e as { event?: string; name?: string }
        if (ev.event === 'migrated') log(`migrated ${ev.name}`)
      },
      warn: () => {},
      error: (e) => log(`migration error ${JSON.stringify(e)}`),
      debug: () => {},
    },
  })
}

/** Applies every pending migration; returns the names applied. */
export async function migrateUp(sequelize: Sequelize, log?: (msg: string) => void): Promise<string[]> {
  const applied = await createMigrator(sequelize, log).up()
  return applied.map((m) => m.name)
}
