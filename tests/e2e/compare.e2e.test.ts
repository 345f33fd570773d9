import { mkdirSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest'
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'
import { DEMO_PASSWORD, DEMO_USERS, seedDemoTeam } from '../../server/scripts/seed/demo.js'
import { seedDemoCoursesAndSetups } from '../../server/scripts/seed/courses.js'
import { seedDemoFlightsAndComparison } from '../../server/scripts/seed/flights.js'
import { closeDb, pgPool } from '../../server/db.js'
import { csrf } from './support/flightFixtures'

const SHOTS = 'tests/e2e/screenshots'
const DESKTOP = { width: 1440, height: 900 }
const TABLET = { width: 820, height: 1180 }
const PILOT = DEMO_USERS.find((u) => u.role === 'pilot')!

let browser: Browser
let context: BrowserContext
let base: string
let lowFlightId = 0
let highFlightId = 0

/** Seeds the demo scenario once per test database (the demo users are fixed addresses). */
async function ensureDemo(): Promise<void> {
  const { rows } = await pgPool().query<{ id: number }>(`SELECT id FROM users WHERE email = $1`, [PILOT.email])
  if (!rows.length) {
    const team = await seedDemoTeam()
    const refs = await seedDemoCoursesAndSetups(team.teamId, team.userIds.admin)
    await seedDemoFlightsAndComparison(team.teamId, team.userIds.pilot, refs)
  }
  const { rows: c } = await pgPool().query<{ flight_ids: number[] }>(
    `SELECT c.flight_ids FROM comparisons c JOIN memberships m ON m.team_id = c.team_id JOIN users u ON u.id = m.user_id
      WHERE u.email = $1 AND c.name = 'Power vs antenna' ORDER BY c.id LIMIT 1`,
    [PILOT.email],
  )
  ;[lowFlightId, highFlightId] = c[0]!.flight_ids as [number, number]
}

/** Pixels a chart's canvas has painted (alpha > 0). */
async function painted(page: Page, testId: string): Promise<number> {
  return page.locator(`[data-test=${testId}] canvas`).first().evaluate((cv: HTMLCanvasElement) => {
    const d = cv.getContext('2d')!.getImageData(0, 0, cv.width, cv.height).data
    let n = 0
    for (let i = 3; i < d.length; i += 4) if (d[i]! > 0) n++
    return n
  })
}

async function openDemoComparison(page: Page): Promise<void> {
  await page.goto(`${base}/`)
  await page.locator('[data-test=demo-comparison-link]').click()
  await page.locator('[data-test=comparison-table]').waitFor({ timeout: 30_000 })
  await page.locator('[data-test=signal-distance-chart] canvas').first().waitFor()
}

beforeAll(async () => {
  base = inject('baseUrl')
  mkdirSync(SHOTS, { recursive: true })
  await ensureDemo()
  await closeDb()
  browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium' })
  context = await browser.newContext({ viewport: DESKTOP })
  const token = await csrf(context.request, base)
  const res = await context.request.post(`${base}/api/auth/sign-in`, {
    headers: { 'X-CSRF-Token': token },
    data: { email: PILOT.email, password: DEMO_PASSWORD },
  })
  expect(res.status()).toBe(200)
}, 180_000)
afterAll(async () => browser?.close())

describe('the demo comparison', () => {
  it('opens in one click from the overview with the table, advantages and both charts', async () => {
    const page = await context.newPage()
    await openDemoComparison(page)
    await expect(page.locator('h1').innerText()).resolves.toBe('Power vs antenna')
    expect(await page.locator('[data-test=comparison-table] thead th').count()).toBe(4)
    const table = await page.locator('[data-test=comparison-table]').innerText()
    expect(table).toMatch(/25 mW/)
    expect(table).toMatch(/250 mW/)
    expect(table).toContain('Path-loss exponent n')
    const phrases = await page.locator('[data-test=advantage-phrase]').allInnerTexts()
    expect(phrases).toHaveLength(2)
    for (const p of phrases) expect(p).toMatch(/^\+\d+\.\d dB: like \d+(\.\d)?× the power$/)
    expect(await painted(page, 'signal-distance-chart')).toBeGreaterThan(3000)
    expect(await painted(page, 'difference-chart')).toBeGreaterThan(1000)
    expect(await page.locator('[data-test=compare-map] path.leaflet-interactive').count()).toBeGreaterThanOrEqual(5)
    await expect(page.locator('[data-test=save-card] textarea').inputValue()).resolves.toMatch(/95 % CI/)
    await page.screenshot({ path: `${SHOTS}/compare-desktop.png`, fullPage: true })
    await page.setViewportSize(TABLET)
    await page.waitForTimeout(400)
    await page.screenshot({ path: `${SHOTS}/compare-tablet.png`, fullPage: true })
    await page.close()
  })

  it('recomputes every advantage when the baseline changes', async () => {
    const page = await context.newPage()
    await openDemoComparison(page)
    await page.locator(`[data-test=baseline-${highFlightId}]`).click()
    await page.locator(`[data-test=advantage-list] [data-flight-id="${lowFlightId}"]`).waitFor()
    const phrase = await page.locator(`[data-test=advantage-list] [data-flight-id="${lowFlightId}"] [data-test=advantage-phrase]`).innerText()
    // the low-power flight is now about 10 dB behind the new baseline
    expect(phrase).toMatch(/^−(9|10|11)\.\d dB: like 0\.1× the power$/)
    await page.close()
  })
})

describe('the link planner', () => {
  it('opens from a flight with its fitted model and warns once the power passes the preset', async () => {
    const page = await context.newPage()
    await page.goto(`${base}/flights/${lowFlightId}`)
    await page.locator('[data-test=plan-from-flight]').click()
    await page.waitForURL(/\/plan\?flightId=/)
    await page.locator('[data-test=model-source] .is-active', { hasText: 'Flight:' }).waitFor()
    await page.locator('[data-test=plan-figures]').waitFor()
    await expect(page.locator('[data-test=power-cautions]').innerText()).resolves.toMatch(/RF exposure/)
    await expect(page.locator('[data-test=limit-ok]').isVisible()).resolves.toBe(true)
    const rangeBefore = await page.locator('[data-test=plan-range]').innerText()
    const mw = page.locator('.el-input-number[data-test=tx-mw] input, [data-test=tx-mw] input, input[data-test=tx-mw]').first()
    await mw.fill('500')
    await mw.press('Tab')
    await page.locator('[data-test=limit-warning]').waitFor()
    await expect(page.locator('[data-test=limit-warning]').innerText()).resolves.toMatch(/exceeds the power limit/)
    expect(await page.locator('[data-test=plan-range]').innerText()).not.toBe(rangeBefore)
    await page.screenshot({ path: `${SHOTS}/planner-desktop.png`, fullPage: true })
    await page.setViewportSize(TABLET)
    await page.waitForTimeout(300)
    await page.screenshot({ path: `${SHOTS}/planner-tablet.png`, fullPage: true })
    await page.close()
  })
})
