// `npm run demo:reset`: empties every table of the dev database, applies pending migrations, seeds the demo again.
import fs from 'node:fs/promises'
import { closeDb, migrator, pgPool } from '../db.js'
import { rawDir, tmpDir } from '../services/flights/storage.js'
import { DEMO_USERS, seedDemoIfEmpty } from './seed/demo.js'

await migrator().up()
const { rows } = await pgPool().query<{ tablename: string }>(
  `SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'SequelizeMeta'`,
)
if (rows.length) {
  await pgPool().query(`TRUNCATE ${rows.map((r) => `"${r.tablename}"`).join(', ')} RESTART IDENTITY CASCADE`)
}
// The kept originals belonged to the flights just removed; leaving them would orphan them on disk.
for (const dir of [rawDir(), tmpDir()]) await fs.rm(dir, { recursive: true, force: true })
console.log(`[ellipsoid] emptied ${rows.length} table(s) and the kept log files`)
const seeded = await seedDemoIfEmpty()
console.log(seeded ? '[ellipsoid] demo scenario restored' : '[ellipsoid] demo not seeded (users remained)')
console.log(`  Demo sign-ins (password: ${DEMO_USERS[0]?.password}): ${DEMO_USERS.map((u) => u.email).join(', ')}`)
await closeDb()
