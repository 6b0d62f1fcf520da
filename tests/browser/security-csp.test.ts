// The Content-Security-Policy (issue 10, point 4) checked where it bites: in the browser. Pages must run under it
// with no violation reported, and the mailbox stand-in's HTML preview must stay in a sandboxed frame.
// A violation is what the browser reports as a `securitypolicyviolation` event (CSP Level 3, W3C).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launchBrowser, newContext, signInPage, screenshot, type Browser, type Page } from '../support/browser'
import { ApiClient, signedIn } from '../support/api'

let browser: Browser
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

/** Records every CSP violation the page (and its frames) report, from the very first script on. */
async function watchViolations(page: Page) {
  await page.addInitScript(() => {
    const w = window as unknown as { __cspViolations: string[] }
    w.__cspViolations = []
    document.addEventListener('securitypolicyviolation', (e) => {
      w.__cspViolations.push(`${e.violatedDirective} ${e.blockedURI}`)
    })
  })
  const consoleErrors: string[] = []
  page.on('console', (m) => {
    if (m.type() === 'error' && /Content Security Policy/i.test(m.text())) consoleErrors.push(m.text())
  })
  return async () => [...await page.evaluate(() => (window as unknown as { __cspViolations: string[] }).__cspViolations), ...consoleErrors]
}

describe('the Content-Security-Policy in the browser', () => {
  it('pages of every role run with no violation: scripts, styles and fonts all come from our own origin', async () => {
    const visits = {
      pilot: ['/briefings', '/briefings/XCST', '/alerts'],
      dispatcher: ['/airfields', '/airfields/XCST/file', '/tokens'],
      safety: ['/safety', '/audit'],
      admin: ['/admin/users', '/mailbox'],
    } as const
    for (const [role, paths] of Object.entries(visits)) {
      const { context } = await newContext(browser)
      const page = await context.newPage()
      const violations = await watchViolations(page)
      await signInPage(page, role as keyof typeof visits)
      for (const path of paths) {
        await page.goto(path)
        await page.waitForLoadState('networkidle')
        expect(await violations(), `${role} on ${path}`).toEqual([])
      }
      await context.close()
    }
  })

  it('the mailbox preview frame is sandboxed, shows the message, runs no script, and reset links stay masked', async () => {
    // A reset request puts a message with a token link in the mailbox stand-in.
    const admin = await signedIn('admin')
    const email = `csp-check-${Date.now()}@veerline.example`
    expect((await admin.post('/api/users', { email, name: 'Frame Check', role: 'pilot', password: 'a-frame-password' })).status).toBe(201)
    expect((await new ApiClient().post('/api/password-resets', { email })).status).toBe(202)
    await expect.poll(async () => (await admin.get(`/api/mailbox?to=${encodeURIComponent(email)}`)).body.messages.length, { timeout: 20_000 }).toBeGreaterThan(0)

    const { context } = await newContext(browser)
    const page = await context.newPage()
    const violations = await watchViolations(page)
    await signInPage(page, 'admin')
    await page.goto('/mailbox')
    await page.fill('#mailbox-to', email)
    await page.press('#mailbox-to', 'Tab')
    const mail = page.locator('[data-test=mail]').first()
    await expect.poll(() => mail.textContent(), { timeout: 10_000 }).toMatch(/reset/i)
    // The list is collapsed: open the message first.
    await mail.locator('[data-test=mail-summary]').click()
    await mail.getByRole('button', { name: /HTML/ }).click()
    const frame = mail.locator('iframe')
    // Sandboxed: no scripts, no same-origin access, no top navigation; only popups (a link opens a new tab) are
    // allowed (HTML Living Standard, iframe sandbox tokens).
    const tokens = (await frame.getAttribute('sandbox'))!.split(/\s+/).filter(Boolean).sort()
    expect(tokens).toEqual(['allow-popups', 'allow-popups-to-escape-sandbox'])
    // Every link of the preview opens in a new tab, without a handle back to this page.
    const link = page.frameLocator('[data-test=mail] iframe').first().locator('a').first()
    expect(await link.getAttribute('target')).toBe('_blank')
    expect(await link.getAttribute('rel')).toMatch(/noopener/)
    const body = page.frameLocator('[data-test=mail] iframe').first().locator('body')
    await expect.poll(() => body.textContent()).toMatch(/reset your Veerline password/)
    // The link is there, but its address is masked until an admin reveals it.
    const href = await page.frameLocator('[data-test=mail] iframe').first().locator('a').first().getAttribute('href')
    expect(href).toMatch(/link hidden/)
    expect(href).not.toMatch(/\/reset\/[A-Za-z0-9_-]{20,}/)
    await screenshot(page, 'mailbox-frame-under-csp')
    // The admin may reveal the links; then the frame's link is the real one-time address.
    await page.locator('[data-test=mailbox-reveal]').check()
    await expect.poll(async () => {
      const show = mail.getByRole('button', { name: 'Show HTML' })
      if (await show.count()) await show.click()
      return page.frameLocator('[data-test=mail] iframe').first().locator('a').first().getAttribute('href')
    }, { timeout: 15_000 }).toMatch(/\/reset\/[A-Za-z0-9_-]{20,}|token=[A-Za-z0-9_-]{20,}/)
    expect(await violations()).toEqual([])
    await context.close()
  })
})
