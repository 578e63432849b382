// What a person waits for in Chromium (Debian's /usr/bin/chromium through playwright-core): the first rows
// of a grid from a cold start (a fresh browser context, so nothing cached), and the JavaScript a page loads.
import { gzipSync } from 'node:zlib'
import { chromium, type Browser } from 'playwright-core'

export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  })
}

/** Milliseconds from the start of navigation to the first frame with grid rows on screen. */
export async function firstGridRows(browser: Browser, url: string, cookie?: string): Promise<number> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } })
  try {
    if (cookie) {
      const [name, value] = cookie.split('=')
      // For the whole site: given only the page's URL, the cookie's path would be the page's folder (/stock/), and
      // the API calls under /api would go without it.
      await context.addCookies([{ name, value, domain: new URL(url).hostname, path: '/' }])
    }
    const page = await context.newPage()
    await page.goto(url, { waitUntil: 'commit' })
    const at = await page.waitForFunction(
      () => (document.querySelector('.ag-row .ag-cell') ? performance.now() : false),
      null,
      { polling: 'raf', timeout: 60_000 },
    )
    return Number(await at.jsonValue())
  } finally {
    await context.close()
  }
}

/**
 * The JavaScript a page loads until its password box shows and the network is then quiet, each file gzipped at
 * level 9 (how most servers send it). Waiting for the form first matters on a loaded machine: half a second of
 * script running with no request out counts as quiet, and the page's own chunk was then left out of the sum.
 */
export async function pageScripts(browser: Browser, url: string): Promise<{ files: number; bytes: number; gzipBytes: number }> {
  const context = await browser.newContext()
  try {
    const page = await context.newPage()
    const bodies: Promise<Buffer>[] = []
    page.on('response', (res) => {
      if (res.request().resourceType() === 'script') bodies.push(res.body().catch(() => Buffer.alloc(0)))
    })
    await page.goto(url, { waitUntil: 'commit' })
    await page.locator('input[type="password"]').first().waitFor({ timeout: 60_000 })
    await page.waitForLoadState('networkidle')
    const all = await Promise.all(bodies)
    return { files: all.length, bytes: all.reduce((s, b) => s + b.length, 0), gzipBytes: all.reduce((s, b) => s + gzipSync(b, { level: 9 }).length, 0) }
  } finally {
    await context.close()
  }
}
