// Trial: two tabs editing the same record, on every edit screen that carries the version it loaded (catalog item,
// vendor, what a vendor sells, warehouse, price level, contractor account, job). Tab A saves a change; tab B then saves
// its own edit of the same field and is refused: it says the record changed meanwhile, keeps what was typed in the
// form, and on accepting the reload shows tab A's value. The API reads back tab A's value: nothing of tab B's edit
// was written. A client that stops sending the version it loaded gets 400 instead of 409 here, and fails every step.
// source: Berenson et al., "A Critique of ANSI SQL Isolation Levels" (SIGMOD 1995), P4 "Lost Update": a write based
// on a stale read must not overwrite another transaction's committed write.
// source: RFC 9110 §15.5.10 (409 Conflict: the request conflicts with the current state of the target resource).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { APIRequestContext, BrowserContext, Page } from 'playwright-core'
import { CSRF, TEST_PASSWORD } from '../support/apiHarness.js'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { createCustomerAndJob, spanishCounterClerk } from '../support/counterFixtures.js'
import { tagOf } from '../support/fixtureRows.js'
import { tabTo } from '../support/keyboard.js'
import { cutOffInside, sidewaysScroll } from '../support/layoutChecks.js'

/** A record made for one step: the screen's address, its save address, and how the refusal names it. */
interface Made {
  id: number
  url: string
  write: string
  /** Reads the edited field back through the API. */
  read: () => Promise<unknown>
  name: string
  /** The edited field's value as made. */
  before: string
}

/** One edit screen: the field both tabs edit, its value after tab A's save and as tab B typed it. */
interface Screen {
  screen: string
  make: (api: APIRequestContext, tag: string) => Promise<Made>
  /** Opens the record's edit dialog; absent for a screen that is the form itself. */
  open?: (page: Page, made: Made) => Promise<void>
  /** data-test of the field and of the save button. */
  field: string
  save: string
  values: { a: string; b: string }
  /** The refusal names the record as tab A left it (a step editing the name itself). */
  nameAfterA?: (a: string) => string
}

/** The API answer's JSON, after checking the status. */
async function answer<T>(res: Awaited<ReturnType<APIRequestContext['get']>>, status = 200): Promise<T> {
  expect(res.status(), await res.text()).toBe(status)
  return (await res.json()) as T
}
const post = async (api: APIRequestContext, url: string, data: Record<string, unknown>) => answer<{ id: number }>(await api.post(url, { headers: CSRF, data }), 201)
const getJson = async <T>(api: APIRequestContext, url: string) => answer<T>(await api.get(url))

const SCREENS: Screen[] = [
  {
    screen: 'catalog item',
    make: async (api, tag) => {
      const sku = `SES-${tag}`
      const { id } = await post(api, '/api/items', { sku, name: 'Clear sealant', family: 'sealant', stockUnit: 'each', cost: '6.2500', listPrice: '11.50', cartridgeMl: '300' })
      return { id, url: `/stock/items/${id}/edit`, write: `/api/items/${id}`, name: sku, before: 'Clear sealant', read: async () => (await getJson<{ item: { name: string } }>(api, `/api/items/${id}`)).item.name }
    },
    field: 'form-name',
    save: 'form-save',
    values: { a: 'Clear sealant, 300 ml', b: 'Grey sealant' },
  },
  {
    screen: 'vendor',
    make: async (api, tag) => {
      const { id } = await post(api, '/api/vendors', { code: `SEV${tag}`, name: `Tidewater Block Supply ${tag}`, terms: 'Net 30' })
      return { id, url: `/purchasing/vendors/${id}`, write: `/api/vendors/${id}`, name: `Tidewater Block Supply ${tag}`, before: 'Net 30', read: async () => (await getJson<{ terms: string }>(api, `/api/vendors/${id}`)).terms }
    },
    open: (page) => page.locator('[data-test="edit-vendor"]').click(),
    field: 'vendor-terms',
    save: 'save-vendor',
    values: { a: 'Net 45', b: 'Net 60' },
  },
  {
    screen: 'what a vendor sells',
    make: async (api, tag) => {
      const vendor = await post(api, '/api/vendors', { code: `SEI${tag}`, name: `Saltmarsh Glass ${tag}` })
      const item = await post(api, '/api/items', { sku: `SEB-${tag}`, name: 'Clear sealant', family: 'sealant', stockUnit: 'each', cost: '6.2500', listPrice: '11.50', cartridgeMl: '300' })
      const { id } = await post(api, `/api/vendors/${vendor.id}/items`, { itemId: item.id, vendorSku: `SM-${tag}`, packQty: 8, minOrderQty: 8, unitCost: '7.2000' })
      const read = async () => (await getJson<{ id: number; vendorSku: string }[]>(api, `/api/vendors/${vendor.id}/items`)).find((l) => l.id === id)?.vendorSku
      return { id, url: `/purchasing/vendors/${vendor.id}`, write: `/api/vendors/${vendor.id}/items/${id}`, name: `SM-${tag}`, before: `SM-${tag}`, read }
    },
    open: (page, made) => page.locator(`[data-test="edit-vendor-item-${made.id}"]`).click(),
    field: 'vendor-sku',
    save: 'save-vendor-item',
    values: { a: 'SM-A', b: 'SM-B' },
    nameAfterA: (a) => a,
  },
  {
    screen: 'warehouse',
    make: async (api, tag) => {
      const code = `W${tag}`
      const { id } = await post(api, '/api/warehouses', { code, name: 'Quarry Road Yard', address: '1 Quarry Road' })
      return { id, url: `/stock/warehouses?warehouse=${id}`, write: `/api/warehouses/${id}`, name: code, before: '1 Quarry Road', read: async () => (await getJson<{ warehouse: { address: string } }>(api, `/api/warehouses/${id}`)).warehouse.address }
    },
    open: (page) => page.locator('[data-test="wh-edit"]').click(),
    field: 'wh-address',
    save: 'wh-save',
    values: { a: '2 Quarry Road', b: '88 Ferry Street' },
  },
  {
    screen: 'price level',
    make: async (api, tag) => {
      const code = `SE-${tag}`
      const { id } = await post(api, '/api/pricing/levels', { code, name: 'Trade', percentOff: '10' })
      const read = async () => (await getJson<{ id: number; name: string }[]>(api, '/api/pricing/levels')).find((l) => l.id === id)?.name
      return { id, url: '/admin/selling-prices', write: `/api/pricing/levels/${id}`, name: code, before: 'Trade', read }
    },
    open: (page, made) => page.locator(`[data-test="level-edit-${made.id}"]`).click(),
    field: 'level-name',
    save: 'level-save',
    values: { a: 'Trade, tab A', b: 'Trade, tab B' },
  },
  {
    screen: 'contractor account',
    make: async (api, tag) => {
      const code = `SEC-${tag}`
      const { id } = await post(api, '/api/customers', { code, name: `Harbour Glassworks ${tag}`, phone: '555-0100' })
      return { id, url: '/counter/customers', write: `/api/customers/${id}`, name: `Harbour Glassworks ${tag}`, before: '555-0100', read: async () => (await getJson<{ phone: string }>(api, `/api/customers/${id}`)).phone }
    },
    open: async (page, made) => {
      await page.locator('[data-test="customer-search"] input, input[data-test="customer-search"]').first().fill(made.name)
      await page.locator(`[data-test="customer-edit-${made.id}"]`).click()
    },
    field: 'customer-phone',
    save: 'save-customer',
    values: { a: '555-0142', b: '555-0199' },
  },
  {
    screen: 'job',
    make: async (api, tag) => {
      const { jobId: id } = await createCustomerAndJob(h.ds, `SE${tag}`)
      return { id, url: `/counter/jobs/${id}`, write: `/api/jobs/${id}`, name: `Test job SE${tag}`, before: '', read: async () => (await getJson<{ siteAddress: string }>(api, `/api/jobs/${id}`)).siteAddress }
    },
    open: (page) => page.locator('[data-test="edit-job"]').click(),
    field: 'job-site',
    save: 'save-job',
    values: { a: '14 Quarry Lane', b: '90 Mill Road' },
  },
]

/** The refusal and its reload button, in the person's language (the app's own words in src/i18n/<lang>). */
const WORDS = {
  en: {
    refusal: (name: string) => new RegExp(`${name} was changed meanwhile.*your edits are still on screen.*Reloading discards the edits you have not saved`, 's'),
    reload: 'Reload and discard my edits',
    keep: 'Keep my edits on screen',
  },
  es: {
    refusal: (name: string) => new RegExp(`${name} se cambió mientras tanto.*sus cambios siguen en pantalla.*se descartan los cambios que no ha guardado`, 's'),
    reload: 'Volver a cargar y descartar mis cambios',
    keep: 'Conservar mis cambios en pantalla',
  },
}

/** Waits as long as a locator does (a busy machine may take seconds to show a page). */
const poll = <T>(read: () => T | Promise<T>) => expect.poll(read, { timeout: 15_000 })
const escaped = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
const fieldOf = (page: Page, test: string) => page.locator(`[data-test="${test}"] input, input[data-test="${test}"]`).first()
const saved = (page: Page, path: string) =>
  page.waitForResponse((r) => new URL(r.url()).pathname === path && ['PATCH', 'PUT'].includes(r.request().method()))

/** Two tabs of one signed-in browser. */
interface Tabs { context: BrowserContext; a: Page; b: Page }

async function twoTabs(username: string, password?: string, viewport = { width: 1280, height: 900 }): Promise<Tabs> {
  const { page: a, context } = await h.newPage({ viewport })
  await h.signInByApi(a, username, password)
  const b = await context.newPage()
  b.setDefaultTimeout(15_000)
  return { context, a, b }
}

/** `asked`: more checks on tab B while the question is open. */
async function trial(s: Screen, tabs: Tabs, words: (typeof WORDS)['en'], asked?: (page: Page) => Promise<void>) {
  const made = await s.make(tabs.context.request, tagOf())
  const field = (page: Page) => fieldOf(page, s.field)
  const { a, b } = s.values
  await Promise.all([tabs.a, tabs.b].map(async (tab) => {
    await tab.goto(made.url)
    await s.open?.(tab, made)
    await poll(() => field(tab).inputValue()).toBe(made.before)
  }))

  await field(tabs.a).fill(a)
  const first = saved(tabs.a, made.write)
  await tabs.a.locator(`[data-test="${s.save}"]`).click()
  expect((await first).status()).toBe(200)

  await field(tabs.b).fill(b)
  const second = saved(tabs.b, made.write)
  await tabs.b.locator(`[data-test="${s.save}"]`).click()
  expect((await second).status()).toBe(409)
  const box = tabs.b.locator('.changed-meanwhile')
  await box.waitFor()
  expect(await box.textContent()).toMatch(words.refusal(escaped(s.nameAfterA ? s.nameAfterA(a) : made.name)))
  // What tab B typed is still in its form behind the question.
  expect(await field(tabs.b).inputValue()).toBe(b)
  await asked?.(tabs.b)

  await box.getByRole('button', { name: words.reload }).click()
  await box.waitFor({ state: 'hidden' })
  if (s.open) {
    // The dialog closes and its page reads the record again: it shows tab A's value, and so does the form reopened.
    await poll(() => tabs.b.getByText(a, { exact: true }).count()).toBeGreaterThan(0)
    await s.open(tabs.b, made)
  }
  await poll(() => field(tabs.b).inputValue()).toBe(a)
  expect(await made.read()).toBe(a)
}

let h: E2eHarness
let admin: Tabs
beforeAll(async () => {
  h = await startE2e()
  admin = await twoTabs('admin')
})
afterAll(async () => {
  await admin?.context.close()
  await h?.close()
})

describe('an edit screen opened in two tabs refuses the second save, keeps its edits and reloads on request', () => {
  for (const s of SCREENS) {
    it(s.screen, () => trial(s, admin, WORDS.en))
  }

  // A price rule is added and removed, never changed in place. Found on the rules screen: removing a rule another
  // tab had already removed (and replaced with a new price for the same break) said so, but kept offering the gone
  // rule, with no sign of the new one.
  it('price rule removed in the other tab', async () => {
    const { a, b, context } = admin
    const tag = tagOf()
    const item = await post(context.request, '/api/items', { sku: `SER-${tag}`, name: 'Clear sealant', family: 'sealant', stockUnit: 'each', cost: '6.2500', listPrice: '11.50', cartridgeMl: '300' })
    const rule = (price: string) => post(context.request, '/api/pricing/rules', { levelId: null, itemId: item.id, minQty: 12, basis: 'unit', price, percentOff: null })
    const old = await rule('10.50')
    const removeButton = (page: Page, id: number) => page.locator(`[data-test="rule-remove-${id}"]`)
    await Promise.all([a, b].map(async (tab) => {
      await tab.goto('/admin/selling-prices')
      await tab.locator('#tab-rules').click()
      await removeButton(tab, old.id).waitFor()
    }))
    const confirmRemove = async (page: Page) => {
      const ask = page.locator('.el-message-box')
      await ask.waitFor()
      expect(await ask.textContent()).toContain(`SER-${tag}`)
      await ask.locator('.el-button--primary').click()
    }

    await removeButton(a, old.id).click()
    await confirmRemove(a)
    await removeButton(a, old.id).waitFor({ state: 'detached' })
    const replaced = await rule('9.75')

    const refused = b.waitForResponse((r) => new URL(r.url()).pathname === `/api/pricing/rules/${old.id}` && r.request().method() === 'DELETE')
    await removeButton(b, old.id).click()
    await confirmRemove(b)
    expect((await refused).status()).toBe(404)
    await b.getByText('That price rule is no longer there', { exact: false }).waitFor()
    // Tab B now lists the rules as they are: the removed one gone, the new price there to remove if wanted.
    await removeButton(b, old.id).waitFor({ state: 'detached' })
    await removeButton(b, replaced.id).waitFor()
    const stored = await getJson<{ id: number; price: string }[]>(context.request, `/api/pricing/rules?itemId=${item.id}`)
    expect(stored.map((r) => [r.id, r.price])).toEqual([[replaced.id, '9.75']])
  })

  // Trial, double submit: a double click on an account's deactivate button sent the same version twice, and the
  // second was refused as if someone else had changed the account meanwhile.
  // source: common practice (one press of a save button is one save)
  it('contractor account deactivated by a double click', async () => {
    const { a, context } = admin
    const made = await SCREENS.find((s) => s.screen === 'contractor account')!.make(context.request, tagOf())
    await a.goto(made.url)
    await a.locator('[data-test="customer-search"] input, input[data-test="customer-search"]').first().fill(made.name)
    const toggle = a.locator(`[data-test="customer-active-${made.id}"]`)
    await toggle.waitFor()
    const writes: string[] = []
    const count = (r: { url(): string; method(): string }) => { if (new URL(r.url()).pathname === made.write && r.method() === 'PATCH') writes.push(r.method()) }
    a.on('request', count)
    try {
      const first = saved(a, made.write)
      const reread = a.waitForResponse((r) => new URL(r.url()).pathname === '/api/customers' && r.request().method() === 'GET')
      await toggle.dblclick()
      expect((await first).status()).toBe(200)
      await reread
      expect(writes).toHaveLength(1)
      expect(await a.locator('.changed-meanwhile').count()).toBe(0)
    } finally {
      a.off('request', count)
    }
    const stored = await getJson<{ active: boolean; version: number }>(context.request, `/api/customers/${made.id}`)
    expect(stored.active).toBe(false)
  })

  // Trial, keyboard only: a save sent with Enter and refused opened the question with the focus on reloading, so one
  // more Enter threw the edits away. Enter (and Escape) there keep them now; discarding takes its own button.
  // source: W3C WAI-ARIA Authoring Practices, Dialog (Modal) Pattern: when a dialog confirms an action that cannot be
  // undone, the focus starts on the least destructive choice; WCAG 2.2 SC 2.1.1 Keyboard (every choice by keyboard).
  it('catalog item, keyboard only', async () => {
    const s = SCREENS.find((x) => x.screen === 'catalog item')!
    const { a, b, context } = admin
    const made = await s.make(context.request, tagOf())
    const field = (page: Page) => fieldOf(page, s.field)
    await Promise.all([a, b].map(async (tab) => {
      await tab.goto(made.url)
      await poll(() => field(tab).inputValue()).toBe(made.before)
    }))
    await field(a).fill(s.values.a)
    const first = saved(a, made.write)
    await field(a).press('Enter')
    expect((await first).status()).toBe(200)

    await field(b).fill(s.values.b)
    const box = b.locator('.changed-meanwhile')
    const refusedOnEnter = async () => {
      const refused = saved(b, made.write)
      await field(b).press('Enter')
      expect((await refused).status()).toBe(409)
      await box.waitFor()
    }
    await refusedOnEnter()
    expect(await b.evaluate(() => document.activeElement?.textContent?.trim())).toBe(WORDS.en.keep)
    await b.keyboard.press('Enter')
    await box.waitFor({ state: 'hidden' })
    expect(await field(b).inputValue()).toBe(s.values.b)
    await refusedOnEnter()
    await b.keyboard.press('Escape')
    await box.waitFor({ state: 'hidden' })
    expect(await field(b).inputValue()).toBe(s.values.b)
    expect(await made.read()).toBe(s.values.a)

    await refusedOnEnter()
    await tabTo(b, '.changed-meanwhile .el-message-box__btns .el-button:not(.el-button--primary)', { back: true, max: 4 })
    await b.keyboard.press('Enter')
    await poll(() => field(b).inputValue()).toBe(s.values.a)
  })

  // At phone width (412 px) the Spanish question and its two long buttons stay inside their box and the page.
  // source: WCAG 2.2 SC 1.4.10 Reflow (content usable at 320 CSS px wide without scrolling in two directions).
  it('contractor account, in Spanish on a phone', async () => {
    const clerk = await twoTabs(await spanishCounterClerk(h.ds), TEST_PASSWORD, { width: 412, height: 900 })
    try {
      await trial(SCREENS.find((s) => s.screen === 'contractor account')!, clerk, WORDS.es, async (page) => {
        expect(await cutOffInside(page, '.changed-meanwhile')).toEqual([])
        expect((await sidewaysScroll(page)).by).toBe(0)
      })
    } finally {
      await clerk.context.close()
    }
  })
})
