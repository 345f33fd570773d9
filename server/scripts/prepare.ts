// Migrates the database, seeds the demo scenario when it is empty, and prints how to sign in.
import { config } from '../config.js'
import { closeDb, migrator } from '../db.js'
import { seedDemoIfEmpty, DEMO_USERS } from './seed/demo.js'

const cfg = config()
const done = await migrator().up()
if (done.length) console.log(`[ellipsoid] applied ${done.length} migration(s)`)
const seeded = await seedDemoIfEmpty()
if (seeded) console.log('[ellipsoid] seeded the demo scenario')
await closeDb()
console.log(`
  Ellipsoid: http://${cfg.host}:${cfg.port}/
  Demo sign-ins (password for each: ${DEMO_USERS[0]?.password}):
${DEMO_USERS.map((u) => `    ${u.role.padEnd(10)} ${u.email}`).join('\n')}
`)
