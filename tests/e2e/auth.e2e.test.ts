import { mkdirSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest'
import { chromium, type Browser, type Page } from 'playwright-core'

const SHOTS = 'tests/e2e/screenshots'
const stamp = `${Date.now()}-${Math.floor(Math.random() * 1e6)}`
const admin = { name: 'Rowan Admin', email: `admin-${stamp}@example.test`, password: 'field day 2026!' }
const viewer = { name: 'Vera Viewer', email: `viewer-${stamp}@example.test`, password: 'watching only 42' }
const teamName = `Test Crew ${stamp}`

let browser: Browser
let base: string
let inviteLink = ''

beforeAll(async () => {
  base = inject('baseUrl')
  mkdirSync(SHOTS, { recursive: true })
  browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium' })
})
afterAll(async () => browser?.close())

const shot = (page: Page, name: string) => page.screenshot({ path: `${SHOTS}/auth-${name}.png`, fullPage: true })

async function newPage(width = 1280, height = 860): Promise<Page> {
  const context = await browser.newContext({ viewport: { width, height } })
  return context.newPage()
}

async function signIn(page: Page, who: { email: string; password: string }): Promise<void> {
  await page.goto(`${base}/sign-in`)
  await page.fill('input[name=email]', who.email)
  await page.fill('input[name=password]', who.password)
  await page.click('[data-test=sign-in]')
  await page.waitForURL(`${base}/`)
  await page.getByRole('heading', { name: /Welcome/ }).waitFor()
}

describe('sign-up, invite and the viewer journey', () => {
  it('signs up a new user, who becomes admin of a new team', async () => {
    const page = await newPage()
    await page.goto(`${base}/`)
    await page.waitForURL(/\/sign-in\?redirect=/)
    await shot(page, '01-sign-in')
    await page.getByRole('link', { name: 'Create an account and a team' }).click()
    await page.waitForURL(`${base}/sign-up`)
    await page.fill('input[name=name]', admin.name)
    await page.fill('input[name=email]', admin.email)
    await page.fill('input[name=teamName]', teamName)
    await page.fill('input[name=password]', admin.password)
    await page.fill('input[name=confirm]', admin.password)
    await shot(page, '02-sign-up')
    await page.click('[data-test=sign-up]')
    await page.waitForURL(`${base}/`)
    await expect(page.getByRole('heading', { name: `Welcome, ${admin.name}` }).isVisible()).resolves.toBe(true)
    await expect(page.locator('[data-test=team-card]').innerText()).resolves.toContain(teamName)
    await expect(page.locator('[data-test=my-role]').innerText()).resolves.toBe('Admin')
    await shot(page, '03-home-admin')
    await page.context().close()
  })

  it('lets the admin invite a viewer and read the invite in the dev outbox', async () => {
    const page = await newPage()
    await signIn(page, admin)
    await page.locator('.side-nav').getByText('Team members').click()
    await page.waitForURL(`${base}/team/members`)
    await page.fill('input[name=invite-email]', viewer.email)
    await expect(page.locator('[data-test=invite-role]').innerText()).resolves.toContain('Viewer')
    await page.click('[data-test=send-invite]')
    const pending = page.locator('[data-test=invites-table]')
    await pending.getByText(viewer.email).waitFor()
    await shot(page, '04-members-admin')

    await page.locator('.side-nav').getByText('Sent e-mail (dev)').click()
    await page.waitForURL(`${base}/dev/outbox`)
    await page.locator('[data-test=outbox-table]').getByText(viewer.email).first().click()
    const link = page.locator('[data-test=outbox-message] [data-test=outbox-link]').first()
    await link.waitFor()
    inviteLink = (await link.getAttribute('href')) ?? ''
    expect(inviteLink).toMatch(/\/accept-invite\?token=/)
    await shot(page, '05-outbox')
    await page.context().close()
  })

  it('accepts the invite in a fresh browser as a new user and lands as a viewer', async () => {
    const page = await newPage()
    // the message links to PUBLIC_URL; keep the path and query, on the server under test
    const target = new URL(inviteLink)
    await page.goto(`${base}${target.pathname}${target.search}`)
    const offer = page.locator('[data-test=invite-offer]')
    await offer.waitFor()
    await expect(offer.innerText()).resolves.toMatch(new RegExp(`${teamName}[\\s\\S]*Viewer`))
    await page.fill('input[name=name]', viewer.name)
    await page.fill('input[name=password]', viewer.password)
    await page.fill('input[name=confirm]', viewer.password)
    await shot(page, '06-accept-invite')
    await page.click('[data-test=accept-invite]')
    await page.waitForURL(`${base}/`)
    await expect(page.locator('[data-test=my-role]').innerText()).resolves.toBe('Viewer')
    await page.context().close()
  })

  it('signs the viewer in and shows read-only screens', async () => {
    const page = await newPage()
    await signIn(page, viewer)
    await expect(page.locator('[data-test=team-card]').innerText()).resolves.toContain(teamName)
    await shot(page, '07-home-viewer')
    await expect(page.locator('.side-nav').getByText('Sent e-mail (dev)').count()).resolves.toBe(0)

    await page.locator('.side-nav').getByText('Team members').click()
    await page.waitForURL(`${base}/team/members`)
    const table = page.locator('[data-test=members-table]')
    await table.getByText(admin.email).waitFor()
    await expect(table.innerText()).resolves.toContain(viewer.email)
    await expect(page.locator('[data-test=invite-card]').count()).resolves.toBe(0)
    await expect(page.locator('[data-test=send-invite]').count()).resolves.toBe(0)
    await expect(page.getByRole('button', { name: 'Remove' }).count()).resolves.toBe(0)
    await expect(page.getByText('Only team admins can invite people').isVisible()).resolves.toBe(true)
    await shot(page, '08-members-viewer')

    // a viewer still owns their account: switch to imperial units
    await page.locator('.side-nav').getByText('My account').click()
    await page.waitForURL(`${base}/account`)
    await page.getByText('Imperial').click()
    await page.getByRole('button', { name: 'Save profile' }).click()
    await page.getByText('Saved').waitFor()
    await shot(page, '08b-account-viewer')

    // the admin-only outbox is out of reach even by address
    await page.goto(`${base}/dev/outbox`)
    await page.waitForURL(`${base}/`)
    await page.context().close()
  })

  it('fits the members screen on a tablet (820 x 1180) with the menu folded away', async () => {
    const page = await newPage(820, 1180)
    await signIn(page, admin)
    await page.goto(`${base}/team/members`)
    await page.locator('[data-test=members-table]').getByText(viewer.email).waitFor()
    await expect(page.locator('.side-nav').isVisible()).resolves.toBe(false)
    const overflowPx = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)
    expect(overflowPx).toBeLessThanOrEqual(0)
    await shot(page, '09-members-tablet')
    await page.click('[data-test=open-menu]')
    await page.locator('.side-nav').getByText('Team members').waitFor()
    // let the drawer finish sliding in before the picture
    await page.locator('.el-drawer').evaluate((el) => Promise.all(el.getAnimations().map((a) => a.finished)))
    await shot(page, '10-menu-tablet')
    await page.context().close()
  })
})
