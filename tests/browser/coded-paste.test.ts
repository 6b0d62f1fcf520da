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
