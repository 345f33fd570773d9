import { describe, expect, it, inject, afterAll } from 'vitest'
import { chromium, type Browser } from 'playwright-core'

let browser: Browser | null = null
afterAll(async () => browser?.close())

describe('GET /', () => {
  it('serves the client with its #app mount point and renders it', async () => {
    const base = inject('baseUrl')
    const html = await (await fetch(`${base}/`)).text()
    expect(html).toContain('<div id="app">')
    browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium' })
    const page = await browser.newPage()
    await page.goto(`${base}/`)
    // The client renders after its bundle loads; wait for the shell's text rather than reading at once.
    await page.locator('#app').getByText('Ellipsoid').first().waitFor({ timeout: 15_000 })
    expect(await page.locator('#app').innerText()).toContain('Ellipsoid')
  })
})
