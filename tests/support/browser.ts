// Browser tests: the built client and the real API served in-process on a random port, driven by
// playwright-core in Debian's Chromium (never a downloaded browser).
import { mkdirSync } from 'node:fs'
import type { Server } from 'node:http'
import path from 'node:path'
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'
import { createApp, type BuiltApp } from '../../server/app.js'
import { loadConfig } from '../../server/config.js'
import { createDataSource } from '../../server/db/dataSource.js'
import type { DataSource } from 'typeorm'

export const SCREENSHOTS = path.resolve(import.meta.dirname, '..', '..', 'test-results', 'screenshots')
export const DEMO_PASSWORD = 'brightcourse-demo'

export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--disable-dev-shm-usage',
]

export interface E2eHarness {
  baseUrl: string
  ds: DataSource
  built: BuiltApp
  browser: Browser
  newPage(opts?: { viewport?: { width: number; height: number } }): Promise<{ page: Page; context: BrowserContext }>
  signIn(page: Page, username: string, password?: string): Promise<void>
  signInByApi(page: Page, username: string, password?: string): Promise<void>
  screenshot(page: Page, name: string): Promise<string>
  close(): Promise<void>
}

let launched: Promise<Browser> | undefined

/**
 * One Chromium for the browser test files of a worker: they run one after another in one worker that keeps its
 * modules (vitest.config.ts), and launching and closing Chromium for every file took seconds a file on a busy
 * machine. Each file's pages live in browser contexts of their own (a fresh profile each: cookies, storage, cache),
 * closed with the file's harness; playwright closes the browser when the worker exits. A browser that went away
 * (a crash) is launched again for the next file.
 */
async function sharedBrowser(): Promise<Browser> {
  const running = await launched?.catch(() => undefined)
  if (running?.isConnected()) return running
  launched = chromium.launch({
    executablePath: process.env.LUMENYARD_CHROMIUM ?? '/usr/bin/chromium',
    // launch() gives every run a fresh, empty profile of its own.
    args: CHROMIUM_ARGS,
  })
  return launched
}

/** overrides: environment for this harness only (e.g. NODE_ENV=production for a first-run test). */
export async function startE2e(overrides: Partial<NodeJS.ProcessEnv> = {}): Promise<E2eHarness> {
  const config = loadConfig({ LUMENYARD_SIGNIN_FAILS_PER_IP: '100000', ...process.env, ...overrides })
  const ds = createDataSource(config)
  await ds.initialize()
  const built = createApp({ config, ds })
  const server: Server = await new Promise((resolve) => {
    const s = built.app.listen(0, '127.0.0.1', () => resolve(s))
  })
  const address = server.address()
  const baseUrl = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`
  const browser = await sharedBrowser()
  mkdirSync(SCREENSHOTS, { recursive: true })

  return {
    baseUrl,
    ds,
    built,
    browser,
    async newPage(opts = {}) {
      const context = await browser.newContext({ baseURL: baseUrl, viewport: opts.viewport ?? { width: 1280, height: 860 } })
      const page = await context.newPage()
      page.setDefaultTimeout(15_000)
      return { page, context }
    },
    async signIn(page, username, password = DEMO_PASSWORD) {
      await page.goto('/sign-in')
      await page.locator('[data-test="username"]').fill(username)
      await page.locator('[data-test="password"]').fill(password)
      await page.locator('[data-test="sign-in"]').click()
      await page.locator('[data-test="greeting"]').waitFor()
    },
    /**
     * Signs in as the sign-in form does (the same request), in the page's own browser context, without loading the
     * sign-in page and the start page first: for a test that opens a screen of its own next (a page.goto). A
     * session of its own, as the form gives. The form itself is walked by signIn, in the tests that read the start
     * page or the sign-in (shell, the start page, session resume, the Spanish screens, the walks of every screen).
     */
    async signInByApi(page, username, password = DEMO_PASSWORD) {
      const res = await page.request.post('/api/session', { headers: { 'X-Lumenyard-Request': '1' }, data: { username, password } })
      if (res.status() !== 200) throw new Error(`sign-in as ${username} failed: ${res.status()} ${await res.text()}`)
    },
    async screenshot(page, name) {
      const file = path.join(SCREENSHOTS, `${name}.png`)
      await page.screenshot({ path: file, fullPage: true, timeout: 60_000 }) // a record, not a check: a busy machine may take long
      return file
    },
    async close() {
      // The file's own contexts, left open or not; the browser stays for the next file.
      await Promise.all(browser.contexts().map((c) => c.close()))
      await new Promise<void>((resolve) => {
        server.close(() => resolve())
        server.closeAllConnections()
      })
      await built.close()
      await ds.destroy()
    },
  }
}
