import { mkdirSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest'
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'
import { createCourseAndSetup, csrf, flightCsv, generateTestFlight, signUpPilot, uploadAndWait } from './support/flightFixtures'

const SHOTS = 'tests/e2e/screenshots'
const DESKTOP = { width: 1440, height: 900 }
const TABLET = { width: 820, height: 1180 }
const tag = `flight-screen-${Date.now()}-${Math.floor(Math.random() * 1e6)}`

let browser: Browser
let context: BrowserContext
let base: string
let flightUrl = ''

/** Pixels a chart's canvas has painted (alpha > 0); 0 for a blank canvas. */
async function paintedPixels(page: Page, testId: string): Promise<number> {
  return page.locator(`[data-testid=${testId}] canvas`).first().evaluate((c: HTMLCanvasElement) => {
    const ctx = c.getContext('2d')!
    const d = ctx.getImageData(0, 0, c.width, c.height).data
    let n = 0
    for (let i = 3; i < d.length; i += 4) if (d[i]! > 0) n++
    return n
  })
}

const cursorPath = (page: Page) => page.locator('path.flight-cursor').getAttribute('d')
const clock = (page: Page) => page.locator('[data-testid=timeline-clock]').innerText()

async function openFlight(page: Page): Promise<void> {
  await page.goto(flightUrl)
  await page.locator('[data-testid=flight-screen][data-drawn=true]').waitFor({ timeout: 30_000 })
}

beforeAll(async () => {
  base = inject('baseUrl')
  mkdirSync(SHOTS, { recursive: true })
  browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium' })
  context = await browser.newContext({ viewport: DESKTOP })
  await signUpPilot(context.request, base, tag)
  const { course, setup } = await createCourseAndSetup(context.request, base)
  const id = await uploadAndWait(context.request, base, { courseId: course.id, setupId: setup.id }, 'Low pass over the ash hedge', flightCsv(generateTestFlight()))
  flightUrl = `${base}/flights/${id}`
})
afterAll(async () => browser?.close())

describe('the flight screen', () => {
  it('draws the coloured track, station, beam sector, dropout markers and a legend on the map', async () => {
    const page = await context.newPage()
    await openFlight(page)
    expect(await page.locator('path.flight-track').count()).toBeGreaterThan(3)
    expect(await page.locator('path.ground-station').count()).toBe(1)
    expect(await page.locator('path.beam-sector').count()).toBe(1)
    expect(await page.locator('path.course-obstacle').count()).toBe(1)
    expect(await page.locator('.dropout-marker').count()).toBeGreaterThan(0)
    await expect(page.locator('[data-testid=signal-legend]').innerText()).resolves.toContain('dBm')
    // the track uses several colours of the ramp, not one flat colour
    const colours = await page.locator('path.flight-track').evaluateAll((ps) => new Set(ps.map((p) => p.getAttribute('stroke'))).size)
    expect(colours).toBeGreaterThan(3)
    await page.close()
  })

  it('paints every chart and fills the summary cards', async () => {
    const page = await context.newPage()
    await openFlight(page)
    for (const id of ['chart-signal-time', 'chart-signal-distance', 'chart-margin-distance', 'chart-fresnel']) {
      expect(await paintedPixels(page, id), id).toBeGreaterThan(2000)
    }
    const cards = await page.locator('[data-testid=summary-cards] [data-card]').allInnerTexts()
    expect(cards).toHaveLength(8)
    expect(cards.find((c) => c.startsWith('Path-loss exponent'))).toMatch(/\d\.\d\d/)
    await page.screenshot({ path: `${SHOTS}/flight-screen-desktop.png`, fullPage: true })
    await page.close()
  })

  it('moves the cursor on the map and the readout when the timeline moves', async () => {
    const page = await context.newPage()
    await openFlight(page)
    const before = await cursorPath(page)
    const clockBefore = await clock(page)
    const slider = page.locator('[data-testid=timeline-slider] .el-slider__runway')
    const box = (await slider.boundingBox())!
    await slider.click({ position: { x: box.width * 0.6, y: box.height / 2 } })
    await expect.poll(() => cursorPath(page)).not.toBe(before)
    expect(await clock(page)).not.toBe(clockBefore)

    // play runs the clock on its own; pause stops it
    const atPause = await clock(page)
    await page.click('[data-testid=timeline-play]')
    await expect.poll(() => clock(page), { timeout: 10_000 }).not.toBe(atPause)
    await page.click('[data-testid=timeline-play]')
    await page.close()
  })

  it('moves the timeline to a dropout and shows the Fresnel profile of that moment', async () => {
    const page = await context.newPage()
    await openFlight(page)
    const rows = page.locator('[data-testid=dropouts-table] .el-table__body tr')
    expect(await rows.count()).toBeGreaterThan(0)
    const first = await rows.first().innerText()
    const start = first.split(/\s+/)[0]!
    const before = await cursorPath(page)
    await rows.first().click()
    await expect.poll(() => clock(page)).toMatch(new RegExp(`^${start} /`))
    await expect.poll(() => cursorPath(page)).not.toBe(before)
    await expect(page.locator('[data-testid=fresnel-verdict]').textContent()).resolves.toMatch(/Clearance|blocked/)
    expect(await paintedPixels(page, 'chart-fresnel')).toBeGreaterThan(2000)
    await page.locator('#fresnel-panel').screenshot({ path: `${SHOTS}/flight-screen-fresnel.png` })
    await page.close()
  })

  it('draws the course terrain as the ground of the Fresnel profile once the course has some', async () => {
    // an SRTM-style tile over the field: level at the station's 95 m, with a 25 m hill on the leg about 1 km out
    const side = 1201
    const tile = Buffer.alloc(side * side * 2)
    for (let r = 0; r < side; r++) {
      const lat = 53 - r / (side - 1)
      for (let c = 0; c < side; c++) {
        const lon = -2 + c / (side - 1)
        const dxM = (lon + 1.4985) * 68_000
        const dyM = (lat - 52.4085) * 111_250
        tile.writeInt16BE(Math.round(95 + 25 * Math.exp(-(dxM * dxM + dyM * dyM) / (250 * 250))), (r * side + c) * 2)
      }
    }
    const flight = (await (await context.request.get(`${base}/api/flights/${flightUrl.split('/').pop()}`)).json()) as { courseId: number }
    const token = await csrf(context.request, base)
    const up = await context.request.post(`${base}/api/courses/${flight.courseId}/terrain`, {
      headers: { 'X-CSRF-Token': token },
      multipart: { file: { name: 'N52W002.hgt', mimeType: 'application/octet-stream', buffer: tile } },
    })
    expect(up.status(), await up.text()).toBe(201)
    const page = await context.newPage()
    await openFlight(page)
    const rows = page.locator('[data-testid=dropouts-table] .el-table__body tr')
    await rows.last().click()
    await page.locator('[data-testid=chart-fresnel][data-ground=terrain]').waitFor()
    await expect(page.locator('[data-testid=fresnel-verdict]').textContent()).resolves.toMatch(/Clearance|blocked/)
    expect(await paintedPixels(page, 'chart-fresnel')).toBeGreaterThan(2000)
    await page.locator('#fresnel-panel').screenshot({ path: `${SHOTS}/flight-screen-fresnel-terrain.png` })
    await page.close()
  })

  it('stays usable at tablet width', async () => {
    const tablet = await browser.newContext({ viewport: TABLET, storageState: await context.storageState() })
    const page = await tablet.newPage()
    await openFlight(page)
    expect(await page.locator('path.flight-track').count()).toBeGreaterThan(3)
    const mapBox = (await page.locator('[data-testid=flight-map]').boundingBox())!
    expect(mapBox.width).toBeGreaterThan(600)
    await page.screenshot({ path: `${SHOTS}/flight-screen-tablet.png`, fullPage: true })
    await tablet.close()
  })
})
