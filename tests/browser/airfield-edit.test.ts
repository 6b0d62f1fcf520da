import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launchBrowser, newContext, signInPage, screenshot, type Browser } from '../support/browser'
import { signedIn } from '../support/api'
import { makeAirfield, profileBody } from '../support/airfields'

let browser: Browser
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

describe('a dispatcher edits an airfield on its page', () => {
  it('renames the airfield, renumbers its runway and withdraws a profile it filed, with a reason', async () => {
    const api = await signedIn('dispatcher')
    // A test field of our own: runway 18/36 with entered true headings 180°/360° (tests/support/airfields.ts).
    const { code, airfield } = await makeAirfield(api)
    const filed = await api.post(`/api/airfields/${code}/profiles`, profileBody(1, 2))
    expect(filed.status).toBe(201)
    const profileId = filed.body.profile.id as number
    const runwayId = (await api.get(`/api/airfields/${code}`)).body.airfield.runways[0].id as number

    const { context, requests } = await newContext(browser)
    const page = await context.newPage()
    await signInPage(page, 'dispatcher')
    await page.goto(`/airfields/${code}`)
    await page.waitForLoadState('networkidle')

    // the airfield: the form's own rule (the API's schema) answers an emptied name beside the field
    await page.click('[data-test="edit-airfield"]')
    const form = page.locator('[data-test="airfield-edit"]')
    await form.locator('input[name="name"]').fill('')
    await form.locator('button[type=submit]').click()
    await expect.poll(() => form.locator('#ae-name-error').textContent()).toContain('Name is required')
    expect(await form.locator('#ae-name').getAttribute('aria-invalid')).toBe('true')
    await form.locator('input[name="name"]').fill(`Renamed field ${code}`)
    await form.locator('button[type=submit]').click()
    await expect.poll(() => page.locator('main h1').first().textContent()).toContain(`Renamed field ${code}`)
    expect(airfield.name).toBe(`Test field ${code}`)

    // the runway: 18/36 becomes 17/35 on headings 170°/350°; a bad pair is refused beside end 2 first
    await page.click(`[data-test="edit-runway-${runwayId}"]`)
    const rw = page.locator(`[data-test="runway-form-${runwayId}"]`)
    await rw.locator('input[name="des-0"]').fill('17')
    await rw.locator('input[name="des-1"]').fill('36')
    await rw.locator('button[type=submit]').click()
    // designators 18 apart, L/R opposite (FAA AC 150/5340-1, as the shared schema states)
    await expect.poll(() => rw.locator(`#rw${runwayId}-des-1-error`).textContent()).toContain('18 apart')
    await rw.locator('input[name="des-1"]').fill('35')
    await rw.locator('input[name="hdg-0"]').fill('170')
    await rw.locator('input[name="hdg-1"]').fill('350')
    await rw.locator('button[type=submit]').click()
    const table = page.locator('[data-test="runway-table"]')
    await expect.poll(() => table.textContent()).toContain('170.0°T')
    const text = await table.textContent()
    expect(text).toContain('17')
    expect(text).toContain('350.0°T')
    expect(text).not.toContain('180.0°T')
    const stored = (await api.get(`/api/airfields/${code}`)).body.airfield
    expect(stored.name).toBe(`Renamed field ${code}`)
    expect(stored.runways[0].ends.map((e: { designator: string }) => e.designator)).toEqual(['17', '35'])

    // the profile: the dialog asks for a reason (required) and the list shows it withdrawn with that reason
    await page.click(`[data-test="withdraw-${profileId}"]`)
    const dialog = page.locator('[data-test="withdraw-dialog"]')
    await dialog.locator('[data-test="withdraw-confirm"]').click()
    await expect.poll(() => dialog.locator('#withdraw-reason-error').textContent()).toContain('Give a reason')
    await dialog.locator('input[name="reason"]').fill('Profiler fault found after filing')
    await dialog.locator('[data-test="withdraw-confirm"]').click()
    await expect.poll(() => page.locator('[data-test="profile-list"]').textContent()).toContain('withdrawn (Profiler fault found after filing)')
    expect(await dialog.count()).toBe(0)
    expect((await api.get(`/api/profiles/${profileId}`)).body.profile.status).toBe('withdrawn')
    await screenshot(page, 'airfield-edit')

    const foreign = requests.filter(u => !/^(https?|wss?):\/\/127\.0\.0\.1(:\d+)?\//.test(u) && !u.startsWith('data:'))
    expect(foreign).toEqual([])
    await context.close()
  })
})
