// The alert log from the safety officer's seat: a notice that failed for good shows at once in the header on any
// page, leads to the alert log with the queue and the oldest due age, and Retry puts it back in the queue (its second
// attempt on record); on a desk and on a 390 px phone, with nothing scrolling sideways.
import mysql from 'mysql2/promise'
import { createECDH, randomBytes } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launchBrowser, newContext, screenshot, signInPage, type Browser, type Page } from '../support/browser'
import { signedIn, type ApiClient } from '../support/api'
import { createTestAirfield, newUser, waitFor, windProfile } from '../support/alerts'

const DESK = { width: 1366, height: 900 }
const PHONE = { width: 390, height: 844 }

let browser: Browser
let conn: mysql.Connection
let safetyApi: ApiClient
let code = ''
let failedId = 0
let lostName = ''

beforeAll(async () => {
  browser = await launchBrowser()
  conn = await mysql.createConnection({ uri: process.env.DATABASE_URL!, timezone: 'Z' })
  safetyApi = await signedIn('safety')
  // Runway 18/36, wind 220° at 30 kt: 19.28 kt crosswind on 18 (FAA crosswind chart worked example), over an 18 kt limit.
  code = await createTestAirfield({ 18: 180, 36: 360 }, 'Failed notice field')
  await safetyApi.put(`/api/limits/airfields/${code}`, { values: { maxCrosswindKt: 18, maxTailwindKt: 30 }, reason: 'Browser test: crosswind limit' })
  await safetyApi.put(`/api/limits/airfields/${code}`, { designator: '36', values: { maxCrosswindKt: 25 }, reason: 'Browser test: runway 36 clear' })
  // One follower by e-mail (delivered) and one by push on a device the push service does not know: a 404 from the
  // push service (RFC 8030 §7.3: the subscription is gone) fails the notice at once, without retries.
  const admin = await signedIn('admin')
  const mailer = await newUser(admin, 'pilot', 'log-mail')
  const lost = await newUser(admin, 'pilot', 'log-lost')
  lostName = 'Probe log-lost'
  expect((await mailer.client.put(`/api/subscriptions/${code}`, { email: true, push: false })).status).toBe(200)
  expect((await lost.client.put(`/api/subscriptions/${code}`, { email: false, push: true })).status).toBe(200)
  const ecdh = createECDH('prime256v1')
  ecdh.generateKeys()
  const standin = `http://127.0.0.1:${process.env.VEERLINE_PUSH_PORT || 8443}`
  await conn.query('INSERT INTO push_subscriptions (user_id, endpoint, p256dh, auth, label) VALUES (?, ?, ?, ?, ?)', [lost.id,
    `${standin}/push/00000000-0000-4000-8000-000000000000`, ecdh.getPublicKey().toString('base64url'), randomBytes(16).toString('base64url'), 'Lost phone'])
  const filed = await (await signedIn('dispatcher')).post(`/api/airfields/${code}/profiles`, windProfile(220, 30))
  expect(filed.status, JSON.stringify(filed.body)).toBe(201)
  const failed = await waitFor('the push notice to fail', async () => {
    const log = await safetyApi.get(`/api/alerts?airfield=${code}`)
    return (log.body.alerts ?? []).flatMap((a: { deliveries: { id: number, state: string, channel: string }[] }) => a.deliveries)
      .find((d: { state: string, channel: string }) => d.state === 'failed' && d.channel === 'push')
  }, 30_000)
  failedId = failed.id
}, 90_000)

afterAll(async () => {
  await browser?.close()
  await conn?.end()
})

/** Elements that scroll sideways inside the page (an overflow-x container wider inside than out), and the page itself. */
async function sideways(page: Page) {
  return page.evaluate(() => {
    const out: string[] = []
    if (document.documentElement.scrollWidth > document.documentElement.clientWidth) out.push(`page ${document.documentElement.scrollWidth}px`)
    for (const el of document.querySelectorAll('main *')) {
      const ox = getComputedStyle(el).overflowX
      if ((ox === 'auto' || ox === 'scroll') && el.scrollWidth > el.clientWidth + 1) out.push(`${el.tagName.toLowerCase()}.${el.className} ${el.scrollWidth}>${el.clientWidth}px`)
    }
    return out
  })
}

describe('the alert log from the safety office', () => {
  for (const [name, viewport] of [['desk', DESK], ['phone', PHONE]] as const) {
    it(`${name} ${viewport.width} px: the failed notice shows in the header at once, leads to the log with the queue; nothing scrolls sideways`, async () => {
      const phone = viewport.width < 500
      const { context } = await newContext(browser, { viewport, ...(phone ? { isMobile: true, hasTouch: true } : {}) })
      const page = await context.newPage()
      await signInPage(page, 'safety')
      await page.waitForLoadState('networkidle')
      // On the first page after signing in, before any refresh of the count: visible, in plain words.
      const notice = page.locator('[data-test=alerts-failed]')
      await notice.waitFor({ state: 'visible', timeout: 15_000 })
      expect(await notice.textContent()).toMatch(/\d+ alert notices? not delivered/)
      const box = await notice.boundingBox()
      expect(box!.x + box!.width).toBeLessThanOrEqual(viewport.width)
      await screenshot(page, `alert-log-notice-${name}`)
      // The notice leads to the alerts with a notice not delivered, each with its Retry.
      await Promise.all([page.waitForURL(u => u.pathname === '/alerts/log' && u.searchParams.get('delivery') === 'failed'), notice.click()])
      await page.waitForLoadState('networkidle')
      await expect.poll(() => page.locator('[data-test=log-delivery]', { hasText: 'Failed' }).count()).toBeGreaterThan(0)
      await page.goto(`/alerts/log?airfield=${code}&delivery=failed`)
      await page.waitForLoadState('networkidle')
      await screenshot(page, `alert-log-${name}`)
      const queue = page.locator('[data-test=log-queue]')
      expect(await queue.textContent()).toMatch(/oldest/i)
      const row = page.locator(`[data-test=log-delivery][data-delivery="${failedId}"]`)
      await row.waitFor({ state: 'visible' })
      expect(await row.textContent()).toContain('Failed')
      // Who it was for in words (the device the push service no longer knows was removed with the failure).
      expect(await row.textContent()).toContain(`${lostName} (device no longer registered)`)
      // And what a retry can and cannot do for a device that is gone.
      expect(await row.locator('[data-test=log-device-gone]').isVisible()).toBe(true)
      const retry = row.getByRole('button', { name: /retry/i })
      const rbox = await retry.boundingBox()
      expect(rbox, 'the Retry button is on screen').not.toBeNull()
      expect(rbox!.x + rbox!.width, 'the Retry button is within the screen width').toBeLessThanOrEqual(viewport.width)
      expect(await sideways(page)).toEqual([])
      await context.close()
    }, 120_000) // a hang guard for a loaded machine, not a speed check
  }

  it('Retry puts the failed notice back in the queue and its next attempt is on record', async () => {
    const { context } = await newContext(browser, { viewport: PHONE, isMobile: true, hasTouch: true })
    const page = await context.newPage()
    await signInPage(page, 'safety')
    await page.goto(`/alerts/log?airfield=${code}`)
    await page.waitForLoadState('networkidle')
    const row = page.locator(`[data-test=log-delivery][data-delivery="${failedId}"]`)
    await row.getByRole('button', { name: /retry/i }).click()
    // The worker takes it again at once; the device is still unknown to the push service, so it fails again, and the
    // log shows the second attempt (the audit log has the retry).
    await expect.poll(async () => {
      const log = await safetyApi.get(`/api/alerts?airfield=${code}`)
      const d = log.body.alerts.flatMap((a: { deliveries: unknown[] }) => a.deliveries).find((x: { id: number }) => x.id === failedId)
      return d?.tries?.length ?? 0
    }, { timeout: 30_000 }).toBeGreaterThanOrEqual(2)
    await page.getByRole('button', { name: 'Refresh' }).click()
    await page.waitForLoadState('networkidle')
    await expect.poll(async () => row.textContent(), { timeout: 15_000 }).toMatch(/2 attempts|Attempts\s*2/)
    const audit = await (await signedIn('admin')).get(`/api/audit?entity=outbox&limit=20`)
    expect(audit.status).toBe(200)
    expect(JSON.stringify(audit.body)).toContain('outbox.retry')
    await screenshot(page, 'alert-log-retried-phone')
    await context.close()
  }, 120_000) // a hang guard, not a speed check
})
