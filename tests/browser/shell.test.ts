import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launchBrowser, newContext, signInPage, screenshot, type Browser } from '../support/browser'

let browser: Browser
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

const homes = {
  admin: { path: '/admin/users', heading: 'Users' },
  dispatcher: { path: '/airfields', heading: 'Airfields' },
  pilot: { path: '/briefings', heading: 'Briefings' },
  safety: { path: '/safety', heading: 'Limits' },
} as const

describe('the shell', () => {
  it('sends a signed-out visitor to sign-in', async () => {
    const { context } = await newContext(browser)
    const page = await context.newPage()
    await page.goto('/briefings')
    await page.waitForURL(/\/sign-in/)
    expect(await page.locator('h1').textContent()).toContain('Veerline')
    await context.close()
  })

  for (const [role, home] of Object.entries(homes)) {
    it(`${role} signs in and lands on their home page; every request stays on 127.0.0.1`, async () => {
      const { context, requests } = await newContext(browser)
      const page = await context.newPage()
      await signInPage(page, role as keyof typeof homes)
      await page.waitForURL(url => url.pathname === home.path)
      await expect.poll(() => page.locator('main h1').first().textContent()).toContain(home.heading)
      await page.waitForLoadState('networkidle')
      await screenshot(page, `home-${role}`)
      expect(requests.length).toBeGreaterThan(0)
      const foreign = requests.filter(u => !/^(https?|wss?):\/\/127\.0\.0\.1(:\d+)?\//.test(u) && !u.startsWith('data:'))
      expect(foreign).toEqual([])
      await context.close()
    })
  }

  it('shows only the navigation a pilot can use', async () => {
    const { context } = await newContext(browser)
    const page = await context.newPage()
    await signInPage(page, 'pilot')
    const labels = await page.locator('header nav[aria-label="Main"] a').allTextContents()
    expect(labels.map(l => l.trim())).not.toContain('Users')
    expect(labels.map(l => l.trim())).not.toContain('Limits')
    await context.close()
  })
})
