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
  screenshot(page: Page, name: string): Promise<string>
  close(): Promise<void>
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
  const browser = await chromium.launch({
    executablePath: process.env.LUMENYARD_CHROMIUM ?? '/usr/bin/chromium',
    // launch() gives every run a fresh, empty profile of its own.
    args: CHROMIUM_ARGS,
  })
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
    async screenshot(page, name) {
      const file = path.join(SCREENSHOTS, `${name}.png`)
      await page.screenshot({ path: file, fullPage: true, timeout: 60_000 }) // a record, not a check: a busy machine may take long
      return file
    },
    async close() {
      await browser.close()
      await new Promise<void>((resolve) => {
        server.close(() => resolve())
        server.closeAllConnections()
      })
      await built.close()
      await ds.destroy()
    },
  }
}
