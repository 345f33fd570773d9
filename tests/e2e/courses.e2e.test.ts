import { mkdirSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest'
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'
import type { LinkSetupDto } from '../../shared/types/setup.js'
import { TEST_SETUP, csrf, flightCsv, generateTestFlight, uploadAndWait } from './support/flightFixtures'

const SHOTS = 'tests/e2e/screenshots'
const stamp = `${Date.now()}-${Math.floor(Math.random() * 1e6)}`
const pilot = { name: 'Cass Mercer', email: `courses-${stamp}@example.test`, password: 'long leg north 2026', teamName: `Course crew ${stamp}` }
const DESKTOP = { width: 1440, height: 900 }
const TABLET = { width: 820, height: 1180 }

let browser: Browser
let context: BrowserContext
let base: string
let courseUrl = ''
let setupUrl = ''

/** Signs up through the API in the browser context, so its pages share the session cookie. */
async function signUp(ctx: BrowserContext): Promise<void> {
  const token = await csrf(ctx.request, base)
  const res = await ctx.request.post(`${base}/api/auth/sign-up`, { data: pilot, headers: { 'X-CSRF-Token': token } })
  if (!res.ok()) throw new Error(`sign-up answered ${res.status()}: ${await res.text()}`)
}

const field = (page: Page, name: string) => page.locator(`input[data-field=${name}], textarea[data-field=${name}], [data-field=${name}] input`).first()
const shot = (page: Page, name: string) => page.screenshot({ path: `${SHOTS}/courses-${name}.png`, fullPage: true })

async function clickMap(page: Page, dx: number, dy: number): Promise<void> {
  const map = page.locator('.leaflet-container')
  const box = (await map.boundingBox())!
  await map.click({ position: { x: box.width / 2 + dx, y: box.height / 2 + dy } })
}

beforeAll(async () => {
  base = inject('baseUrl')
  mkdirSync(SHOTS, { recursive: true })
  browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium' })
  context = await browser.newContext({ viewport: DESKTOP })
  await signUp(context)
})
afterAll(async () => browser?.close())

describe('courses and link setups', () => {
  it('creates a course: station placed by clicking the map, an obstacle drawn with a label and height', async () => {
    const page = await context.newPage()
    await page.goto(`${base}/courses`)
    await page.getByRole('heading', { name: 'Courses' }).waitFor()
    await page.click('[data-action=new-course]')
    await page.waitForURL(`${base}/courses/new`)
    await page.locator('.leaflet-tile-loaded').first().waitFor()
    await field(page, 'course-name').fill('East meadow')

    await page.click('[data-tool=station]')
    await clickMap(page, -120, 60)
    await expect(page.locator('[data-coord=lat]').inputValue()).resolves.toMatch(/^52\.8\d+/)
    await expect(page.locator('.station-marker').count()).resolves.toBe(1)

    await page.click('[data-tool=point]')
    await clickMap(page, 80, -40)
    await field(page, 'obstacle-label').fill('Lone oak')
    await field(page, 'obstacle-height').fill('18')
    await page.click('[data-action=save-obstacle]')

    await page.click('[data-tool=line]')
    await clickMap(page, -200, -150)
    await clickMap(page, 150, -170)
    await page.click('[data-tool=finish]')
    await field(page, 'obstacle-label').fill('Tree line')
    await field(page, 'obstacle-height').fill('14')
    await page.click('[data-action=save-obstacle]')

    await page.click('[data-action=save-course]')
    await page.waitForURL(/\/courses\/\d+$/)
    courseUrl = page.url()
    await page.reload()
    await page.locator('.obstacle-list').getByText('Lone oak').waitFor()
    const rows = await page.locator('.obstacle-list tbody tr').allInnerTexts()
    expect(rows.map((r) => r.replace(/\s+/g, ' ').trim())).toEqual([
      expect.stringMatching(/^Lone oak Point 18 m/),
      expect.stringMatching(/^Tree line Line 14 m/),
    ])
    // the drawn line is on the map after the reload, beside the station
    await expect(page.locator('.leaflet-overlay-pane path').count()).resolves.toBeGreaterThanOrEqual(3)
    await page.locator('[data-terrain=none]').waitFor()
    await shot(page, 'detail-desktop')
    await page.close()
  })

  it('takes the planned route from a flight flown on the course, then saves it with the course', async () => {
    const courseId = Number(courseUrl.split('/').pop())
    const token = await csrf(context.request, base)
    const setup = (await (await context.request.post(`${base}/api/setups`, { data: TEST_SETUP, headers: { 'X-CSRF-Token': token } })).json()) as LinkSetupDto
    // 2 rows a second keeps the import short; the track still has the leg's turns
    await uploadAndWait(context.request, base, { courseId, setupId: setup.id }, 'Route survey', flightCsv(generateTestFlight(2)))
    const page = await context.newPage()
    await page.goto(courseUrl)
    await page.locator('.leaflet-tile-loaded').first().waitFor()
    await expect(page.locator('path.planned-route').count()).resolves.toBe(0)
    await page.click('[data-field=route-flight]')
    await page.getByRole('option', { name: /Route survey/ }).click()
    await page.click('[data-action=route-from-flight]')
    await page.locator('path.planned-route').waitFor()
    const readout = await page.locator('[data-readout=route]').innerText()
    const points = Number(/(\d+) points/.exec(readout)?.[1])
    // simplified: a handful of corners, far fewer than the fixes fetched
    expect(points).toBeGreaterThanOrEqual(2)
    expect(points).toBeLessThan(200)
    await shot(page, 'route-from-flight')
    await page.click('[data-action=save-course]')
    await page.getByText('Course saved').waitFor()
    const saved = (await (await context.request.get(`${base}/api/courses/${courseId}`)).json()) as { route: { coordinates: unknown[] } | null }
    expect(saved.route?.coordinates).toHaveLength(points)
    await page.close()
  })

  it('lists the course and shows it at tablet width', async () => {
    const page = await context.newPage()
    await page.setViewportSize(TABLET)
    await page.goto(`${base}/courses`)
    await page.getByRole('cell', { name: 'East meadow' }).waitFor()
    await shot(page, 'list-tablet')
    await page.goto(courseUrl)
    await page.locator('.leaflet-tile-loaded').first().waitFor()
    await page.locator('.obstacle-list').getByText('Tree line').waitFor()
    await shot(page, 'detail-tablet')
    await page.close()
  })

  it('creates a link setup in mW and sees EIRP follow the power', async () => {
    const page = await context.newPage()
    await page.goto(`${base}/setups`)
    await page.click('[data-action=new-setup]')
    await page.waitForURL(`${base}/setups/new`)
    const eirp = page.locator('[data-readout=eirp]')
    // defaults: 25 mW and a 2.15 dBi antenna → 13.98 + 2.15 = 16.1 dBm
    await expect(eirp.innerText()).resolves.toBe('16.1 dBm')
    await field(page, 'setup-name').fill('2.4 control, 250 mW omni')
    const power = field(page, 'tx-power')
    await power.fill('250')
    await power.blur()
    // ten times the power is +10 dB
    await expect(eirp.innerText()).resolves.toBe('26.1 dBm')
    await expect(page.locator('[data-readout=power]').innerText()).resolves.toBe('250 mW = 24.0 dBm')
    await expect(page.locator('[data-beamwidth=estimated]').first().innerText()).resolves.toContain('≈ 78°')
    await page.click('[data-unit=dBm]')
    await expect(power.inputValue()).resolves.toBe('23.98')
    await page.click('[data-action=save-setup]')
    await page.waitForURL(/\/setups\/\d+$/)
    setupUrl = page.url()
    await page.getByText('version 1').waitFor()
    await expect(eirp.innerText()).resolves.toBe('26.1 dBm')
    await shot(page, 'setup-desktop')
    await page.setViewportSize(TABLET)
    await page.goto(setupUrl)
    await page.getByText('version 1').waitFor()
    await shot(page, 'setup-tablet')
    await page.goto(`${base}/setups`)
    await page.getByRole('cell', { name: '2.4 control, 250 mW omni' }).waitFor()
    await shot(page, 'setups-list-tablet')
    await page.close()
  })
})
