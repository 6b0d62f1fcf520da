// The briefing at the point of use, from the pilot's seat: the answer in the first screen on a desk and a phone,
// the runway end and time pickers in the URL, the banner when no end is within limits, live updates across two app
// instances, no sideways scrolling at 390 px, an automated contrast check (axe-core in the page) and print.
import { spawn, type ChildProcess } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { BASE_URL, launchBrowser, newContext, OUTPUT_DIR, signInPage, type Browser, type Page } from '../support/browser'
import { ApiClient, signedIn } from '../support/api'
import { closeDb, makeAirfield, profileBody } from '../support/airfields'

const AXE_SOURCE = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8')
const DESK = { width: 1366, height: 900 }
const PHONE = { width: 390, height: 844 }

let browser: Browser
let dispatcher: ApiClient
beforeAll(async () => {
  browser = await launchBrowser()
  dispatcher = await signedIn('dispatcher')
})
afterAll(async () => {
  await browser?.close()
  await closeDb()
})

async function pilotPage(viewport: { width: number, height: number }, baseURL = BASE_URL) {
  const phone = viewport.width < 500
  // bypassCSP: the test injects axe-core as an inline script, which the app's CSP rightly refuses.
  const { context } = await newContext(browser, { viewport, baseURL, bypassCSP: true, ...(phone ? { isMobile: true, hasTouch: true } : {}) })
  const page = await context.newPage()
  await signInPage(page, 'pilot')
  return { context, page }
}

async function open(page: Page, path: string) {
  await page.goto(path)
  await page.waitForLoadState('networkidle')
  await page.locator('[data-test=answer]').waitFor()
}

/** The bottom of an element, in CSS pixels from the top of the page (the page is scrolled to the top). */
async function bottomOf(page: Page, selector: string) {
  const box = await page.locator(selector).first().boundingBox()
  expect(box, selector).not.toBeNull()
  return box!.y + box!.height
}

async function fieldWith(levels: Record<string, unknown>[], hoursFrom = 0, hours = 3, airfield: Record<string, unknown> = {}) {
  const { code } = await makeAirfield(dispatcher, airfield)
  const res = await dispatcher.post(`/api/airfields/${code}/profiles`, { ...profileBody(hoursFrom, hours), levels })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return code
}

const EXCEEDING = [
  { heightM: 10, directionDeg: 200, speedKt: 5 }, { heightM: 40, directionDeg: 200, speedKt: 40 },
  { heightM: 300, directionDeg: 210, speedKt: 42 }, { heightM: 600, directionDeg: 220, speedKt: 45 },
]

describe('the answer first', () => {
  for (const [name, viewport] of [['desk', DESK], ['phone', PHONE]] as const) {
    it(`${name} ${viewport.width}x${viewport.height}: verdict, surface wind, key heights and the compact caution are in the first screen`, async () => {
      const { context, page } = await pilotPage(viewport)
      await open(page, '/briefings/XVAL')
      expect(await page.evaluate(() => window.scrollY)).toBe(0)
      await page.screenshot({ path: join(OUTPUT_DIR, `briefing-${name}-first-screen.png`) })
      await page.screenshot({ path: join(OUTPUT_DIR, `briefing-${name}.png`), fullPage: true })
      for (const sel of ['[data-test=verdict]', '[data-test=surface-wind]', '[data-test=key-heights]', '[data-test=caution-short]']) {
        expect(await bottomOf(page, sel), `${sel} on the ${name}`).toBeLessThanOrEqual(viewport.height)
      }
      expect(await page.locator('[data-test=verdict]').textContent()).toMatch(/Runway \d{2}[LCR]?: (within limits|\d+ limits? exceeded)/)
      expect(await page.locator('[data-test=caution-short]').textContent()).toContain('Advisory only')
      // With the filing issue's engine: the loss in the approach corridor and the F-factor are in the answer too.
      expect(await page.locator('[data-test=answer-loss]').textContent()).toContain('approach corridor')
      expect(await page.locator('[data-test=answer-ffactor]').textContent()).toMatch(/-?\d\.\d{3} arrival/)
      expect(await bottomOf(page, '[data-test=answer-ffactor]'), `F-factor on the ${name}`).toBeLessThanOrEqual(viewport.height)
      // The key heights are round values of the reader's unit (feet by default), not converted metres.
      const labels = (await page.locator('[data-test=key-heights] tbody th').allTextContents()).map(t => t.trim())
      expect(labels).toEqual(['SFC', '500 ft', '1,000 ft', '1,500 ft', '2,000 ft'])
      const scrollWidth = await page.evaluate(() => document.documentElement.scrollWidth)
      expect(scrollWidth).toBeLessThanOrEqual(viewport.width)
      await context.close()
    })
  }

  it('phone, the most crowded answer: six runway ends, a gusty surface wind, a stale profile and no end within limits, still in the first screen', async () => {
    // Everything that can stand above the key heights at once: a long name, three runways, a gust line, the stale warning (the
    // chosen time 2 h 30 min after filing, past the 90 min default) and the banner with the verdict's reasons.
    const code = await fieldWith([{ ...EXCEEDING[0], gustKt: 25 }, ...EXCEEDING.slice(1)], 0, 4, { name: 'Test field with a name too long for one line of a phone' })
    for (const [a, b, heading] of [['04', '22', 40], ['07', '25', 70]] as const) {
      const rw = await dispatcher.post(`/api/airfields/${code}/runways`, {
        lengthM: 2000, ends: [{ designator: a, trueHeadingDeg: heading }, { designator: b, trueHeadingDeg: heading + 180 }],
      })
      expect(rw.status, JSON.stringify(rw.body)).toBe(201)
    }
    const at = new Date(Math.floor(Date.now() / 60_000) * 60_000 + 150 * 60_000).toISOString()
    const { context, page } = await pilotPage(PHONE)
    await open(page, `/briefings/${code}?at=${encodeURIComponent(at)}`)
    expect(await page.locator('[data-test=pickers] [data-end]').count()).toBe(6)
    expect(await page.locator('[data-test=stale]').isVisible()).toBe(true)
    expect(await page.locator('[data-test=no-end-banner]').isVisible()).toBe(true)
    await page.screenshot({ path: join(OUTPUT_DIR, 'briefing-phone-crowded-first-screen.png') })
    for (const sel of ['[data-test=verdict]', '[data-test=surface-wind]', '[data-test=answer-ffactor]', '[data-test=caution-short]', '[data-test=key-heights]']) {
      expect(await bottomOf(page, sel), sel).toBeLessThanOrEqual(PHONE.height)
    }
    // The long name gives way on its line: the runway stays in sight and nothing scrolls sideways.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width)
    for (const sel of ['[data-test=answer] h1 + span', '[data-test=why]']) {
      const box = (await page.locator(sel).first().boundingBox())!
      expect(box.x + box.width, sel).toBeLessThanOrEqual(PHONE.width)
    }
    await context.close()
  })

  it('metres chosen: key heights SFC, 150, 300, 450, 600 m and every label in metres', async () => {
    const { context, page } = await pilotPage(DESK)
    await open(page, '/briefings/XCST')
    await page.locator('[data-pref="heightUnit:m"]').click()
    try {
      await expect.poll(async () => (await page.locator('[data-test=key-heights] tbody th').allTextContents()).map(t => t.trim()))
        .toEqual(['SFC', '150 m', '300 m', '450 m', '600 m'])
      // Heights (layer bounds too) in metres; the shear rate keeps its trade unit, kt per 100 ft.
      const shear = (await page.locator('[data-test=answer-shear]').textContent())!.replace(/kt\/100 ft/g, '')
      expect(shear).toMatch(/\d+–\d+ m/)
      expect(shear).not.toMatch(/\bft\b/)
      expect((await page.locator('[data-test=answer-loss]').textContent())!).not.toMatch(/\bft\b/)
    }
    finally {
      await page.locator('[data-pref="heightUnit:ft"]').click()
      await expect.poll(() => page.locator('[data-pref="heightUnit:ft"]').getAttribute('aria-pressed')).toBe('true')
    }
    await context.close()
  })
})

describe('the runway end and the time, in the URL', () => {
  it('choosing an end and a time changes the URL and the figures; the end is remembered', async () => {
    const { code } = await makeAirfield(dispatcher)
    // Now: 200°/12 kt gusting 22. From 3 h on: 090°/25 kt, a crosswind from the right on runway 36.
    expect((await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(0, 2))).status).toBe(201)
    expect((await dispatcher.post(`/api/airfields/${code}/profiles`, { ...profileBody(3, 3), levels: [
      { heightM: 10, directionDeg: 90, speedKt: 25 }, { heightM: 600, directionDeg: 100, speedKt: 30 },
    ] })).status).toBe(201)
    const { context, page } = await pilotPage(DESK)
    await open(page, `/briefings/${code}`)
    await page.locator('[data-test=pickers] [data-end="36"]').click()
    await page.waitForURL(/end=36/)
    await expect.poll(() => page.locator('[data-test=answer]').getAttribute('data-designator')).toBe('36')
    // 200° at 12 kt on runway 36 (heading 360°): 12·cos 160° = −11.3 kt, a tailwind; 12·sin 160° ≈ 4.1 kt.
    expect((await page.locator('[data-test=surface-headwind]').textContent())!.trim()).toBe('11 kt tailwind')
    expect((await page.locator('[data-test=surface-wind]').textContent())).toContain('200°T/12G22 kt')
    const later = new Date(Date.now() + 4 * 3600_000)
    const typed = `${later.toISOString().slice(0, 10)} ${later.toISOString().slice(11, 16)}Z`
    await page.fill('#briefing-at', typed)
    await page.getByRole('button', { name: 'Brief at this time' }).click()
    await page.waitForURL(/at=/)
    expect(new URL(page.url()).searchParams.get('at')).toBe(`${later.toISOString().slice(0, 16)}:00Z`)
    expect(new URL(page.url()).searchParams.get('end')).toBe('36')
    // The profile valid then: 090° at 25 kt on a heading of 360°: crosswind 25·sin 90° = 25 kt from the right.
    await expect.poll(async () => (await page.locator('[data-test=surface-wind]').textContent()) ?? '').toContain('090°T/25 kt')
    expect((await page.locator('[data-test=surface-crosswind]').textContent())!.trim()).toBe('25 kt from the right')
    expect(await page.locator('[data-test=profile-status]').textContent()).toContain(`Valid at ${typed}`)
    // Shared as a link: the same URL opens the same end and time; a fresh visit remembers the end.
    await page.goto(`/briefings/${code}`)
    await page.locator('[data-test=answer]').waitFor()
    expect(await page.locator('[data-test=answer]').getAttribute('data-designator')).toBe('36')
    await context.close()
  })

  it('an airfield where no end is within limits says so plainly', async () => {
    const code = await fieldWith(EXCEEDING)
    const { context, page } = await pilotPage(PHONE)
    await open(page, `/briefings/${code}`)
    const banner = page.locator('[data-test=no-end-banner]')
    expect(await banner.isVisible()).toBe(true)
    expect(await banner.textContent()).toContain('No runway end is within limits')
    expect(await bottomOf(page, '[data-test=no-end-banner]')).toBeLessThanOrEqual(PHONE.height)
    expect(await page.locator('[data-test=verdict]').getAttribute('data-within')).toBe('false')
    await page.screenshot({ path: join(OUTPUT_DIR, 'briefing-phone-no-end-within-limits.png') })
    await context.close()
  })

  it('the wind display says which way its points lie; the hodograph toggle draws u/v vector tips', async () => {
    const { context, page } = await pilotPage(DESK)
    await open(page, '/briefings/XVAL')
    const legend = page.locator('[data-test=runway-card] [data-test=polar-legend]')
    expect(await legend.textContent()).toContain('placed toward where it blows FROM')
    expect(await page.locator('[data-test=polar-compass]').allTextContents()).toContain('True N')
    // Height labels never overlap: their boxes are pairwise apart.
    const boxes = await page.locator('[data-test=polar-height-label]').evaluateAll(els => els.map(e => e.getBoundingClientRect().toJSON()))
    for (let a = 0; a < boxes.length; a++) {
      for (let b = a + 1; b < boxes.length; b++) {
        const A = boxes[a]
        const B = boxes[b]
        expect(A.right <= B.left || B.right <= A.left || A.bottom <= B.top || B.bottom <= A.top, `labels ${a} and ${b}`).toBe(true)
      }
    }
    await page.locator('[data-test=view-toggle] [data-view=hodograph]').click()
    const svg = page.locator('[data-test=hodograph-svg]')
    await svg.waitFor()
    const b = (await (await signedIn('pilot')).get('/api/airfields/XVAL/briefing')).body.briefing
    expect(await svg.locator('[data-test=hodograph-point]').count()).toBe(b.levels.length)
    expect(await svg.textContent()).toContain('u east')
    expect(await svg.textContent()).toContain('tip of the wind vector')
    // A point lies at (u, v): a wind from the west (u > 0) sits right of the centre.
    const first = b.levels.findIndex((l: { uKt: number }) => Math.abs(l.uKt) > 2)
    const cx = Number(await svg.locator(`[data-test=hodograph-point][data-level-index="${first}"]`).getAttribute('cx'))
    expect(Math.sign(cx - 180)).toBe(Math.sign(b.levels[first].uKt))
    await page.locator('[data-test=runway-card]').screenshot({ path: join(OUTPUT_DIR, 'briefing-hodograph.png') })
    await context.close()
  })
})

describe('live: a profile filed on one app instance appears in a page open on the other', () => {
  let second: ChildProcess
  const port2 = process.env.VEERLINE_PORT_2
  beforeAll(async () => {
    expect(port2, 'VEERLINE_PORT_2 is set by scripts/test.sh').toBeTruthy()
    second = spawn(process.execPath, ['.output/server/index.mjs'], {
      env: { ...process.env, PORT: port2, NITRO_PORT: port2, HOST: '127.0.0.1', NITRO_HOST: '127.0.0.1', VEERLINE_OUTBOX_WORKER: '0' },
      stdio: 'ignore',
    })
    for (let i = 0; i < 100; i++) {
      try {
        if ((await fetch(`http://127.0.0.1:${port2}/healthz`)).ok) break
      }
      catch { /* not up yet */ }
      await new Promise(r => setTimeout(r, 200))
    }
  })
  afterAll(async () => {
    second?.kill('SIGTERM')
    await new Promise(r => second.exitCode != null ? r(null) : second.once('exit', r))
  })

  it('within 5 s, with an "updated at" notice and the header\'s alert count', async () => {
    const code = await fieldWith([{ heightM: 10, directionDeg: 180, speedKt: 5 }, { heightM: 600, directionDeg: 190, speedKt: 10 }])
    const pilot = await signedIn('pilot')
    expect((await pilot.put(`/api/subscriptions/${code}`, { email: false, push: false })).status).toBe(200)
    const { context, page } = await pilotPage(DESK)
    await open(page, `/briefings/${code}?end=18`)
    await page.locator('[data-test=live][data-state=live]').waitFor({ timeout: 10_000 })
    const before = Number(await page.locator('[data-test=alerts-count]').textContent())
    const viaSecond = new ApiClient(`http://127.0.0.1:${port2}`)
    await viaSecond.signIn('dispatch@veerline.example')
    const filedAt = Date.now()
    const res = await viaSecond.post(`/api/airfields/${code}/profiles`, { ...profileBody(0, 3), levels: EXCEEDING })
    expect(res.status).toBe(201)
    await page.locator('[data-test=updated]').waitFor({ timeout: 5000 })
    expect(Date.now() - filedAt).toBeLessThan(5000)
    expect(await page.locator('[data-test=updated]').textContent()).toContain('a new profile was filed')
    expect(await page.locator('[data-test=surface-wind]').textContent()).toContain('200°T/5 kt')
    expect(await page.locator('[data-test=no-end-banner]').isVisible()).toBe(true)
    const count = (await pilot.get('/api/alerts/inbox/count')).body.unacknowledged
    await expect.poll(async () => Number(await page.locator('[data-test=alerts-count]').textContent()), { timeout: 5000 }).toBe(count)
    expect(count).toBeGreaterThan(before)
    await page.screenshot({ path: join(OUTPUT_DIR, 'briefing-live-updated.png') })
    await context.close()
  })
})

describe('live: a change that arrives before a part of the page has hydrated', () => {
  // The runway card's code loads once the browser is idle (utils/late-hydration.ts): here the browser is kept
  // "busy" (requestIdleCallback holds its callbacks) and the code, once asked for, is held back, so the briefing
  // changes first. Vue alone would drop the card's server markup meanwhile (tests/component/late-hydration.test.ts).
  it('the runway card keeps its figures while its code loads, then shows the new ones, with no hydration mismatch', async () => {
    const code = await fieldWith([{ heightM: 10, directionDeg: 180, speedKt: 5 }, { heightM: 600, directionDeg: 190, speedKt: 10 }])
    const { context, page } = await pilotPage(DESK)
    await page.addInitScript(() => {
      const w = window as unknown as { heldIdle: (() => void)[] }
      w.heldIdle = []
      window.requestIdleCallback = (cb) => {
        w.heldIdle.push(() => cb({ didTimeout: true, timeRemaining: () => 0 }))
        return w.heldIdle.length
      }
      window.cancelIdleCallback = () => {}
    })
    const problems: string[] = []
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warning') problems.push(m.text())
    })
    page.on('pageerror', e => problems.push(e.message))
    let release = () => {}
    const held = new Promise<void>(r => (release = r))
    let asked = false
    await page.route('**/_nuxt/*.js', async (route) => {
      const response = await route.fetch()
      const body = await response.text()
      if (body.includes('__name:"BriefingRunwayCard"')) {
        asked = true
        await held
      }
      await route.fulfill({ response, body })
    })
    // Not open(): the held request keeps the network busy.
    await page.goto(`/briefings/${code}?end=18`)
    await page.locator('[data-test=live][data-state=live]').waitFor({ timeout: 10_000 })
    const card = page.locator('[data-test=runway-card]')
    const before = await card.textContent()
    expect(before).toContain('5 kt')
    expect(asked).toBe(false) // the browser has not been idle yet
    expect((await dispatcher.post(`/api/airfields/${code}/profiles`, { ...profileBody(0, 3), levels: EXCEEDING })).status).toBe(201)
    await page.locator('[data-test=updated]').waitFor({ timeout: 10_000 })
    expect(await page.locator('[data-test=surface-wind]').textContent()).toContain('200°T/5 kt')
    expect(asked).toBe(true)
    expect(await card.count()).toBe(1) // still drawn, with the figures it was rendered with
    expect(await card.textContent()).toBe(before)
    release()
    await expect.poll(async () => await card.textContent(), { timeout: 10_000 }).not.toBe(before)
    await page.evaluate(() => (window as unknown as { heldIdle: (() => void)[] }).heldIdle.forEach(cb => cb()))
    // The card now follows the new profile (four levels), and its display answers a tap: it has hydrated.
    expect(await card.locator('[data-test=polar-point]').count()).toBe(EXCEEDING.length)
    await card.locator('[data-test=polar-point][data-level-index="1"]').click()
    await expect.poll(() => card.locator('[data-test=polar-readout]').textContent()).toContain('at 40 kt')
    expect(problems.filter(p => /hydrat|mismatch/i.test(p))).toEqual([])
    await context.close()
  })
})

describe('access and paper', () => {
  for (const [name, viewport] of [['desk', DESK], ['phone', PHONE]] as const) {
    it(`axe-core in the page (${name}): no serious or critical violation, text contrast included`, async () => {
      const { context, page } = await pilotPage(viewport)
      const code = await fieldWith(EXCEEDING)
      for (const path of ['/briefings/XHGH', `/briefings/${code}`]) {
        await open(page, path)
        await page.addScriptTag({ content: AXE_SOURCE })
        const result = await page.evaluate(async () => {
          // @ts-expect-error axe is injected above
          const r = await window.axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21aa'] } })
          return r.violations.map((v: { id: string, impact: string, nodes: { target: string[] }[] }) => ({ id: v.id, impact: v.impact, targets: v.nodes.slice(0, 5).map(n => n.target.join(' ')) }))
        })
        const bad = result.filter((v: { impact: string }) => v.impact === 'serious' || v.impact === 'critical')
        expect(bad, `${path}: ${JSON.stringify(bad)}`).toEqual([])
      }
      await context.close()
    })
  }

  it('the day\'s trend chart shows the runway end being briefed, before and after its code has loaded', async () => {
    const { context, page } = await pilotPage(DESK)
    for (const d of ['04', '22']) {
      await open(page, `/briefings/XVAL?end=${d}`)
      const select = page.locator('[data-test=trend] select')
      // As the server sent it (the chart below the first screen is not hydrated yet).
      expect(await select.evaluate(el => (el as HTMLSelectElement).value), `end ${d}, as sent`).toBe(d)
      await page.locator('[data-test=trend]').scrollIntoViewIfNeeded()
      await expect.poll(() => page.locator('[data-test=trend]').textContent()).toContain(`Runway ${d}: surface crosswind`)
      expect(await select.evaluate(el => (el as HTMLSelectElement).value), `end ${d}, hydrated`).toBe(d)
    }
    await context.close()
  })

  it('phone: the day\'s trend chart fits the width, names every line at its end and keeps its text readable', async () => {
    const { context, page } = await pilotPage(PHONE)
    await open(page, '/briefings/XVAL')
    const trend = page.locator('[data-test=trend]')
    await trend.scrollIntoViewIfNeeded()
    await trend.locator('[data-test=trend-wind]').waitFor()
    // Once hydrated (on view), the chart redraws at its own pixel width instead of a scaled-down desk drawing.
    await page.waitForFunction(() => [...document.querySelectorAll('[data-test=trend] svg')].every(s => Number(s.getAttribute('width')) <= 390))
    const facts = await trend.evaluate((el) => {
      const svgs = [...el.querySelectorAll('svg')]
      const texts = [...el.querySelectorAll('svg text')] as SVGTextElement[]
      return {
        widest: Math.max(...svgs.map(s => s.getBoundingClientRect().right)),
        // Font size as drawn: the CSS size times the SVG's scale (its drawn width over its viewBox width).
        smallestFontPx: Math.min(...texts.map((t) => {
          const svg = t.ownerSVGElement!
          return parseFloat(getComputedStyle(t).fontSize) * svg.getBoundingClientRect().width / svg.viewBox.baseVal.width
        })),
        lineNames: [...el.querySelectorAll('[data-test=trend-line-label]')].map(t => t.textContent ?? ''),
        legend: el.querySelector('p')?.textContent ?? '',
      }
    })
    expect(facts.widest).toBeLessThanOrEqual(PHONE.width)
    expect(facts.smallestFontPx).toBeGreaterThanOrEqual(10.5)
    expect(facts.lineNames.some(n => n.startsWith('shear'))).toBe(true)
    expect(facts.lineNames.some(n => n.startsWith('crosswind'))).toBe(true)
    expect(facts.legend).not.toMatch(/teal|amber|red/) // the legend does not rely on colour names
    await trend.screenshot({ path: join(OUTPUT_DIR, 'briefing-phone-trend.png') })
    await context.close()
  })

  it('print: the chosen end on one page, the caution, the key heights, the 100 ft table open, no hints, dates as 2026-12-02 00:00Z', async () => {
    const { context, page } = await pilotPage(DESK)
    await open(page, '/briefings/XVAL?end=22')
    await page.emulateMedia({ media: 'print' })
    expect(await page.locator('[data-test=key-heights]').isVisible()).toBe(true)
    expect(await page.locator('[data-test=print-header] [data-test=caution]').isVisible()).toBe(true)
    expect(await page.locator('[data-test=height-table]').isVisible()).toBe(true)
    expect(await page.locator('[data-test=height-table] tbody tr').first().isVisible()).toBe(true)
    expect(await page.getByText('Select a level').isVisible()).toBe(false)
    expect(await page.locator('[data-test=pickers]').isVisible()).toBe(false)
    expect(await page.locator('[data-test=other-ends]').isVisible()).toBe(false)
    const header = (await page.locator('[data-test=print-header]').textContent())!
    expect(header).toMatch(/valid \d{4}-\d{2}-\d{2} \d{2}:\d{2}Z to \d{4}-\d{2}-\d{2} \d{2}:\d{2}Z/)
    await page.screenshot({ path: join(OUTPUT_DIR, 'briefing-print.png'), fullPage: true })
    const pdf = await page.pdf({ format: 'A4', path: join(OUTPUT_DIR, 'briefing-print.pdf') })
    const pages = (pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length
    expect(pages).toBe(1)
    await context.close()
  })
})
