import type { Migration } from '../migrator'

// The table layout connect-pg-simple expects (its documented table.sql).
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE "session" (
      "sid" varchar NOT NULL COLLATE "default" PRIMARY KEY,
      "sess" json NOT NULL,
      "expire" timestamp(6) NOT NULL
    );
    CREATE INDEX "IDX_session_expire" ON "session" ("expire");
  `)
}

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS "session"')
}
