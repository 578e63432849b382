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

/**
 * One cold load up to its first grid rows: milliseconds from the start of navigation to the first frame with rows,
 * what the page's main thread did until then (the DevTools protocol's Performance.getMetrics: all its tasks, and the
 * script, layout and style recalculation inside them), and its scripts (how many, when the last one had arrived).
 * The main thread's figures tell a page waiting on its files from a page busy with its own work.
 */
export interface GridLoad {
  firstRows: number
  tasks: number
  script: number
  layout: number
  style: number
  scripts: number
  lastScript: number
}

export async function firstGridRows(browser: Browser, url: string, cookie?: string): Promise<GridLoad> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } })
  try {
    if (cookie) {
      const [name, value] = cookie.split('=')
      // For the whole site: given only the page's URL, the cookie's path would be the page's folder (/stock/), and
      // the API calls under /api would go without it.
      await context.addCookies([{ name, value, domain: new URL(url).hostname, path: '/' }])
    }
    const page = await context.newPage()
    const cdp = await context.newCDPSession(page)
    await cdp.send('Performance.enable')
    await page.goto(url, { waitUntil: 'commit' })
    const at = await page.waitForFunction(
      () => (document.querySelector('.ag-row .ag-cell') ? performance.now() : false),
      null,
      { polling: 'raf', timeout: 60_000 },
    )
    const firstRows = Number(await at.jsonValue())
    const { metrics } = (await cdp.send('Performance.getMetrics')) as { metrics: { name: string; value: number }[] }
    const ms = (name: string) => (metrics.find((m) => m.name === name)?.value ?? 0) * 1000
    const scripts = await page.evaluate(() =>
      (performance.getEntriesByType('resource') as PerformanceResourceTiming[]).filter((e) => e.initiatorType !== 'fetch' && new URL(e.name).pathname.endsWith('.js')).map((e) => e.responseEnd),
    )
    return {
      firstRows, tasks: ms('TaskDuration'), script: ms('ScriptDuration'), layout: ms('LayoutDuration'), style: ms('RecalcStyleDuration'),
      scripts: scripts.length, lastScript: Math.max(0, ...scripts),
    }
  } finally {
    await context.close()
  }
}

/** Medians of several loads, in words: what the main thread did and when the scripts had arrived. */
export function gridLoadWords(loads: GridLoad[], median: (xs: number[]) => number): string {
  const m = (k: keyof GridLoad) => median(loads.map((x) => x[k])).toFixed(0)
  return `main thread ${m('tasks')} ms in tasks (script ${m('script')}, layout ${m('layout')}, style ${m('style')}); ${m('scripts')} scripts, the last in at ${m('lastScript')} ms`
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
