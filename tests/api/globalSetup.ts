// Migrates the test database once before the API suites; unit suites need no database.
export default async function setup(): Promise<() => Promise<void>> {
  if (!process.env.DATABASE_URL) return async () => undefined
  const { migrator, closeDb } = await import('../../server/db.js')
  await migrator().up()
  await closeDb()
  return async () => undefined
}
