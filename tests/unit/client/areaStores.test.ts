// The client's area stores (src/stores) hold one person's data: signing out, a session that ends, or someone
// else signing in on the same browser leaves none of it behind, including an answer still on its way and a
// read started early for the next page. A small stand-in for the server answers per signed-in user, so each
// check can tell whose data a store holds. Emptying per-user caches at sign-out: OWASP Session Management
// Cheat Sheet, "Logout" (client-side data is cleared when the session ends) — common practice.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import { isApiError, prefetchGet } from '@/api/client'
import { warehousesApi } from '@/api/warehouses'
import { useCounterCatalog } from '@/composables/useCounterCatalog'
import { useStockPlaces } from '@/composables/useStockPlaces'
import { useSessionStore } from '@/stores/session'
import { useWarehousesStore } from '@/stores/warehouses'

interface Person { id: number; username: string }
const PEOPLE: Record<string, Person> = { ana: { id: 1, username: 'ana.ruiz' }, ben: { id: 2, username: 'ben.okafor' } }

/** What each person's server answers hold: a name that says whose they are. */
const catalogOf = (p: Person) => ({
  blocks: [],
  roleItems: [],
  rules: [],
  wastePct: {},
  figures: { groutDepthMm: 10, fixingSpacingMm: 400, leftoverWarnMm: 25, baseToleranceMm: 6, baseToleranceDeg: 1 },
  looseItems: [{ itemId: p.id, sku: `LOOSE-${p.username}`, name: `Seen by ${p.username}`, unit: 'each', family: 'sealant', madeToOrder: false }],
})
const placesOf = (p: Person) => [{ id: p.id, code: `WH-${p.username}`, name: p.username, active: true, bins: [] }]

let signedIn: Person | null = null
/** Answers held back until the test lets them go (an answer arriving after a sign-out). */
let holdCatalog: Promise<void> | null = null
const calls: string[] = []

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } })
}
const userOf = (p: Person) => ({ id: p.id, username: p.username, displayName: p.username, roles: ['admin'], unitPreference: 'in', weightUnit: 'lb', locale: 'en' })

async function fakeServer(input: RequestInfo | URL, init?: RequestInit): Promise<Response> {
  const path = String(input)
  const method = init?.method ?? 'GET'
  calls.push(`${method} ${path}`)
  if (path === '/api/session' && method === 'POST') {
    const { username } = JSON.parse(String(init!.body)) as { username: string }
    signedIn = PEOPLE[username]
    return json(200, { user: userOf(signedIn) })
  }
  if (path === '/api/session' && method === 'DELETE') {
    signedIn = null
    return new Response(null, { status: 204 })
  }
  if (!signedIn) return json(401, { error: { code: 'unauthenticated', message: 'Please sign in.' } })
  const who = signedIn
  if (path === '/api/takeoffs/catalog') {
    if (holdCatalog) await holdCatalog
    return json(200, catalogOf(who))
  }
  if (path === '/api/stock/places') return json(200, placesOf(who))
  if (path === '/api/warehouses/7') return json(200, { warehouse: { id: 'seven', code: 'MAIN' }, bins: [] }) // not the expected shape
  return json(404, { error: { code: 'route_not_found', message: 'Not found' } })
}

beforeEach(() => {
  setActivePinia(createPinia())
  signedIn = null
  holdCatalog = null
  calls.length = 0
  vi.stubGlobal('fetch', vi.fn(fakeServer))
})
afterEach(() => {
  vi.unstubAllGlobals()
  vi.restoreAllMocks()
})

describe('area stores on sign-out', () => {
  it('keeps none of the first person’s catalog or warehouses for the next one', async () => {
    const session = useSessionStore()
    await session.signIn('ana', 'x')
    const { catalog, load } = useCounterCatalog()
    const places = useStockPlaces()
    await load()
    await places.load()
    expect(catalog.value?.looseItems[0].sku).toBe('LOOSE-ana.ruiz')
    expect(places.warehouses.value.map((w) => w.code)).toEqual(['WH-ana.ruiz'])

    await session.signOut()
    expect(catalog.value).toBeNull()
    expect(places.places.value).toEqual([])

    await session.signIn('ben', 'x')
    // A page opened by the second person loads again instead of being handed the first person's copy.
    const again = useCounterCatalog()
    expect(again.catalog.value).toBeNull()
    await again.load()
    expect(again.catalog.value?.looseItems[0].sku).toBe('LOOSE-ben.okafor')
    expect(calls.filter((c) => c === 'GET /api/takeoffs/catalog')).toHaveLength(2)
  })

  it('drops an answer that arrives after the sign-out it was asked before', async () => {
    const session = useSessionStore()
    await session.signIn('ana', 'x')
    let release!: () => void
    holdCatalog = new Promise((r) => (release = r))
    const { catalog, load } = useCounterCatalog()
    const late = load()
    await vi.waitFor(() => expect(calls).toContain('GET /api/takeoffs/catalog'))
    session.forget() // the session ended (a 401 elsewhere)
    release()
    await late
    expect(catalog.value).toBeNull()
  })

  it('does not hand a read started for the first person to the next one', async () => {
    const session = useSessionStore()
    await session.signIn('ana', 'x')
    prefetchGet('/stock/places')
    await vi.waitFor(() => expect(calls).toContain('GET /api/stock/places'))
    await session.signOut()
    await session.signIn('ben', 'x')
    const store = useWarehousesStore()
    await store.load()
    expect(store.places.map((w) => w.code)).toEqual(['WH-ben.okafor'])
  })
})

describe('answers checked against their schema', () => {
  it('refuses an answer of the wrong shape in tests, with a code the screens word', async () => {
    // A warehouse answer needs warehouse.id a number and its other fields; the schema check, not the screen, must catch it.
    // source: common practice (validate data at a trust boundary)
    const session = useSessionStore()
    await session.signIn('ana', 'x')
    vi.spyOn(console, 'error').mockImplementation(() => undefined)
    const failure = await warehousesApi.detail(7).then(() => null, (err: unknown) => err)
    expect(isApiError(failure) && failure.code).toBe('answer_shape')
  })
})
