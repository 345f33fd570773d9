// `npm run dev`: the API under tsx watch and the Vite dev server (hot reload, /api proxied to the API).
import { spawn } from 'node:child_process'
import { ROOT, bin, ensureDependencies, must, sessionSecret } from './lib/run.mjs'
import { devDatabase } from './lib/database.mjs'

ensureDependencies()
const db = devDatabase()
const env = {
  ...process.env,
  DATABASE_URL: db.url,
  NODE_ENV: 'development',
  SESSION_SECRET: sessionSecret(),
  PUBLIC_URL: process.env.PUBLIC_URL ?? 'http://127.0.0.1:5173',
}
must(bin('tsx'), ['server/scripts/prepare.ts'], { env })
const children = [
  spawn(bin('tsx'), ['watch', 'server/index.ts'], { cwd: ROOT, env, stdio: 'inherit' }),
  spawn(bin('vite'), ['--host', '127.0.0.1'], { cwd: ROOT, env, stdio: 'inherit' }),
]
let stopping = false
const stop = () => {
  if (stopping) return
  stopping = true
  for (const c of children) c.kill('SIGTERM')
}
process.on('SIGINT', stop)
process.on('SIGTERM', stop)
let alive = children.length
for (const c of children) {
  c.on('exit', () => {
    stop()
    if (--alive === 0) {
      db.stop()
      process.exit(0)
    }
  })
}
