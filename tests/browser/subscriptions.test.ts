// Following airfields when there are many, from a pilot's phone: the followed ones first, a part of the code or name
// narrows the table as one types, and a row stays where it is while one ticks it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launchBrowser, newContext, signInPage, screenshot, type Browser } from '../support/browser'
import { signedIn } from '../support/api'
import { closeDb, makeAirfield } from '../support/airfields'

let browser: Browser
const tag = `Sb${Math.random().toString(36).slice(2, 7)}`
let codes: string[] = []
beforeAll(async () => {
  browser = await launchBrowser()
  const dispatcher = await signedIn('dispatcher')
  for (let i = 0; i < 3; i++) codes.push((await makeAirfield(dispatcher, { name: `${tag} field ${i}` })).code)
  codes = codes.sort()
  expect((await (await signedIn('pilot')).put(`/api/subscriptions/${codes[2]}`, { email: true, push: false })).status).toBe(200)
})
afterAll(async () => {
  const pilot = await signedIn('pilot')
  for (const c of codes) await pilot.delete(`/api/subscriptions/${c}`)
  await browser?.close()
  await closeDb()
})

describe('airfields to follow', () => {
  it('a pilot on a phone finds an airfield by part of its name, follows it, and sees the followed ones first', async () => {
    const { context } = await newContext(browser, { viewport: { width: 390, height: 844 } })
    const page = await context.newPage()
    await signInPage(page, 'pilot')
    await page.goto('/alerts/subscriptions')
    await page.waitForLoadState('networkidle')
    const rows = page.locator('tbody tr[data-test^=subscription-]')
    // What the pilot already follows comes first, whatever its code.
    const firstCodes = await rows.evaluateAll(trs => trs.map(tr => tr.getAttribute('data-test')!.replace('subscription-', '')))
    const pilotFollows = ((await (await signedIn('pilot')).get('/api/subscriptions')).body.subscriptions as { airfieldCode: string }[]).map(s => s.airfieldCode)
    expect(firstCodes.slice(0, pilotFollows.length).sort()).toEqual([...pilotFollows].sort())
    expect(await page.locator('[data-test=subscriptions-count]').textContent()).toContain(`You follow ${pilotFollows.length} of`)

    await page.fill('[data-test=subscriptions-find]', tag.toLowerCase())
    await expect.poll(() => rows.count()).toBe(3)
    expect(await rows.evaluateAll(trs => trs.map(tr => tr.getAttribute('data-test')))).toEqual([codes[2], codes[0], codes[1]].map(c => `subscription-${c}`))
    await screenshot(page, 'subscriptions-390-find')

    // Following one keeps it in its place; its e-mail box opens.
    await rows.nth(1).locator('[data-test=follow]').check()
    await expect.poll(() => rows.nth(1).locator('input[aria-label^="E-mail"]').isDisabled()).toBe(false)
    expect(await rows.nth(1).getAttribute('data-test')).toBe(`subscription-${codes[0]}`)
    await expect.poll(async () => ((await (await signedIn('pilot')).get('/api/subscriptions')).body.subscriptions as { airfieldCode: string }[])
      .some(s => s.airfieldCode === codes[0])).toBe(true)

    await page.fill('[data-test=subscriptions-find]', `${tag}-none`)
    await expect.poll(() => page.locator('[data-test=no-match]').textContent()).toContain(`${tag}-none`)
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0)
    await context.close()
  })
})
