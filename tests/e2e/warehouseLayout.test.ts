// The warehouse's screens on a 412 px phone, an 800 px tablet and a 1440 px desktop, in Spanish (the demo warehouse
// user's language): nothing is cut off. A column, button or total that runs past the screen's edge,
// or a table that hides columns behind a sideways scroll, is a finding. Targets of at least 44 px on
// warehouse screens: WCAG 2.2, success criterion 2.5.5 (target size, enhanced) asks 44 × 44 CSS px.
import type supertest from 'supertest'
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF } from '../support/apiHarness.js'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { fxBom, pickScenario, releasedPickList, signedInAgent, type PickScenario } from '../support/pickFixtures.js'
import { createPurchasingFixture, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: E2eHarness
let s: PickScenario
let f: PurchasingFixture
let page: Page
let context: BrowserContext
let pickListId: number
let poId: number

beforeAll(async () => {
  h = await startE2e()
  const crew: supertest.Agent = await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD)
  const counter = await signedInAgent(h.built.app, 'counter', DEMO_PASSWORD)
  const buyer = await signedInAgent(h.built.app, 'buyer', DEMO_PASSWORD)
  s = await pickScenario(h.ds, crew)
  const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 16 }, { itemId: s.spacer.id, qty: 10 }])
  pickListId = await releasedPickList(counter, bom.bomId, s.main.id, 'Call the site lead before loading')
  f = await createPurchasingFixture(h.ds)
  const po = await buyer.post('/api/purchase-orders').set(CSRF)
    .send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.block.id, packsOrdered: 2 }, { itemId: f.sealant.id, packsOrdered: 1 }] })
  if (po.status !== 201) throw new Error(`making the PO failed: ${po.status} ${JSON.stringify(po.body)}`)
  poId = po.body.id
  // Approved as the buyer's screen shows it (with the version it read), then marked sent.
  for (const [step, body] of [['approve', { version: po.body.version }], ['mark-sent', {}]] as const) {
    const res = await buyer.post(`/api/purchase-orders/${poId}/${step}`).set(CSRF).send(body)
    if (res.status !== 200) throw new Error(`${step} failed: ${res.status} ${JSON.stringify(res.body)}`)
  }
  ;({ page, context } = await h.newPage({ viewport: { width: 412, height: 915 } }))
  await h.signIn(page, 'warehouse')
})
afterAll(async () => {
  await context?.close()
  await h?.close()
})

/** What runs past the right edge of the screen, or hides behind a sideways scroll inside a table. */
function cutOff(p: Page): Promise<string[]> {
  return p.evaluate(() => {
    const found: string[] = []
    const edge = document.documentElement.clientWidth
    const name = (el: Element) => (el.getAttribute('data-test') ?? el.className.toString().split(' ')[0]) || el.tagName.toLowerCase()
    if (document.documentElement.scrollWidth > edge + 1) found.push(`page is ${document.documentElement.scrollWidth} px wide`)
    for (const wrap of document.querySelectorAll('.el-table .el-scrollbar__wrap, .el-table__header-wrapper')) {
      if (wrap.scrollWidth > wrap.clientWidth + 1) found.push(`table ${name(wrap.closest('.el-table')!)} hides ${wrap.scrollWidth - wrap.clientWidth} px of columns`)
    }
    for (const el of document.querySelectorAll('#app button, #app a, #app input, #app [data-test]')) {
      const r = el.getBoundingClientRect()
      if (r.width > 0 && r.right > edge + 1 && !el.closest('.el-table')) found.push(`${name(el)} ends at ${Math.round(r.right)} px`)
    }
    return [...new Set(found)]
  })
}

/** Buttons and links on the screen smaller than 44 px high (the scan-and-tap targets of a warehouse screen). */
function smallTargets(p: Page, within: string): Promise<string[]> {
  return p.evaluate((sel) => [...document.querySelectorAll(`${sel} button, ${sel} a`)]
    .filter((el) => { const r = el.getBoundingClientRect(); return r.width > 0 && r.height < 43.5 })
    .map((el) => `${el.getAttribute('data-test') ?? el.textContent?.trim().slice(0, 30)}: ${Math.round(el.getBoundingClientRect().height)} px`), within)
}

const widths = [412, 800, 1440]
/** Opens a screen, waits for what shows it is ready, and checks it at each width. */
async function check(url: string | null, ready: string, shot: string): Promise<Record<number, string[]>> {
  const out: Record<number, string[]> = {}
  if (url) await page.goto(url)
  await page.locator(ready).first().waitFor()
  for (const width of widths) {
    await page.setViewportSize({ width, height: width < 600 ? 915 : width < 1200 ? 1280 : 900 })
    await page.waitForFunction((w) => document.documentElement.clientWidth === w, width)
    await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)))) // tables re-lay out on resize
    out[width] = await cutOff(page)
    if (width < 600) await h.screenshot(page, shot) // the phone's view, to look at
  }
  return out
}
const none = { 412: [], 800: [], 1440: [] }

describe('warehouse screens on a phone, a tablet and a desktop', () => {
  it('cut nothing off on the start page, the pick screen and the device outbox', async () => {
    expect(await check('/warehouse', `[data-test="open-list-${pickListId}"]`, 'layout-warehouse-home')).toEqual(none)
    expect(await check(`/warehouse/pick/${pickListId}`, '[data-test="line-bin"]', 'layout-pick')).toEqual(none)
    expect(await smallTargets(page, '[data-test="pick-handheld"]')).toEqual([])
    await page.locator('[data-test="view-list"]').click()
    expect(await check(null, '[data-test="pick-lines"]', 'layout-pick-list')).toEqual(none)
    expect(await check('/warehouse/outbox', '[data-test="outbox-page"]', 'layout-outbox')).toEqual(none)
  })

  it('cut nothing off when receiving: the order list and one order with its rows', async () => {
    expect(await check('/warehouse/receiving', '[data-test="receiving-list"]', 'layout-receiving')).toEqual(none)
    await page.goto(`/warehouse/receiving/${poId}`)
    await page.locator('[data-test="receive-title"]').waitFor()
    const scan = page.locator('[data-test="scan-input"]')
    await scan.fill('B:A-01-1')
    await scan.press('Enter')
    await page.locator('[data-test="add-by-hand"]').click()
    await page.locator('.el-dropdown-menu__item:visible').first().click()
    await page.locator('[data-test="receipt-row"]').waitFor()
    // The menu closes after the choice (measured while it was still fading, it reached past the screen's edge).
    await expect.poll(() => page.locator('.el-dropdown__popper:visible').count()).toBe(0)
    expect(await check(null, '[data-test="receipt-rows"]', 'layout-receive-order')).toEqual(none)
  })
})
