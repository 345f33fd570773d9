// `npm run demo:reset`: empties the dev database and seeds the demo scenario again.
import path from 'node:path'
import { ROOT, ensureDependencies, must, persistentSecret } from './lib/run.mjs'
import { devDatabase } from './lib/database.mjs'

ensureDependencies()
const db = devDatabase()
const env = {
  ...process.env,
  DATABASE_URL: db.url,
  SESSION_SECRET: process.env.SESSION_SECRET ?? persistentSecret(path.join(ROOT, '.data'), 'session-secret'),
}
try {
  must(path.join(ROOT, 'node_modules', '.bin', 'tsx'), ['server/scripts/demo-reset.ts'], { env })
} finally {
  db.stop()
}
