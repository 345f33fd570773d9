// Render benchmark: time in headless chromium from navigation to a fully drawn flight screen (map with the
// coloured track, every chart painted, summary and dropouts filled) for a 100,000- and a 1,000,000-sample flight.
// Needs its own database (DATABASE_URL); starts the real server (built client in dist/) in a child process.
// Run: npx tsx server/scripts/bench/render.ts
import { spawn, type ChildProcess } from 'node:child_process'
import { chromium, type BrowserContext } from 'playwright-core'
import { closeDb, migrator } from '../../db.js'
import {
  createCourseAndSetup,
  flightCsv,
  generateTestFlight,
  signUpPilot,
  uploadAndWait,
} from '../../../tests/e2e/support/flightFixtures.js'
import { waitForHealth } from '../../../tests/e2e/support/health.js'

const PORT = Number(process.env.BENCH_RENDER_PORT ?? 3392)
const BASE = `http://127.0.0.1:${PORT}`
const RUNS = 3
// the test flight at 50 Hz (the generator's top rate) gives ~18,000 rows; longer logs fly it again, back to back
const LOG_HZ = 50
const SIZES: Array<{ key: string; rows: number }> = [
  { key: 'render_100k_ms', rows: 100_000 },
  { key: 'render_1m_ms', rows: 1_000_000 },
]

function startServer(): ChildProcess {
  return spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, PORT: String(PORT), HOST: '127.0.0.1', PUBLIC_URL: BASE },
    stdio: ['ignore', 'ignore', 'inherit'],
  })
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!

/** Opens the flight screen RUNS times (after one warm-up) and returns the median ms to fully drawn. */
async function timeScreen(context: BrowserContext, flightId: number): Promise<number> {
  const times: number[] = []
  for (let run = 0; run <= RUNS; run++) {
    const page = await context.newPage()
    const t0 = performance.now()
    await page.goto(`${BASE}/flights/${flightId}`)
    await page.locator('[data-testid=flight-screen][data-drawn=true]').waitFor({ timeout: 180_000 })
    const ms = performance.now() - t0
    if (run > 0) times.push(ms)
    await page.close()
  }
  return median(times)
}

async function main(): Promise<void> {
  await migrator().up()
  await closeDb()
  const server = startServer()
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium' })
  try {
    await waitForHealth(`${BASE}/api/health`, 30_000)
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } })
    await signUpPilot(context.request, BASE, `bench-render-${Date.now()}`)
    const ids = await createCourseAndSetup(context.request, BASE)
    for (const { key, rows } of SIZES) {
      const flight = generateTestFlight(LOG_HZ)
      const csv = flightCsv(flight, Math.ceil(rows / flight.timeMs.length), rows)
      const id = await uploadAndWait(context.request, BASE, { courseId: ids.course.id, setupId: ids.setup.id }, `Bench ${rows} rows`, csv, 600_000)
      const ms = await timeScreen(context, id)
      console.log(`flight screen, ${rows.toLocaleString('en-GB')}-sample flight: median of ${RUNS} loads ${ms.toFixed(0)} ms`)
      console.log(`${key}: ${ms.toFixed(0)}`)
    }
  } finally {
    await browser.close()
    server.kill('SIGTERM')
  }
}

main().catch((e: unknown) => {
  console.error(e)
  process.exit(1)
})
