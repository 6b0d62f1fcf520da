import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launchBrowser, newContext, signInPage, screenshot, type Browser } from '../support/browser'
import { signedIn } from '../support/api'
import { makeAirfield } from '../support/airfields'

let browser: Browser
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

const stamp = (d: Date) => `${String(d.getUTCDate()).padStart(2, '0')}${String(d.getUTCHours()).padStart(2, '0')}${String(d.getUTCMinutes()).padStart(2, '0')}Z`

describe('a METAR from another station', () => {
  it('needs confirming before it files; then the page says what was filed', async () => {
    const { code } = await makeAirfield(await signedIn('dispatcher'))
    const { context } = await newContext(browser)
    const page = await context.newPage()
    await signInPage(page, 'dispatcher')
    await page.goto(`/airfields/${code}/file`)
    await page.waitForLoadState('networkidle')
    await page.fill('#coded-text', `METAR XVAL ${stamp(new Date())} 18012KT 9999`)
    await page.click('[data-test="coded-read"]')
    await expect.poll(() => page.locator('[data-test="coded-warnings"]').textContent()).toContain(`is for XVAL, not ${code}`)
    expect(await page.locator('input[name="height-0"]').inputValue()).toBe('10')
    expect(await page.locator('input[name="speed-0"]').inputValue()).toBe('12')
    await page.click('text=Add level')
    await page.fill('input[name="height-1"]', '300')
    await page.fill('input[name="direction-1"]', '200')
    await page.fill('input[name="speed-1"]', '20')
    await page.click('[data-test="file-table"]')
    await expect.poll(() => page.locator('[role="alert"]').allTextContents()).toEqual(expect.arrayContaining([expect.stringContaining('the reports need confirming')]))
    await screenshot(page, 'coded-confirm')
    await page.check('[data-test="coded-confirm"]')
    await Promise.all([page.waitForURL(new RegExp(`/airfields/${code}\\?filed=`)), page.click('[data-test="file-table"]')])
    await expect.poll(() => page.locator('[data-test="filed-notice"]').textContent()).toMatch(/Profile #\d+ filed, \d+ alerts? raised/)
    await screenshot(page, 'filed-notice')
    await context.close()
  })
})

describe('a TAF with change groups', () => {
  const hh = (d: Date) => `${String(d.getUTCDate()).padStart(2, '0')}${String(d.getUTCHours()).padStart(2, '0')}`
  it('files one profile per period in one step; the form then says what a new filing will supersede', async () => {
    const { code } = await makeAirfield(await signedIn('dispatcher'))
    const { context } = await newContext(browser)
    const page = await context.newPage()
    await signInPage(page, 'dispatcher')
    await page.goto(`/airfields/${code}/file`)
    await page.waitForLoadState('networkidle')
    await expect.poll(() => page.locator('[data-test="supersede-preview"]').textContent()).toContain('supersedes no active profile')
    const start = new Date(Math.floor(Date.now() / 3600_000) * 3600_000)
    const at = (h: number) => new Date(start.getTime() + h * 3600_000)
    await page.fill('#coded-text', `TAF ${code} ${stamp(new Date())} ${hh(at(0))}/${hh(at(12))} 18010KT 9999 FM${hh(at(6))}00 22015KT 9999 TEMPO ${hh(at(8))}/${hh(at(10))} 27030G45KT`)
    await page.click('[data-test="coded-read"]')
    await expect.poll(() => page.locator('[data-test="taf-periods"]').textContent()).toContain('2 periods')
    expect(await page.locator('[data-test="taf-periods"]').textContent()).toContain('220° 15 kt')
    // Each period gives only its surface wind: the dispatcher adds a level aloft for all of them.
    await page.click('text=Add level')
    await page.fill('input[name="height-1"]', '300')
    await page.fill('input[name="direction-1"]', '250')
    await page.fill('input[name="speed-1"]', '30')
    await screenshot(page, 'taf-periods')
    await Promise.all([page.waitForURL(new RegExp(`/airfields/${code}\\?filed=\\d+,\\d+`)), page.click('[data-test="file-periods"]')])
    await expect.poll(() => page.locator('[data-test="filed-notice"]').textContent()).toMatch(/Profiles #\d+, #\d+ filed, \d+ alerts? raised/)
    const ids = new URL(page.url()).searchParams.get('filed')!.split(',')

    // A new filing over the next three hours would take over the first period's rest: the form says so before filing.
    await page.goto(`/airfields/${code}/file`)
    await page.waitForLoadState('networkidle')
    await expect.poll(() => page.locator('[data-test="supersede-preview"]').textContent()).toContain(`will supersede #${ids[0]}`)
    await context.close()
  })
})

describe('the filing form at phone width', () => {
  it('fits 390 px without sideways scrolling, the QNH field included', async () => {
    const { code } = await makeAirfield(await signedIn('dispatcher'))
    const { context } = await newContext(browser, { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true })
    const page = await context.newPage()
    await signInPage(page, 'dispatcher')
    await page.goto(`/airfields/${code}/file`)
    await page.waitForLoadState('networkidle')
    await expect.poll(() => page.locator('[data-test="supersede-preview"]').count()).toBe(1)
    // The day's QNH can be given; anything but a number is refused in the field's own words.
    await page.fill('#pf-qnh', 'high')
    await page.locator('#pf-qnh').blur()
    await expect.poll(() => page.locator('#pf-qnh-error').textContent()).toContain('QNH must be a number')
    await page.fill('#pf-qnh', '1030')
    await page.locator('#pf-qnh').blur()
    await expect.poll(() => page.locator('#pf-qnh-error').count()).toBe(0)
    const scrollWidth = await page.evaluate(() => document.documentElement.scrollWidth)
    expect(scrollWidth).toBeLessThanOrEqual(390)
    await screenshot(page, 'profile-entry-phone')
    await context.close()
  })
})
