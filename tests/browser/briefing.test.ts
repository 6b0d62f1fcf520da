import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launchBrowser, newContext, signInPage, screenshot, type Browser, type Page } from '../support/browser'
import { demoDay, signedIn } from '../support/api'

let browser: Browser
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

async function openBriefing(page: Page, code: string) {
  await page.goto(`/briefings/${code}`)
  await page.waitForLoadState('networkidle')
  await page.locator('[data-test=briefing-header]').waitFor()
}

describe('the briefing page', () => {
  it('a pilot opens a demo briefing from the list: rings, runway axis and one point per level; every request stays local', async () => {
    const { context, requests } = await newContext(browser, { viewport: { width: 1280, height: 900 } })
    const page = await context.newPage()
    await signInPage(page, 'pilot')
    await page.waitForURL(url => url.pathname === '/briefings')
    await page.locator('[data-test=briefing-list] a[data-code=XVAL]').click()
    await page.waitForURL(/\/briefings\/XVAL$/)
    await page.waitForLoadState('networkidle')
    // Brief runway 22: the picker puts it into the URL and the page details that end.
    await page.locator('[data-test=pickers] [data-end="22"]').click()
    await page.waitForURL(/end=22/)
    const api = await (await signedIn('pilot')).get('/api/airfields/XVAL/briefing')
    const b = api.body.briefing
    const card = page.locator('[data-test=runway-card][data-designator="22"]')
    const svg = card.locator('[data-test=polar-svg]')
    // The display is drawn once the page has hydrated: wait for it rather than count at once.
    await expect.poll(() => svg.locator('[data-test=polar-ring]').count(), { timeout: 15_000 }).toBeGreaterThanOrEqual(2)
    expect((await svg.locator('[data-test=polar-ring-label]').first().textContent())?.trim()).toMatch(/^\d+ kt$/)
    expect(await svg.locator('[data-test=polar-axis] line').count()).toBeGreaterThan(0)
    const axisText = (await svg.locator('[data-test=polar-axis] text').allTextContents()).map(t => t.trim())
    expect(axisText).toEqual(['22', '04'])
    expect(await svg.locator('[data-test=polar-point]').count()).toBe(b.levels.length)
    expect(await svg.locator('[data-test=polar-compass]').count()).toBe(4)
    expect(await page.locator('[data-test=caution]').first().textContent()).toContain('Advisory only')
    await screenshot(page, 'briefing-desktop-xval')
    const foreign = requests.filter(u => !/^(https?|wss?):\/\/127\.0\.0\.1(:\d+)?\//.test(u) && !u.startsWith('data:'))
    expect(foreign).toEqual([])
    await context.close()
  })

  it('focusing a level reads it out and draws its legs; the table matches the API', async () => {
    const { context } = await newContext(browser, { viewport: { width: 1280, height: 900 } })
    const page = await context.newPage()
    await signInPage(page, 'pilot')
    await openBriefing(page, 'XVAL?end=22')
    const b = (await (await signedIn('pilot')).get('/api/airfields/XVAL/briefing')).body.briefing
    const end = b.runwayEnds.find((e: { designator: string }) => e.designator === '22')
    const card = page.locator('[data-test=runway-card][data-designator="22"]')
    await card.locator('[data-test=polar-point][data-level-index="3"]').focus()
    const level = b.levels[3]
    const readout = card.locator('[data-test=polar-readout]')
    await expect.poll(() => readout.textContent()).toContain(`${Math.round(level.heightAglM / 0.3048)} ft AGL`)
    const text = (await readout.textContent())!
    expect(text).toContain(`at ${Math.round(level.speedKt)} kt`)
    expect(text).toContain(`from ${String(Math.round(level.directionDeg)).padStart(3, '0')}°T`)
    const head = end.levels[3].headwindKt
    expect(text).toContain(`${Math.round(Math.abs(head))} kt ${head >= 0 ? 'headwind' : 'tailwind'}`)
    expect(await readout.getAttribute('aria-live')).toBe('polite')
    expect(await card.locator('[data-test=polar-leg-head]').count()).toBe(1)
    expect(await card.locator('[data-test=polar-leg-cross]').count()).toBe(1)

    const rows = card.locator('[data-test=polar-table] tbody tr')
    expect(await rows.count()).toBe(b.levels.length)
    for (let i = 0; i < b.levels.length; i++) {
      const row = rows.nth(i)
      const l = b.levels[i]
      expect((await row.locator('[data-col=height]').textContent())!.trim()).toBe(String(Math.round(l.heightAglM / 0.3048)))
      expect((await row.locator('[data-col=speed]').textContent())!.trim()).toMatch(new RegExp(`^${Math.round(l.speedKt)}`))
      const hw = Math.round(end.levels[i].headwindKt)
      expect((await row.locator('[data-col=headwind]').textContent())!.trim()).toBe(String(hw === 0 ? 0 : hw))
      const cw = Math.round(end.levels[i].crosswindKt)
      expect((await row.locator('[data-col=crosswind]').textContent())!.trim()).toBe(String(cw === 0 ? 0 : cw))
    }
    await context.close()
  })

  it('a read receipt goes round: the pilot marks it read, the dispatcher sees it', async () => {
    const { context } = await newContext(browser)
    const page = await context.newPage()
    await signInPage(page, 'pilot')
    await openBriefing(page, 'XVAL')
    await page.locator('[data-test=mark-read]').click()
    await page.locator('[data-test=my-receipt]').waitFor()
    await context.close()

    const d = await newContext(browser)
    const dpage = await d.context.newPage()
    await signInPage(dpage, 'dispatcher')
    await openBriefing(dpage, 'XVAL')
    const id = await dpage.locator('[data-test=receipts-table] tbody tr').first().getAttribute('data-profile-id')
    const row = dpage.locator('[data-test=receipts-table] tbody tr').first()
    expect(await row.getAttribute('data-user-email')).toBe('pilot@veerline.example')
    expect(await row.getAttribute('data-stale')).toBe('false')
    expect(Number(id)).toBeGreaterThan(0)
    await d.context.close()
  })

  it('prints: validity, source, time of printing and the caution; the screen chrome is hidden', async () => {
    const { context } = await newContext(browser, { viewport: { width: 1280, height: 900 } })
    const page = await context.newPage()
    await signInPage(page, 'pilot')
    await openBriefing(page, 'XCST')
    await page.emulateMedia({ media: 'print' })
    const header = page.locator('[data-test=print-header]')
    expect(await header.isVisible()).toBe(true)
    const text = (await header.textContent())!
    expect(text).toMatch(/printed \d{4}-\d{2}-\d{2} \d{2}:\d{2}Z/)
    expect(text).toMatch(/valid \d{4}-\d{2}-\d{2} \d{2}:\d{2}Z to \d{4}-\d{2}-\d{2} \d{2}:\d{2}Z/)
    expect(text).toMatch(/doppler-lidar|model-forecast/)
    expect(text).toContain('Advisory only')
    expect(await page.locator('header.no-print').isVisible()).toBe(false)
    expect(await page.locator('[data-test=unit-picker]').isVisible()).toBe(false)
    // One end on paper (the chosen one), its polar display with it; no interaction hint.
    expect(await page.locator('.polar-pair:visible').count()).toBe(1)
    expect(await page.getByText('Select a level').isVisible()).toBe(false)
    const pdf = await page.pdf({ format: 'A4' })
    const pages = (pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length
    expect(pages).toBeGreaterThanOrEqual(1)
    expect(pages).toBeLessThanOrEqual(2)
    await screenshot(page, 'briefing-print-xcst')
    await context.close()
  })

  it('phone width: the briefing fits 390 px without sideways scrolling', async () => {
    const { context } = await newContext(browser, { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true })
    const page = await context.newPage()
    await signInPage(page, 'pilot')
    // The midday radiosonde of the demo day reaches the upper troposphere: convective context is shown.
    const day = await demoDay(await signedIn('pilot'))
    await openBriefing(page, `XHGH?at=${day}T12:30:00Z`)
    expect(await page.locator('[data-test=convective]').textContent()).toContain('helicity')
    expect(await page.locator('[data-test=polar-storm]').count()).toBeGreaterThan(0)
    const scrollWidth = await page.evaluate(() => document.documentElement.scrollWidth)
    expect(scrollWidth).toBeLessThanOrEqual(390)
    await page.locator('[data-test=runway-card] [data-test=polar-point]').first().tap()
    expect(await page.locator('[data-test=polar-readout]').first().textContent()).toContain('AGL')
    await screenshot(page, 'briefing-phone-xhgh')
    await context.close()
  })
})
