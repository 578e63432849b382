// The build's list of each page's files starts from the client's route table (scripts/routePreloads.ts): every
// lazily loaded view in src/router is found with its paths, and no path is paired with another record's view.
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { describe, expect, it } from 'vitest'
import { FALLBACK_MESSAGE_BUNDLES, routeViews } from '../../scripts/routePreloads.js'
import { pageHtml } from '../../server/http/pagePreloads.js'

const root = path.resolve(import.meta.dirname, '..', '..')
const routeFiles = [path.join(root, 'src/router/index.ts'), ...readdirSync(path.join(root, 'src/router/areas')).map((f) => path.join(root, 'src/router/areas', f))]

describe('route table to views', () => {
  const found = routeViews(root)

  it('finds every lazily loaded view of the route table once', () => {
    // Counted independently: each `import('@/views/…')` in the route files is one view.
    const imports = routeFiles.flatMap((f) => [...readFileSync(f, 'utf8').matchAll(/import\('@\/(views\/[^']+)'\)/g)].map((m) => path.join(root, 'src', m[1])))
    const catchAll = path.join(root, 'src/views/NotFoundView.vue') // its path is a pattern, not a page address
    expect(found.map((r) => r.view).sort()).toEqual(imports.filter((v) => v !== catchAll).sort())
  })

  it('pairs each path with its own view (and an alias with the same view)', () => {
    const viewOf = (p: string) => path.relative(path.join(root, 'src/views'), found.find((r) => r.paths.includes(p))!.view)
    expect(viewOf('/stock/overview')).toBe('stock/StockOverviewView.vue')
    expect(viewOf('/sign-in')).toBe('SignInView.vue')
    expect(viewOf('/stock/ledger')).toBe(viewOf('/stock/movements'))
    // A parameter keeps its own pattern as the router reads it (the source writes '\\d', the string holds \d).
    expect(viewOf('/counter/jobs/:id(\\d+)')).toBe('counter/JobView.vue')
    // The home page's view loads on its own too (the sign-in page does not carry the start page's code).
    expect(viewOf('/')).toBe('HomeView.vue')
  })
})

describe('messages every signed-in page loads', () => {
  it('are the bundles of the fallback language the client loads', () => {
    const i18n = readFileSync(path.join(root, 'src/i18n/index.ts'), 'utf8')
    expect(i18n).toContain("const FALLBACK: Locale = 'en'")
    expect(i18n).toContain("en: { boot: () => import('./bundles/enBoot'), rest: () => import('./bundles/enRest') }")
    expect(FALLBACK_MESSAGE_BUNDLES.filter((file) => !existsSync(path.join(root, file)))).toEqual([])
    expect(FALLBACK_MESSAGE_BUNDLES.map((file) => path.basename(file))).toEqual(['enBoot.ts', 'enRest.ts'])
  })
})

describe('a page\u2019s HTML with its files', () => {
  const dist = mkdtempSync(path.join(os.tmpdir(), 'lumenyard-preloads-'))
  writeFileSync(path.join(dist, 'index.html'), '<html><head><script type="module" src="/assets/index-A1.js"></script></head><body></body></html>')
  writeFileSync(path.join(dist, 'route-preloads.json'), JSON.stringify({
    routes: [
      { paths: ['/stock/overview'], scripts: ['/assets/StockOverviewView-B2.js', '/assets/grid-C3.js'], styles: ['/assets/StockOverviewView-D4.css'] },
      { paths: ['/counter/jobs/:id(\\d+)'], scripts: ['/assets/JobView-E5.js', 'https://elsewhere.example/x.js', '/assets/"><script>.js'], styles: [] },
    ],
    signedIn: { scripts: ['/assets/enBoot-F6.js'] },
  }))
  const pageFor = pageHtml(dist)
  /** The page as a visitor with a session cookie gets it. */
  const html = (p: string, query: Record<string, unknown> = {}) => pageFor(p, { query })

  it('names the listed files of the page asked for, and only for that page', () => {
    // source: HTML Living Standard, link types "modulepreload" (a module script) and "preload" with as="style"
    expect(html('/stock/overview')).toContain('<link rel="modulepreload" crossorigin href="/assets/grid-C3.js">')
    expect(html('/stock/overview/')).toContain('/assets/StockOverviewView-B2.js')
    expect(html('/stock/overview')).toContain('<link rel="preload" as="style" crossorigin href="/assets/StockOverviewView-D4.css">')
    expect(html('/stock/overview/more')).not.toContain('StockOverviewView')
    expect(html('/counter/jobs/12')).toContain('/assets/JobView-E5.js')
    expect(html('/counter/jobs/twelve')).not.toContain('JobView')
    expect(html('/elsewhere')).not.toContain('StockOverviewView')
  })

  it('gives a visitor without a session the page as built, with no links', () => {
    expect(pageFor('/stock/overview')).toBe(readFileSync(path.join(dist, 'index.html'), 'utf8'))
  })

  it('asks for the session and the page\u2019s opening data ahead of the entry script, and names the English messages', () => {
    // source: HTML Living Standard, link type "preload" with as="fetch"; Fetch Standard: a request's mode and
    // credentials mode must match for the preloaded response to be used, hence crossorigin (cors, same-origin)
    // as the client's own fetch.
    const page = html('/stock/overview')
    const entry = page.indexOf('<script type="module"')
    const links = ['/api/session', '/api/stock/levels?lowOnly=false&amp;includeEmpty=false', '/api/stock/places']
      .map((href) => page.indexOf(`<link rel="preload" as="fetch" crossorigin href="${href}">`))
    expect(links.every((at) => at >= 0 && at < entry), page).toBe(true)
    expect(page).toContain('<link rel="modulepreload" crossorigin href="/assets/enBoot-F6.js">')
    // The filters come from the address as the page reads them (by hand: warehouse 3, low stock only).
    expect(html('/stock/overview', { warehouseId: '3', lowOnly: 'true' })).toContain('href="/api/stock/levels?warehouseId=3&amp;lowOnly=true&amp;includeEmpty=false"')
    // A page without opening data still asks for the session and the messages, and nothing else.
    const other = html('/counter/jobs/12')
    expect(other.match(/as="fetch"/g)).toHaveLength(1)
    expect(other).toContain('/assets/enBoot-F6.js')
  })

  it('never lets the address write markup into the page', () => {
    const page = html('/stock/overview', { warehouseId: '"><script>alert(1)</script>', lowOnly: ['true', 'x'] })
    expect(page).not.toContain('<script>alert')
    expect(page).toContain('href="/api/stock/levels?lowOnly=true&amp;includeEmpty=false"')
  })

  it('never names a file outside the built assets', () => {
    expect(html('/counter/jobs/12')).not.toContain('elsewhere.example')
    expect(html('/counter/jobs/12')).not.toContain('<script>.js')
  })
})
