import { mkdirSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest'
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'
import { createCourseAndSetup, flightCsv, generateTestFlight, signUpPilot } from './support/flightFixtures'

const SHOTS = 'tests/e2e/screenshots'
const tag = `upload-${Date.now()}-${Math.floor(Math.random() * 1e6)}`

let browser: Browser
let context: BrowserContext
let base: string
let logPath = ''
let courseName = ''
let setupName = ''

/** Picks an option in an Element Plus select by its visible text. */
async function choose(page: Page, testId: string, text: string): Promise<void> {
  await page.locator(`[data-testid=${testId}]`).click()
  await page.locator('.el-select-dropdown__item:visible', { hasText: text }).first().click()
}

/** Element Plus puts pass-through attributes on the <input> itself. */
const textInput = (page: Page, testId: string) => page.locator(`input[data-testid=${testId}], [data-testid=${testId}] input`).first()

beforeAll(async () => {
  base = inject('baseUrl')
  mkdirSync(SHOTS, { recursive: true })
  browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium' })
  context = await browser.newContext({ viewport: { width: 1440, height: 900 } })
  await signUpPilot(context.request, base, tag)
  const { course, setup } = await createCourseAndSetup(context.request, base)
  courseName = course.name
  setupName = setup.name
  // a header the role guesser cannot read ("lvl" for the signal): the pilot has to map it by hand
  const csv = flightCsv(generateTestFlight()).replace(/^time_ms,lat,lon,alt_m,rssi_dbm,lq,snr_db/, 'time_ms;lat;lon;alt_m;lvl;lq;snr_db')
  const semicolons = csv
    .split('\n')
    .map((line, i) => (i === 0 ? line : line.replaceAll(',', ';')))
    .join('\r\n')
  logPath = path.join(tmpdir(), `${tag}-hedge-pass.csv`)
  writeFileSync(logPath, '\uFEFF' + semicolons)
})
afterAll(async () => browser?.close())

describe('new flight upload', () => {
  it('previews the log, takes a corrected column mapping and follows the import to ready', async () => {
    const page = await context.newPage()
    await page.goto(`${base}/flights`)
    await page.click('[data-testid=new-flight]')
    await page.waitForURL(`${base}/flights/new`)

    await choose(page, 'course-select', courseName)
    await choose(page, 'setup-select', setupName)
    await page.locator('[data-testid=log-drop] input[type=file]').setInputFiles(logPath)

    // preview with the detected layout
    await page.locator('[data-testid=log-preview]').waitFor()
    const detected = await page.locator('[data-testid=mapping-editor] .detected').innerText()
    expect(detected).toContain('Semicolon separated')
    expect(detected).toContain('byte-order mark')
    expect(detected).toContain('CRLF')
    expect(await page.locator('[data-testid=log-preview] .el-table__body tr').count()).toBe(8)
    await expect(textInput(page, 'flight-name').inputValue()).resolves.toContain('hedge-pass')

    // the signal column was not recognised: the form says so until the pilot maps it
    await expect(page.locator('[data-testid=mapping-issues]').innerText()).resolves.toContain('Signal, antenna 1')
    await page.locator('[data-testid=role-4]').click()
    await page.locator('.el-select-dropdown__item:visible', { hasText: 'Signal, antenna 1' }).click()
    await page.locator('[data-testid=mapping-issues]').waitFor({ state: 'detached' })

    await textInput(page, 'mapping-name').fill('Larkfield ground receiver log')
    await page.getByRole('button', { name: 'Save mapping' }).click()
    await page.locator('.el-message--success').waitFor()
    await page.screenshot({ path: `${SHOTS}/upload-form.png`, fullPage: true })

    await page.click('[data-testid=upload-submit]')
    await page.locator('[data-testid=upload-progress-bar]').waitFor()
    await page.locator('[data-testid=upload-stage]', { hasText: 'Ready' }).waitFor({ timeout: 60_000 })
    await expect(page.locator('[data-testid=upload-progress-bar]').getAttribute('aria-valuenow')).resolves.toBe('100')
    await page.screenshot({ path: `${SHOTS}/upload-ready.png`, fullPage: true })

    await page.locator('[data-testid=open-flight]').click()
    await page.locator('[data-testid=flight-screen][data-drawn=true]').waitFor({ timeout: 30_000 })
    expect(await page.locator('path.flight-track').count()).toBeGreaterThan(0)
    await page.close()
  })

  it('proposes the saved mapping again for a file with the same header', async () => {
    const page = await context.newPage()
    await page.goto(`${base}/flights/new`)
    await page.locator('[data-testid=log-drop] input[type=file]').setInputFiles(logPath)
    await page.locator('[data-testid=mapping-editor]').waitFor()
    await page.getByText('Using the team\'s saved mapping "Larkfield ground receiver log"').waitFor()
    expect(await page.locator('[data-testid=mapping-issues]').count()).toBe(0)
    await page.close()
  })

  it('refuses a file that is not a log, before sending anything', async () => {
    const page = await context.newPage()
    await page.goto(`${base}/flights/new`)
    const bad = path.join(tmpdir(), `${tag}-photo.jpg`)
    writeFileSync(bad, 'not a log')
    await page.locator('[data-testid=log-drop] input[type=file]').setInputFiles(bad)
    await expect(page.locator('.el-message--error').innerText()).resolves.toContain('.csv')
    await page.close()
  })
})
