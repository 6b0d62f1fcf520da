// The invite flow an admin walks: invite from the Users page, open the link from the mailbox stand-in in a new tab,
// set the password, land on the welcome page; the Users table stays usable with a very long e-mail at desk and phone width.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launchBrowser, newContext, screenshot, signInPage, type Browser, type Page } from '../support/browser'

let browser: Browser
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

/** The row's role picker and Disable button lie inside the viewport (nothing pushed off to the right). */
async function controlsOnScreen(page: Page, email: string) {
  const row = page.locator(`[data-test=user-row][data-email="${email}"]`)
  await row.scrollIntoViewIfNeeded()
  const width = page.viewportSize()!.width
  for (const control of [row.locator('select'), row.getByRole('button', { name: /Disable|Enable/ })]) {
    const box = (await control.boundingBox())!
    expect(box.x).toBeGreaterThanOrEqual(0)
    expect(box.x + box.width).toBeLessThanOrEqual(width)
  }
  // The whole address stays available (wrapped, and as the cell's title).
  expect(await row.locator(`[title="${email}"]`).textContent()).toContain(email)
}

describe('invitations in the browser', () => {
  it('an admin invites from the Users page; the mailbox link opens in a new tab; the person sets a password and is welcomed', async () => {
    // A very long address (RFC 5321 allows 64 characters before the @), to check the Users table keeps its controls.
    const email = `a-rather-long-mailbox-name-for-the-users-table-${Date.now()}@operations.long-subdomain.veerline.example`
    const { context } = await newContext(browser, { viewport: { width: 1280, height: 900 } })
    const admin = await context.newPage()
    await signInPage(admin, 'admin')
    await admin.waitForURL(u => u.pathname === '/admin/users')
    await admin.waitForLoadState('networkidle')
    const form = admin.locator('[data-test=invite-form]')
    await form.locator('#inv-name').fill('Welcomed Dispatcher')
    await form.locator('#inv-email').fill(email)
    await form.locator('#inv-role').selectOption('dispatcher')
    await form.getByRole('button', { name: 'Send invitation' }).click()
    await expect.poll(() => form.textContent()).toContain(`Invitation sent to ${email}`)
    const pending = admin.locator(`[data-test=pending-invitation][data-email="${email}"]`)
    await expect.poll(() => pending.count()).toBe(1)
    expect(await pending.textContent()).toContain('Dispatcher')
    await controlsOnScreen(admin, email)
    await screenshot(admin, 'users-invite-desk')

    // The mailbox: collapsed, searched by recipient; reveal the link (audited) and open it.
    await admin.goto('/mailbox')
    await admin.waitForLoadState('networkidle')
    await admin.locator('[data-test=mailbox-reveal]').check()
    await admin.fill('#mailbox-to', email)
    await admin.press('#mailbox-to', 'Tab')
    // The search leaves this person's one message (the list held others until it applied).
    await expect.poll(async () => {
      await admin.locator('button', { hasText: 'Refresh' }).click()
      await admin.waitForLoadState('networkidle')
      return admin.locator('[data-test=mail]').count()
    }, { timeout: 30_000, interval: 1000 }).toBe(1)
    const mail = admin.locator('[data-test=mail]', { hasText: email }).first()
    expect(await mail.textContent()).toContain('You are invited')
    await mail.locator('[data-test=mail-summary]').click()
    const link = mail.locator('a[href*="/invite/"]')
    await expect.poll(() => link.count(), { timeout: 10_000 }).toBe(1)
    expect(await link.getAttribute('target')).toBe('_blank')
    expect(await link.getAttribute('rel')).toMatch(/noopener/)
    await screenshot(admin, 'mailbox-invitation-desk')
    const [person] = await Promise.all([context.waitForEvent('page'), link.click()])
    await person.waitForLoadState('networkidle')
    expect(new URL(person.url()).pathname).toMatch(/^\/invite\/[A-Za-z0-9_-]{43}$/)
    await expect.poll(() => person.locator('body').textContent()).toContain(email)
    await person.fill('#new-password', 'welcome-page-password-1')
    await person.fill('#repeat-password', 'welcome-page-password-1')
    await Promise.all([
      person.waitForURL(u => u.pathname === '/welcome', { timeout: 20_000 }),
      person.getByRole('button', { name: 'Set password and sign in' }).click(),
    ])
    const welcome = person.locator('[data-test=welcome]')
    await expect.poll(() => welcome.textContent()).toContain('Welcome to Veerline, Welcomed Dispatcher')
    // Follow one airfield from the welcome page; the device link leads to the push setup.
    const field = person.locator('[data-test=welcome-airfield][data-code=XVAL]')
    await field.locator('[data-test=welcome-follow]').click()
    await expect.poll(() => field.locator('[data-test=welcome-follow]').getAttribute('aria-pressed')).toBe('true')
    expect(await person.locator('[data-test=welcome-device]').getAttribute('href')).toBe('/device')
    await screenshot(person, 'welcome-desk')
    await context.close()
  })

  it('at 390 px the Users page keeps the role and Disable controls of a long e-mail on screen', async () => {
    const { context } = await newContext(browser, { viewport: { width: 390, height: 844 } })
    const page = await context.newPage()
    await signInPage(page, 'admin')
    await page.waitForURL(u => u.pathname === '/admin/users')
    await page.waitForLoadState('networkidle')
    await screenshot(page, 'users-390')
    await expect.poll(() => page.locator('[data-test=user-row]').count(), { timeout: 10_000 }).toBeGreaterThan(4)
    const email = await page.locator('[data-test=user-row]').evaluateAll(rows =>
      rows.map(r => r.getAttribute('data-email')!).sort((a, b) => b.length - a.length)[0]!)
    expect(email.length).toBeGreaterThan(60)
    await controlsOnScreen(page, email)
    // Nothing wider than the screen.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390)
    await screenshot(page, 'users-390')
    await context.close()
  })
})
