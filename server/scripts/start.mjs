// `npm start`: everything needed to run Ellipsoid with demo data on a fresh Debian machine.
import { spawn } from 'node:child_process'
import { ROOT, bin, ensureClientBuild, ensureDependencies, must, say, sessionSecret } from './lib/run.mjs'
import { devDatabase } from './lib/database.mjs'

ensureDependencies()
const db = devDatabase()
const env = {
  ...process.env,
  DATABASE_URL: db.url,
  NODE_ENV: process.env.NODE_ENV ?? 'production',
  SESSION_SECRET: sessionSecret(),
}
const tsx = bin('tsx')
try {
  must(tsx, ['server/scripts/prepare.ts'], { env })
  ensureClientBuild()
  // The server runs as JavaScript built ahead of time (less memory than tsx's loader); imported here, after the
  // dependencies are installed, because the build uses esbuild.
  await (await import('./build-server.mjs')).buildServer()
} catch (err) {
  console.error(`[ellipsoid] ${err.message}`)
  db.stop()
  process.exit(1)
}

const server = spawn(process.execPath, ['dist-server/index.js'], { cwd: ROOT, env, stdio: 'inherit' })
let stopping = false
const stop = (signal) => {
  if (stopping) return
  stopping = true
  say(`${signal}: stopping the server, then PostgreSQL…`)
  server.kill('SIGTERM')
}
process.on('SIGINT', () => stop('SIGINT'))
process.on('SIGTERM', () => stop('SIGTERM'))
server.on('exit', (code) => {
  db.stop()
  say('stopped.')
  process.exit(stopping ? 0 : (code ?? 1))
})
