import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launchBrowser, newContext, screenshot, signInPage, type Browser } from '../support/browser'
import { signedIn } from '../support/api'
import { createTestAirfield, windProfile } from '../support/alerts'

let browser: Browser
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

describe('limits and alerts in the browser', () => {
  it('a safety officer lowers a crosswind limit with a reason; the alert reaches the pilot\'s inbox and the admin\'s mailbox', async () => {
    // Runway 18/36, wind 220° at 30 kt: 19.28 kt crosswind (FAA crosswind chart worked example), within the default 20 kt.
    const code = await createTestAirfield({ 18: 180, 36: 360 }, 'Browser alert field')
    const safetyApi = await signedIn('safety')
    await safetyApi.put(`/api/limits/airfields/${code}`, { values: { maxTailwindKt: 30 }, reason: 'Test field: tailwind out of the way' })
    await safetyApi.put(`/api/limits/airfields/${code}`, { designator: '36', values: { maxCrosswindKt: 25 }, reason: 'Test field: runway 36 stays clear' })
    const pilotApi = await signedIn('pilot')
    expect((await pilotApi.put(`/api/subscriptions/${code}`, { email: true, push: false })).status).toBe(200)
    const filed = await (await signedIn('dispatcher')).post(`/api/airfields/${code}/profiles`, windProfile(220, 30))
    expect(filed.status).toBe(201)
    // The stand-in's mailbox outlives test runs (and a random test code can come back in a later run): count what the
    // mailbox page's first page (20 newest, pages/mailbox/index.vue) already shows for this code.
    const adminApi = await signedIn('admin')
    const mailsBefore = (await adminApi.get('/api/mailbox?page=1&pageSize=20')).body.messages
      .filter((m: { subject: string }) => m.subject.includes(`${code} runway 18`)).length
    const before = (await pilotApi.get('/api/alerts/inbox')).body.items.filter((i: { airfieldCode: string }) => i.airfieldCode === code)
    expect(before).toHaveLength(0)

    const { context: safetyCtx } = await newContext(browser)
    const safety = await safetyCtx.newPage()
    await signInPage(safety, 'safety')
    await safety.waitForURL(u => u.pathname === '/safety')
    await safety.waitForLoadState('networkidle')
    await safety.selectOption('#limits-airfield', code)
    const form = safety.locator('[data-test="limits-airfield-form"]')
    await form.locator('input[name="maxCrosswindKt"]').fill('18')
    await form.locator('input[name="reason"]').fill('Gusty season: lower crosswind limit for the light fleet')
    await form.locator('[data-test="limits-review-button"]').click()
    // The dry run shows the effect before anything is saved; lowering needs the confirmation of that list.
    const review = form.locator('[data-test="limits-review"]')
    await review.waitFor()
    expect(await review.textContent()).toContain('lowers a limit')
    expect(await review.locator('[data-test="limits-effect-row"]', { hasText: `${code} runway 18` }).count()).toBeGreaterThan(0)
    expect(await form.locator('[data-test="limits-save"]').isDisabled()).toBe(true)
    await screenshot(safety, 'limits-review')
    await form.locator('[data-test="confirm-lowering"]').check()
    await form.locator('[data-test="limits-save"]').click()
    await expect.poll(() => safety.locator('[data-test="limits-saved"]').textContent(), { timeout: 15_000 }).toMatch(/Saved:.*\d+ alerts? raised/s)
    await expect.poll(() => safety.locator('[data-test="limits-history"]').textContent(), { timeout: 15_000 })
      .toContain('Gusty season: lower crosswind limit for the light fleet')
    await screenshot(safety, 'limits-lowered')
    await safetyCtx.close()

    const { context: pilotCtx } = await newContext(browser)
    const pilot = await pilotCtx.newPage()
    await signInPage(pilot, 'pilot')
    await expect.poll(async () => Number(await pilot.locator('[data-test="alerts-count"]').textContent()), { timeout: 15_000 }).toBeGreaterThan(0)
    await pilot.goto('/alerts')
    const group = pilot.locator(`[data-test="inbox-group"][data-airfield="${code}"]`)
    const item = group.locator('[data-test="inbox-item"]', { hasText: 'runway 18' })
    await expect.poll(() => item.count(), { timeout: 15_000 }).toBe(1)
    expect(await item.textContent()).toContain('19.3 kt')
    // The alert raised by a limit change says so, with the reason given.
    expect(await item.textContent()).toContain('Gusty season')
    await screenshot(pilot, 'alerts-inbox')
    await group.locator('[data-test="acknowledge-airfield"]').click()
    await expect.poll(() => item.getAttribute('data-acknowledged')).toBe('yes')
    expect(await pilot.locator('[data-test="inbox-notice"]').textContent()).toMatch(new RegExp(`acknowledged`))
    expect(await group.locator('[data-test="inbox-item"][data-acknowledged="no"]').count()).toBe(0)
    await screenshot(pilot, 'alerts-inbox-acknowledged')
    await pilotCtx.close()

    const { context: adminCtx } = await newContext(browser)
    const admin = await adminCtx.newPage()
    await signInPage(admin, 'admin')
    const mail = admin.locator('[data-test="mail"]', { hasText: `${code} runway 18` })
    // The worker sends within a second or so; reload until the stand-in has it (bounded).
    await expect.poll(async () => {
      await admin.goto('/mailbox')
      await admin.waitForLoadState('networkidle')
      return mail.count()
    }, { timeout: 30_000, interval: 1000 }).toBeGreaterThan(mailsBefore)
    await mail.first().locator('[data-test="mail-summary"]').click() // the mailbox list is collapsed
    expect(await mail.first().textContent()).toContain('Limit: 18 kt')
    await screenshot(admin, 'mailbox')
    await adminCtx.close()
  }, 120_000) // a hang guard for a loaded machine, not a speed check

  it('reading a briefing offers to acknowledge the reader\'s alerts of that airfield', async () => {
    // Runway 18/36, wind 270° at 30 kt: 30 kt crosswind (common practice: a wind at right angles is all crosswind),
    // over the default 20 kt limit.
    const code = await createTestAirfield({ 18: 180, 36: 360 }, 'Briefing acknowledge field')
    const filed = await (await signedIn('dispatcher')).post(`/api/airfields/${code}/profiles`, windProfile(270, 30))
    expect(filed.status).toBe(201)
    const pilotApi = await signedIn('pilot')
    // Following puts the airfield's active alerts into the inbox.
    expect((await pilotApi.put(`/api/subscriptions/${code}`, { email: false, push: false })).status).toBe(200)
    const open = async () => (await pilotApi.get(`/api/alerts/inbox?airfield=${code}&unacknowledged=1`)).body.total as number
    expect(await open()).toBeGreaterThan(0)

    const { context } = await newContext(browser)
    const pilot = await context.newPage()
    await signInPage(pilot, 'pilot')
    await pilot.goto(`/briefings/${code}`)
    await pilot.waitForLoadState('networkidle')
    const offer = pilot.locator('[data-test="briefing-inbox-offer"]')
    expect(await offer.textContent()).toMatch(new RegExp(`You have \\d+ unacknowledged alerts? for ${code}`))
    await offer.locator('[data-test="briefing-acknowledge"]').click()
    await expect.poll(() => offer.textContent()).toMatch(new RegExp(`\\d+ alerts? of ${code} acknowledged`))
    expect(await open()).toBe(0)
    await context.close()
  }, 120_000) // a hang guard for a loaded machine, not a speed check
})
