// A walk over every screen the client's router knows, read from the router itself in the browser, so a
// new route is visited without anyone listing it here. Shared by the browser tests that must hold on
// every screen (accessibility, languages).
//
// A route with parameters (`/counter/jobs/:id`) needs a real record: the walk takes the first link to
// that route it met on an earlier screen, else a record from the database (SAMPLE_SQL). A parameterised
// route with neither makes the walk fail with the route's name, never pass it by.
import type { Page, Request } from 'playwright-core'
import type { DataSource } from 'typeorm'
import type { Role } from '../../shared/roles.js'

export interface WalkRoute {
  name: string
  path: string
  public: boolean
  bare: boolean
  area: string | null
  roles: Role[] | null
}

interface RouterLike {
  getRoutes(): { name?: unknown; path: string; aliasOf?: unknown; meta: Record<string, unknown> }[]
  resolve(to: string): { name?: unknown; matched: unknown[] }
  push(to: string): Promise<unknown>
  currentRoute: { value: { fullPath: string; name?: unknown } }
}
declare global {
  interface Window {
    __lumenyardWalk?: { router: RouterLike }
  }
}

/** The router of the mounted app (Vue keeps the app on its container element, in production builds too). */
const ROUTER_IN_PAGE = `(() => {
  const app = document.querySelector('#app').__vue_app__
  return app.config.globalProperties.$router
})()`

/** Every named route of the client's router, aliases and the catch-all left out. */
export async function routeTable(page: Page): Promise<WalkRoute[]> {
  return page.evaluate((src) => {
    const router = (0, eval)(src) as RouterLike
    return router
      .getRoutes()
      .filter((r) => !r.aliasOf && typeof r.name === 'string' && !r.path.includes('(.*)'))
      .map((r) => ({
        name: r.name as string,
        path: r.path,
        public: r.meta.public === true,
        bare: r.meta.bare === true,
        area: (r.meta.area as string | undefined) ?? null,
        roles: (r.meta.roles as Role[] | undefined) ?? null,
      }))
  }, ROUTER_IN_PAGE)
}

/**
 * The role that uses a screen: the most specific role the route admits (the administrator only for screens
 * nobody else may open), in the order the people who work there come first.
 */
const ROLE_PREFERENCE: readonly Role[] = ['warehouse', 'counter', 'buyer', 'viewer', 'admin']
export function roleFor(route: WalkRoute): Role {
  if (!route.roles) return 'counter'
  return ROLE_PREFERENCE.find((r) => route.roles!.includes(r)) ?? 'admin'
}

/**
 * The main dialogs, opened on their screen by the role that uses the screen: the clicks that open each one
 * (a tab first where the opener sits on one). The walks check each one open (accessibility, the Spanish screens).
 */
export const MAIN_DIALOGS: Record<string, string[]> = {
  'counter-home': ['[data-test="start-takeoff"]'],
  'counter-customers': ['[data-test="new-customer"]'],
  'counter-jobs': ['[data-test="new-job"]'],
  'counter-job': ['[data-test="upload-takeoff"]'],
  'purchasing-orders': ['[data-test="new-order"]'],
  'purchasing-vendors': ['[data-test="add-vendor"]'],
  'purchasing-vendor': ['[data-test="import-price-list"]'],
  'purchasing-reorder-policies': ['[data-test="policy-add"]'],
  'admin-users': ['[data-test="add-user"]'],
  'counter-settings': ['#tab-rules', '[data-test="rule-add"]'],
}
/** Records for parameterised routes that no earlier screen links to (the first one of each kind in the demo). */
const SAMPLE_SQL: Record<string, string> = {
  'counter-job': 'SELECT MIN(job_id) AS id FROM takeoffs',
  'counter-takeoff': 'SELECT MIN(id) AS id FROM takeoffs',
  'counter-bom': 'SELECT MIN(id) AS id FROM boms',
  'counter-pick-new': 'SELECT MIN(id) AS bomId FROM boms',
  'counter-pick-list': 'SELECT MIN(id) AS id FROM pick_lists',
  // On the demo, its sales order's list: a line matched by lot, so four steps (their wrap at 320 px is checked).
  'warehouse-pick': "SELECT MIN(id) AS id FROM pick_lists WHERE status IN ('released', 'picking')",
  'warehouse-pick-sheet': 'SELECT MIN(id) AS id FROM pick_lists',
  'warehouse-receive': "SELECT MIN(id) AS id FROM purchase_orders WHERE status IN ('sent', 'partly_received')",
  'purchasing-order': 'SELECT MIN(id) AS id FROM purchase_orders',
  'purchasing-vendor': 'SELECT MIN(id) AS id FROM vendors',
  'stock-item': 'SELECT MIN(id) AS id FROM items',
  'stock-item-edit': 'SELECT MIN(id) AS id FROM items',
  'warehouse-count': "SELECT MIN(id) AS id FROM cycle_counts WHERE status = 'open'",
  'warehouse-count-review': 'SELECT MIN(id) AS id FROM cycle_counts',
  'counter-quote': 'SELECT MIN(id) AS id FROM quotes',
  'counter-sales-order': 'SELECT MIN(id) AS id FROM sales_orders',
  'handover-ticket': 'SELECT MIN(id) AS id FROM handover_tickets',
}

export class RouteSamples {
  private readonly fromLinks = new Map<string, string>()
  constructor(private readonly ds: DataSource) {}

  /** Notes the first link to every route on the page (its own href, resolved by the router). */
  async harvest(page: Page): Promise<void> {
    const found = await page.evaluate((src) => {
      const router = (0, eval)(src) as RouterLike
      const out: [string, string][] = []
      for (const a of Array.from(document.querySelectorAll<HTMLAnchorElement>('a[href^="/"]'))) {
        const href = a.getAttribute('href')!
        const r = router.resolve(href)
        if (typeof r.name === 'string' && r.matched.length) out.push([r.name, href])
      }
      return out
    }, ROUTER_IN_PAGE)
    for (const [name, href] of found) if (!this.fromLinks.has(name)) this.fromLinks.set(name, href.split('#')[0])
  }

  /** The address to open for a route: as it is, from a link seen, or filled from the database. */
  async pathFor(route: WalkRoute): Promise<string> {
    if (!route.path.includes(':')) return route.path
    const linked = this.fromLinks.get(route.name)
    if (linked) return linked
    const sql = SAMPLE_SQL[route.name]
    if (!sql) throw new Error(`No record to open route "${route.name}" (${route.path}): link to it from a list, or give it a query in tests/support/routeWalk.ts`)
    const [row] = (await this.ds.query(sql)) as Record<string, unknown>[]
    let path = route.path
    for (const [param, value] of Object.entries(row ?? {})) {
      if (value == null) continue
      path = path.replace(new RegExp(`:${param}(\\([^)]*\\))?`), String(value))
    }
    if (path.includes(':')) throw new Error(`The demo data has no record for route "${route.name}" (${route.path})`)
    return path
  }
}

/**
 * Opens an address inside the running app (the router, no page load), then waits until the page has
 * settled: the route is current, no request is in flight for a moment, and no loading mask shows.
 */
export async function openInApp(page: Page, path: string): Promise<void> {
  const inFlight = trackRequests(page)
  try {
    await page.evaluate(
      async ([src, to]) => {
        const router = (0, eval)(src) as RouterLike
        await router.push(to)
      },
      [ROUTER_IN_PAGE, path] as const,
    )
    await settle(page, inFlight).catch((e: Error) => {
      throw new Error(`${path} did not settle: ${e.message}`)
    })
  } finally {
    inFlight.stop()
  }
}

interface RequestTracker {
  count(): number
  /** The addresses still in flight, for a message when the page never goes quiet. */
  pending(): string[]
  stop(): void
}

function trackRequests(page: Page): RequestTracker {
  const inFlight = new Set<Request>()
  const up = (r: Request) => inFlight.add(r)
  const down = (r: Request) => inFlight.delete(r)
  page.on('request', up)
  page.on('requestfinished', down)
  page.on('requestfailed', down)
  return {
    count: () => inFlight.size,
    pending: () => [...inFlight].map((r) => `${r.method()} ${r.url()}`),
    stop() {
      page.off('request', up)
      page.off('requestfinished', down)
      page.off('requestfailed', down)
    },
  }
}

/** How long a screen may keep a request open before the walk names it rather than waiting on. */
const QUIET_WITHIN_MS = 30_000

// A mask on its way out (its fade's leave classes) no longer covers anything; a region that says it is
// busy (aria-busy: data loading, a bill being computed) is still changing.
const BUSY = '.el-loading-mask:not(.el-loading-fade-leave-active), .el-skeleton, .ag-overlay-loading-wrapper, [aria-busy="true"]'

/** Waits for no request in flight over three animation frames in a row (naming what is still open after 30 s) and no loading mask or skeleton. */
export async function settle(page: Page, tracker?: RequestTracker): Promise<void> {
  const own = tracker ?? trackRequests(page)
  try {
    const giveUpAt = Date.now() + QUIET_WITHIN_MS
    for (let quiet = 0; quiet < 3; ) {
      if (Date.now() > giveUpAt) throw new Error(`requests still open after ${QUIET_WITHIN_MS / 1000} s: ${own.pending().join(', ')}`)
      await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => setTimeout(r, 50))))
      quiet = own.count() <= 0 ? quiet + 1 : 0
    }
    // The grid keeps its (hidden) overlay in the page: only a loading mark that shows counts. The check is a
    // function, never a string: the app's Content-Security-Policy forbids eval, which a string predicate needs
    // once it has to poll (a string made every mask that was up at the first look read as "never went away").
    const shown = (sel: string) => Array.from(document.querySelectorAll(sel)).find((e) => e.checkVisibility())?.outerHTML.slice(0, 300) ?? null
    const busy = await page
      .waitForFunction((sel) => !Array.from(document.querySelectorAll(sel)).some((e) => e.checkVisibility()), BUSY, { timeout: 30_000 })
      .then(() => null, async (e: Error) => {
        if (e.name !== 'TimeoutError') throw e
        return page.evaluate(shown, BUSY)
      })
    if (busy) throw new Error(`still loading after 30 s: ${busy}`)
  } finally {
    if (!tracker) own.stop()
  }
}

/** Every screen once, grouped by the role that uses it, public screens first. */
export function byRole(routes: WalkRoute[]): Map<Role | 'signed-out', WalkRoute[]> {
  const out = new Map<Role | 'signed-out', WalkRoute[]>()
  for (const r of routes) {
    const who = r.public ? 'signed-out' : roleFor(r)
    out.set(who, [...(out.get(who) ?? []), r])
  }
  // Screens without parameters first, so their links supply the records for the rest.
  for (const list of out.values()) list.sort((a, b) => Number(a.path.includes(':')) - Number(b.path.includes(':')))
  return new Map([...out].sort(([a], [b]) => (a === 'signed-out' ? -1 : b === 'signed-out' ? 1 : 0)))
}
