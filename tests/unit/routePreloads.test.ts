// The build's list of each page's files starts from the client's route table (scripts/routePreloads.ts): every
// lazily loaded view in src/router is found with its paths, and no path is paired with another record's view.
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { describe, expect, it } from 'vitest'
import { routeViews } from '../../scripts/routePreloads.js'
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

describe('a page\u2019s HTML with its files', () => {
  const dist = mkdtempSync(path.join(os.tmpdir(), 'lumenyard-preloads-'))
  writeFileSync(path.join(dist, 'index.html'), '<html><head><script type="module" src="/assets/index-A1.js"></script></head><body></body></html>')
  writeFileSync(path.join(dist, 'route-preloads.json'), JSON.stringify({
    routes: [
      { paths: ['/stock/overview'], scripts: ['/assets/StockOverviewView-B2.js', '/assets/grid-C3.js'], styles: ['/assets/StockOverviewView-D4.css'] },
      { paths: ['/counter/jobs/:id(\\d+)'], scripts: ['/assets/JobView-E5.js', 'https://elsewhere.example/x.js', '/assets/"><script>.js'], styles: [] },
    ],
  }))
  const html = pageHtml(dist)

  it('names the listed files of the page asked for, and only for that page', () => {
    // source: HTML Living Standard, link types "modulepreload" (a module script) and "preload" with as="style"
    expect(html('/stock/overview')).toContain('<link rel="modulepreload" crossorigin href="/assets/grid-C3.js">')
    expect(html('/stock/overview/')).toContain('/assets/StockOverviewView-B2.js')
    expect(html('/stock/overview')).toContain('<link rel="preload" as="style" crossorigin href="/assets/StockOverviewView-D4.css">')
    expect(html('/stock/overview/more')).not.toContain('StockOverviewView')
    expect(html('/counter/jobs/12')).toContain('/assets/JobView-E5.js')
    expect(html('/counter/jobs/twelve')).not.toContain('JobView')
    expect(html('/elsewhere')).toBe(readFileSync(path.join(dist, 'index.html'), 'utf8'))
  })

  it('never names a file outside the built assets', () => {
    expect(html('/counter/jobs/12')).not.toContain('elsewhere.example')
    expect(html('/counter/jobs/12')).not.toContain('<script>.js')
  })
})
