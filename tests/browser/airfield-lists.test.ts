// The briefing and airfield lists from a pilot's and a dispatcher's seat: a page at a time, search as one types,
// the followed airfields first, all of it in the URL, and nothing wider than a 390 px phone.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launchBrowser, newContext, signInPage, screenshot, type Browser } from '../support/browser'
import { signedIn } from '../support/api'
import { closeDb, makeAirfield } from '../support/airfields'

let browser: Browser
// 25 airfields whose names carry a tag no other has: one more than a page (24).
const tag = `Ls${Math.random().toString(36).slice(2, 7)}`
let codes: string[] = []
beforeAll(async () => {
  browser = await launchBrowser()
  const dispatcher = await signedIn('dispatcher')
  for (let i = 0; i < 25; i++) codes.push((await makeAirfield(dispatcher, { name: `${tag} ${String(i).padStart(2, '0')}` })).code)
  codes = codes.sort()
})
afterAll(async () => {
  await (await signedIn('pilot')).delete(`/api/subscriptions/${codes[20]}`)
  await browser?.close()
  await closeDb()
})

const wideBy = (page: import('playwright-core').Page) => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)

describe('the lists a page at a time', () => {
  it('a pilot on a phone pages through a search, narrows it as they type, and finds the airfields they follow first', async () => {
    const { context } = await newContext(browser, { viewport: { width: 390, height: 844 } })
    const page = await context.newPage()
    await signInPage(page, 'pilot')
    await page.goto(`/briefings?q=${tag}`)
    await page.waitForLoadState('networkidle')
    const cards = page.locator('[data-test=briefing-list] a[data-code]')
    await expect.poll(() => cards.count()).toBe(24)
    expect(await page.locator('[data-test=briefing-list-count]').textContent()).toContain('Airfields 1 to 24 of 25')
    expect(await page.locator('[data-test=briefing-list-pages]').textContent()).toContain('Page 1 of 2 (25 airfields)')
    expect(await wideBy(page)).toBeLessThanOrEqual(0)
    await screenshot(page, 'briefing-list-390-page-1')

    await page.locator('[data-test=briefing-list-pages] button', { hasText: 'Next' }).click()
    await page.waitForURL(/page=2/)
    await expect.poll(() => cards.count()).toBe(1)
    expect(await cards.first().getAttribute('data-code')).toBe(codes[24])
    expect(await page.locator('[data-test=briefing-list-count]').textContent()).toContain('Airfield 25 of 25')

    // Typing narrows the list (after a short pause) and starts again at page 1.
    await page.fill('[data-test=airfield-search] input[type=search]', codes[3]!.toLowerCase())
    await page.waitForURL(url => url.searchParams.get('q') === codes[3]!.toLowerCase() && !url.searchParams.has('page'))
    await expect.poll(() => cards.first().getAttribute('data-code')).toBe(codes[3])
    expect(await cards.count()).toBe(1)

    // Following one puts it first, marked; "Only airfields I follow" keeps only those.
    expect((await (await signedIn('pilot')).put(`/api/subscriptions/${codes[20]}`, { email: false, push: false })).status).toBe(200)
    await page.goto(`/briefings?q=${tag}`)
    await page.waitForLoadState('networkidle')
    await expect.poll(() => cards.first().getAttribute('data-code')).toBe(codes[20])
    expect(await cards.first().locator('[data-test=followed]').textContent()).toContain('following')
    await page.locator('[data-test=only-followed]').check()
    await page.waitForURL(/followed=1/)
    await expect.poll(() => cards.count()).toBe(1)
    await screenshot(page, 'briefing-list-390-followed')

    // A search that finds nothing says so in words.
    await page.goto(`/briefings?q=${tag}zz`)
    await page.waitForLoadState('networkidle')
    expect(await page.locator('[data-test=briefing-list-empty]').textContent()).toContain(`No airfield's code or name contains “${tag}zz”`)
    await context.close()
  })

  it('a dispatcher at a desk searches the airfield table and pages it; the URL keeps the place', async () => {
    const { context } = await newContext(browser, { viewport: { width: 1280, height: 900 } })
    const page = await context.newPage()
    await signInPage(page, 'dispatcher')
    await page.goto(`/airfields?q=${tag}&page=2`)
    await page.waitForLoadState('networkidle')
    const rows = page.locator('[data-test=airfield-list] tbody tr')
    await expect.poll(() => rows.count()).toBe(1)
    expect(await rows.first().textContent()).toContain(codes[24])
    await page.locator('[data-test=airfield-list-pages] button', { hasText: 'Previous' }).click()
    await page.waitForURL(url => !url.searchParams.has('page'))
    await expect.poll(() => rows.count()).toBe(24)
    expect(await page.locator('[data-test=airfield-list-count]').textContent()).toContain('Airfields 1 to 24 of 25')
    await screenshot(page, 'airfield-list-desk')
    await context.close()
  })
})
