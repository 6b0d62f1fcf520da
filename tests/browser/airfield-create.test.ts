import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launchBrowser, newContext, signInPage, screenshot, type Browser } from '../support/browser'
import { signedIn } from '../support/api'
import { unusedCode } from '../support/airfields'

let browser: Browser
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

describe('adding an airfield', () => {
  it('takes degrees-minutes-seconds with N/S/E/W, refuses other text with an example, then points to adding runways; its empty tables say so', async () => {
    const code = await unusedCode()
    const { context } = await newContext(browser)
    const page = await context.newPage()
    await signInPage(page, 'dispatcher')
    await page.goto('/airfields')
    await page.waitForLoadState('networkidle')
    await page.fill('#af-code', code)
    await page.fill('#af-name', 'Coordinate test field')
    await page.fill('#af-lat', '46°12′30″N')
    await page.fill('#af-lon', 'east of the lake')
    await page.fill('#af-elev', '1500')
    await page.click('button:has-text("Add airfield")')
    await expect.poll(() => page.locator('#af-lon-error').textContent()).toContain('7°18′45″E')
    await page.fill('#af-lon', '7 18 45 E')
    await page.locator('#af-lon').blur()
    await page.click('button:has-text("Add airfield")')
    await expect.poll(() => page.locator('[data-test="airfield-added"]').textContent()).toContain(`Airfield ${code} added. Next step: add its runways`)
    await screenshot(page, 'airfield-added')
    // 46°12′30″N = 46.208333°, 7°18′45″E = 7.3125° (1° = 60′ = 3600″, common practice).
    const a = (await (await signedIn('dispatcher')).get(`/api/airfields/${code}`)).body.airfield
    expect(a.latitudeDeg).toBeCloseTo(46 + 12 / 60 + 30 / 3600, 9)
    expect(a.longitudeDeg).toBeCloseTo(7.3125, 9)
    await Promise.all([page.waitForURL(new RegExp(`/airfields/${code}#add-runway`)), page.click('[data-test="airfield-added"] a')])
    await expect.poll(() => page.locator('#add-runway').count()).toBe(1)
    // A new airfield's empty tables say so.
    await expect.poll(() => page.locator('[data-test="empty-table"]').allTextContents()).toEqual(expect.arrayContaining([
      expect.stringContaining('No runways yet'), expect.stringContaining('No profiles match'),
    ]))
    await context.close()
  })
})
