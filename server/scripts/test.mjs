// `npm test`: bootstrap a separate test database, then type checks, unit/reference/API tests and the
// browser suite. Ends with one summary line and a non-zero exit on any failure.
import fs from 'node:fs'
import path from 'node:path'
import { ROOT, bin, ensureClientBuild, ensureDependencies, isRoot, must, runAsync, say, which } from './lib/run.mjs'
import { testDatabase } from './lib/database.mjs'

function ensureChromium() {
  if (which('chromium')) return
  if (!isRoot) {
    console.error('Debian chromium is needed for the browser suite: sudo apt-get install -y chromium')
    process.exit(1)
  }
  say('installing Debian chromium for the browser suite (apt-get)…')
  must('sh', ['-c', 'apt-get update -q && DEBIAN_FRONTEND=noninteractive apt-get install -y -q chromium'])
}

ensureDependencies()
ensureChromium()
const db = testDatabase()
const resultsDir = path.join(ROOT, '.data', 'test-results')
fs.rmSync(resultsDir, { recursive: true, force: true })
fs.mkdirSync(resultsDir, { recursive: true })
const env = {
  ...process.env,
  DATABASE_URL: db.url,
  NODE_ENV: 'test',
  SESSION_SECRET: 'test-session-secret-0123456789abcdef',
  BCRYPT_COST: process.env.BCRYPT_COST ?? '4',
  CHROMIUM_PATH: which('chromium') ?? '/usr/bin/chromium',
}
const steps = []
async function step(name, cmd, args, resultsFile) {
  say(`── ${name}`)
  const started = Date.now()
  const code = await runAsync(cmd, args, { env })
  let passed = 0
  let failed = 0
  if (resultsFile && fs.existsSync(resultsFile)) {
    const r = JSON.parse(fs.readFileSync(resultsFile, 'utf8'))
    passed = r.numPassedTests ?? 0
    failed = (r.numFailedTests ?? 0) + (code !== 0 && !r.numFailedTests ? 1 : 0)
  } else {
    passed = code === 0 ? 1 : 0
    failed = code === 0 ? 0 : 1
  }
  steps.push({ name, code, passed, failed, seconds: (Date.now() - started) / 1000 })
}

let exitCode = 1
try {
  await step('type-check client (vue-tsc)', bin('vue-tsc'), ['--noEmit', '-p', 'src'])
  await step('type-check server (tsc)', bin('tsc'), ['--noEmit', '-p', 'server'])
  await step('type-check shared (tsc)', bin('tsc'), ['--noEmit', '-p', 'shared'])
  await step('type-check shared and browser tests (tsc)', bin('tsc'), ['--noEmit', '-p', 'tests'])
  const unitJson = path.join(resultsDir, 'unit-api.json')
  await step('unit, reference and API tests (vitest)', bin('vitest'), ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${unitJson}`], unitJson)
  say('── building the client for the browser suite')
  ensureClientBuild()
  const e2eJson = path.join(resultsDir, 'e2e.json')
  await step('browser suite (playwright-core + chromium)', bin('vitest'), ['run', '--config', 'tests/e2e/vitest.e2e.config.ts', '--reporter=default', '--reporter=json', `--outputFile.json=${e2eJson}`], e2eJson)
  const failedSteps = steps.filter((s) => s.code !== 0)
  console.log('')
  for (const s of steps) console.log(`  ${s.code === 0 ? 'ok  ' : 'FAIL'} ${s.name} (${s.seconds.toFixed(1)} s)`)
  const passed = steps.reduce((a, s) => a + s.passed, 0)
  const failed = steps.reduce((a, s) => a + s.failed, 0)
  console.log(`tests: ${passed} passed, ${failed} failed`)
  exitCode = failedSteps.length ? 1 : 0
} catch (err) {
  console.error(`[ellipsoid] ${err.message}`)
} finally {
  db.stop()
}
process.exit(exitCode)
