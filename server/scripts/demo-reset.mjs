// `npm run demo:reset`: empties the dev database and seeds the demo scenario again.
import { bin, ensureDependencies, must, sessionSecret } from './lib/run.mjs'
import { devDatabase } from './lib/database.mjs'

ensureDependencies()
const db = devDatabase()
const env = {
  ...process.env,
  DATABASE_URL: db.url,
  SESSION_SECRET: sessionSecret(),
}
try {
  must(bin('tsx'), ['server/scripts/demo-reset.ts'], { env })
} finally {
  db.stop()
}
