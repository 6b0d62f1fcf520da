// Helpers for the browser suite: Debian's Chromium driven by playwright-core (never a downloaded browser).
// playwright-core gives each launch a fresh, empty profile folder of its own.
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'
import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import { BASE_URL, DEMO, DEMO_PASSWORD } from './api'

export { BASE_URL, DEMO }
export const OUTPUT_DIR = process.env.TEST_OUTPUT_DIR || 'test-results'

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync'],
  })
}

/** A context that records every request URL the pages make, so a test can assert they all stay on 127.0.0.1. */
export async function newContext(browser: Browser, options: Parameters<Browser['newContext']>[0] = {}) {
  const context = await browser.newContext({ baseURL: BASE_URL, ...options })
  const requests: string[] = []
  context.on('request', r => requests.push(r.url()))
  return { context, requests }
}

export async function signInPage(page: Page, role: keyof typeof DEMO) {
  await page.goto('/sign-in')
  await page.waitForLoadState('networkidle')
  await page.fill('#email', DEMO[role])
  await page.fill('#password', DEMO_PASSWORD)
  await Promise.all([
    page.waitForURL(url => !url.pathname.startsWith('/sign-in'), { timeout: 20_000 }),
    page.click('button[type=submit]'),
  ])
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(OUTPUT_DIR, { recursive: true })
  // A full-page shot of a long page (the mailbox holds every message) can take long on a loaded machine (the browser tests' ceiling is 180 s).
  await page.screenshot({ path: join(OUTPUT_DIR, `${name}.png`), fullPage: true, timeout: 90_000 })
}

export type { Browser, BrowserContext, Page }
