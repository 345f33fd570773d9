import type { QueryInterface } from 'sequelize'

// connect-pg-simple's table (its table.sql), created here rather than by createTableIfMissing.
export async function up(qi: QueryInterface): Promise<void> {
  await qi.sequelize.query(`
    CREATE TABLE "session" (
      "sid" varchar NOT NULL COLLATE "default" PRIMARY KEY,
      "sess" json NOT NULL,
      "expire" timestamp(6) NOT NULL
    )`)
  await qi.sequelize.query(`CREATE INDEX "IDX_session_expire" ON "session" ("expire")`)
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('session')
}
