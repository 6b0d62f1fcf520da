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

describe('a dispatcher files profiles', () => {
  it('files one through the level table and one by uploading a CSV, and finds both in the list', async () => {
    const { code } = await makeAirfield(await signedIn('dispatcher'))
    const { context, requests } = await newContext(browser)
    const page = await context.newPage()
    await signInPage(page, 'dispatcher')
    await page.goto(`/airfields/${code}/file`)
    await page.waitForLoadState('networkidle')

    // an error shows as one types
    await page.fill('input[name="direction-0"]', '400')
    await expect.poll(() => page.locator('[data-test="level-row-0"] .vl-error').first().textContent()).toContain('0 to 360')
    await page.fill('input[name="direction-0"]', '200')
    await page.fill('input[name="speed-0"]', '12')
    await page.fill('input[name="direction-1"]', '240')
    await page.fill('input[name="speed-1"]', '35')
    await page.click('text=Add level')
    // Type the new bottom row the way a person does: height, Tab, direction, Tab, speed. The row keeps its place,
    // so nothing typed lands in the 300 m level.
    await page.click('input[name="height-2"]')
    await page.keyboard.type('150')
    await page.keyboard.press('Tab')
    await page.keyboard.type('220')
    await page.keyboard.press('Tab')
    await page.keyboard.type('25')
    await page.keyboard.press('Tab')
    const row = async (i: number) => Promise.all(['height', 'direction', 'speed'].map(c => page.locator(`input[name="${c}-${i}"]`).inputValue()))
    expect(await row(0)).toEqual(['10', '200', '12'])
    expect(await row(1)).toEqual(['300', '240', '35'])
    expect(await row(2)).toEqual(['150', '220', '25'])
    // the live preview answers for runway 18 and 36 of the test field
    await expect.poll(() => page.locator('[data-test="profile-preview"]').textContent(), { timeout: 10_000 }).toContain('kt head')
    await screenshot(page, 'profile-entry-table')
    await Promise.all([page.waitForURL(new RegExp(`/airfields/${code}(\\?|$)`)), page.click('[data-test="file-table"]')])

    await page.goto(`/airfields/${code}/file`)
    await page.waitForLoadState('networkidle')
    await page.setInputFiles('[data-test="profile-file"]', {
      name: 'levels.csv', mimeType: 'text/csv',
      buffer: Buffer.from('height_ft,direction_deg,speed_kt,gust_kt\n33,190,14,24\n1000,230,30,\n2000,250,42,\n'),
    })
    await expect.poll(() => page.locator('[data-test="file-upload"]').textContent()).toContain('File 3 levels')
    await Promise.all([page.waitForURL(new RegExp(`/airfields/${code}(\\?|$)`)), page.click('[data-test="file-upload"]')])

    const rows = page.locator('[data-test="profile-list"] tbody tr')
    await expect.poll(() => rows.count()).toBe(2)
    const text = await page.locator('[data-test="profile-list"]').textContent()
    expect(text).toContain('table')
    expect(text).toContain('file')
    // the later filing overlaps the first and supersedes it; both stay listed
    expect(text).toContain('superseded')
    await screenshot(page, 'profile-list')
    const foreign = requests.filter(u => !/^(https?|wss?):\/\/127\.0\.0\.1(:\d+)?\//.test(u) && !u.startsWith('data:'))
    expect(foreign).toEqual([])
    await context.close()
  })
})

describe('the upload preview', () => {
  it('shows the file as a table in its own columns, the bad row marked with the column and what is wrong', async () => {
    const { code } = await makeAirfield(await signedIn('dispatcher'))
    const { context } = await newContext(browser)
    const page = await context.newPage()
    await signInPage(page, 'dispatcher')
    await page.goto(`/airfields/${code}/file`)
    await page.waitForLoadState('networkidle')
    await page.setInputFiles('[data-test="profile-file"]', {
      name: 'levels.csv', mimeType: 'text/csv',
      buffer: Buffer.from('height_m,direction_deg,speed_kt\n10,180,5\n150,361,10\n300,200,12\n'),
    })
    await expect.poll(() => page.locator('[data-test="upload-row-bad"]').count()).toBe(1)
    const head = await page.locator('[data-test="upload-table"] thead').textContent()
    expect(head).toContain('direction_deg')
    const bad = await page.locator('[data-test="upload-row-bad"]').textContent()
    expect(bad).toContain('3')
    expect(bad).toContain('direction_deg:')
    expect(await page.locator('[data-test="upload-table"]').textContent()).not.toContain('directionDeg')
    expect(await page.locator('[data-test="upload-row"]').count()).toBe(2)
    expect(await page.locator('[data-test="file-upload"]').isDisabled()).toBe(true)
    await screenshot(page, 'upload-preview-table')
    await context.close()
  })
})
