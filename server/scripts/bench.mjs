// `npm run bench`: speed figures (never asserted in tests). Runs each benchmark against a scratch
// database on the project's own cluster and prints `name: value` lines.
import fs from 'node:fs'
import path from 'node:path'
import { ROOT, bin, ensureClientBuild, ensureDependencies, runAsync, say, sessionSecret } from './lib/run.mjs'
import { ensureCluster, stopCluster } from './lib/pg.mjs'

ensureDependencies()
const dataDir = path.join(ROOT, '.data', 'pg-bench')
const cluster = process.env.BENCH_DATABASE_URL
  ? { url: process.env.BENCH_DATABASE_URL, started: false }
  : ensureCluster({ dataDir, port: Number(process.env.PG_BENCH_PORT ?? 55434), database: 'ellipsoid_bench', fresh: true })
const url = cluster.url
const env = {
  ...process.env,
  DATABASE_URL: url,
  NODE_ENV: 'production',
  LOG_LEVEL: 'warn',
  SESSION_SECRET: sessionSecret(),
  CHROMIUM_PATH: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
}
const only = process.argv.slice(2)
const benches = ['analysis', 'ingest', 'render'].filter((b) => !only.length || only.includes(b))
let failed = 0
try {
  if (benches.includes('render')) ensureClientBuild()
  for (const b of benches) {
    const file = path.join('server', 'scripts', 'bench', `${b}.ts`)
    if (!fs.existsSync(path.join(ROOT, file))) {
      say(`bench ${b}: missing ${file}`)
      failed++
      continue
    }
    say(`── bench: ${b}`)
    const code = await runAsync(bin('tsx'), [file], { env })
    if (code !== 0) failed++
  }
} finally {
  if (cluster.started) stopCluster(cluster.dataDir)
}
process.exit(failed ? 1 : 0)
