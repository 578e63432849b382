// The handheld as a picker uses it on a 412 px phone, in a real browser: a double Enter and a
// scanner's burst make one confirmation; a minute without a connection (the page's clock, not real
// waiting) keeps the screen, checks scans on the device and queues confirmations that go out in order
// when the connection is back (one answer lost on the way back: the resend carries the same key);
// a reload keeps what waits; a confirmation refused on replay (someone else picked the line) shows
// why and is discarded with a reason recorded on the server; a session that ended while offline:
// sign in again, then it goes out. After each, the list is completed and its ledger read back: one
// issue per acknowledged confirmation, nothing twice.
import type supertest from 'supertest'
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PickListDetail } from '../../shared/schemas/picking.js'
import { CSRF } from '../support/apiHarness.js'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { countRows, fxBom, pickLedgerCheck, pickScenario, releasedPickList, signedInAgent, type PickScenario } from '../support/pickFixtures.js'

let h: E2eHarness
let s: PickScenario
let crew: supertest.Agent
let counter: supertest.Agent
let page: Page
let context: BrowserContext

beforeAll(async () => {
  h = await startE2e()
  crew = await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD)
  counter = await signedInAgent(h.built.app, 'counter', DEMO_PASSWORD)
  s = await pickScenario(h.ds, crew)
  ;({ page, context } = await h.newPage({ viewport: { width: 412, height: 915 } }))
  await page.clock.install()
  await h.signIn(page, 'warehouse')
})
afterAll(async () => {
  await context?.close()
  await h?.close()
})

/** A released list of spacers from bin A-02-1 (one line). */
async function spacerList(qty: number): Promise<{ id: number; lineId: number }> {
  const bom = await fxBom(h.ds, s.tag, [{ itemId: s.spacer.id, qty }])
  const id = await releasedPickList(counter, bom.bomId, s.main.id)
  return { id, lineId: ((await crew.get(`/api/pick-lists/${id}`)).body as PickListDetail).lines[0].id }
}

/** The page answers over the network on a busy machine: wait up to 10 s (vitest's default poll gives up after 1 s). */
const poll = <T>(read: () => T | Promise<T>) => expect.poll(read, { timeout: 10_000 })

async function open(listId: number) {
  await page.goto(`/warehouse/pick/${listId}`)
  await poll(() => page.locator('[data-test="line-bin"]').textContent()).toBe('A-02-1')
}

async function scan(text: string) {
  const box = page.locator('[data-test="scan-input"]')
  await box.fill(text)
  await box.press('Enter')
}
const step = () => page.locator('[data-test="step"]').getAttribute('data-step')
const netState = () => page.locator('[data-test="online-state"]').getAttribute('data-state')
const queued = (state = 'waiting') => page.locator(`[data-test="queue-item"][data-state="${state}"]`).count()
const confirmed = (listId: number) => h.ds.query('SELECT qty FROM pick_confirmations WHERE pick_list_id = ? ORDER BY id', [listId])
  .then((rows: { qty: number }[]) => rows.map((r) => r.qty))

async function toQtyStep() {
  await scan('B:A-02-1')
  await scan(s.spacer.sku)
  await poll(step).toBe('qty')
}

/** The line goes back to its first step, or, with nothing left to pick, the list says so. */
const settled = async () => (await page.locator('[data-test="all-done"]').count()) > 0 ||
  ((await page.locator('[data-test="step"]').count()) > 0 && (await step()) === 'bin')

async function confirmSpacer(qty: number) {
  await toQtyStep()
  await scan(String(qty))
  await poll(settled).toBe(true)
}

const storedCount = () => page.evaluate(() => new Promise<number>((resolve, reject) => {
  const req = indexedDB.open('lumenyard-picking')
  req.onerror = () => reject(req.error)
  req.onsuccess = () => {
    const count = req.result.transaction('confirmations').objectStore('confirmations').count()
    count.onsuccess = () => { resolve(count.result); req.result.close() }
  }
}))

/** Completes the list through the API and reads its ledger: exactly one issue per confirmation. */
async function expectIssuedOnce(listId: number, taken: number[]) {
  const res = await crew.post(`/api/pick-lists/${listId}/complete`).set(CSRF).send({ acceptShort: true })
  expect(res.status).toBe(200)
  expect(await pickLedgerCheck(h.ds, listId)).toEqual({ taken, problems: [] })
}

describe('one confirmation per intent', () => {
  it('makes one confirmation of a double Enter and one of a scanner burst, and leaves nothing stuck', async () => {
    const list = await spacerList(12)
    await open(list.id)
    await toQtyStep()
    const qtyBox = page.locator('[data-test="qty-value"]')
    await qtyBox.fill('4')
    // Two Enters in the same instant: the second arrives while the first is being kept.
    await qtyBox.evaluate((el) => {
      for (let i = 0; i < 2; i++) el.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true, cancelable: true }))
    })
    await poll(() => confirmed(list.id)).toEqual([4])

    await toQtyStep()
    // A scanner reading the quantity label twice in a blink: the same text and Enter, twice.
    await page.locator('[data-test="scan-input"]').evaluate((el: HTMLInputElement) => {
      for (let i = 0; i < 2; i++) {
        el.value = '4'
        el.dispatchEvent(new Event('input', { bubbles: true }))
        el.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true, cancelable: true }))
      }
    })
    await poll(() => confirmed(list.id)).toEqual([4, 4])
    await poll(() => page.locator('[data-test="line-left"]').textContent()).toBe('faltan 4 uds.')
    await poll(() => queued()).toBe(0)
    expect(await queued('refused')).toBe(0)
    expect(await storedCount()).toBe(0)
    expect(await netState()).toBe('online')
    await h.screenshot(page, 'pick-double-enter')
    await expectIssuedOnce(list.id, [4, 4])
  })
})

describe('a minute without a connection', () => {
  it('keeps the pick screen, checks scans, queues confirmations and sends them in order when back', async () => {
    const list = await spacerList(12)
    await open(list.id)
    await context.setOffline(true)
    await page.clock.runFor(60_000) // four refreshes fail meanwhile
    expect(await netState()).toBe('offline')
    expect(await page.locator('[data-test="load-failure"]').count()).toBe(0)
    await page.locator('[data-test="scan-input"]').waitFor()
    await scan('B:A-01-1')
    await poll(() => page.locator('[data-test="feedback"]').textContent()).toContain('¡Ubicación equivocada!')
    await confirmSpacer(5)
    await confirmSpacer(3)
    await poll(() => queued()).toBe(2)
    expect(await page.locator('[data-test="waiting-count"]').textContent()).toContain('2 por enviar')
    expect(await page.locator('[data-test="line-left"]').textContent()).toBe('faltan 4 uds.')
    expect(await storedCount()).toBe(2)
    expect(await countRows(h.ds, 'pick_confirmations', 'pick_list_id = ?', [list.id])).toBe(0)
    await h.screenshot(page, 'pick-offline-queued')

    // The first resend reaches the server, but its answer is lost: the handheld sends it again.
    let lost = 0
    await page.route('**/api/pick-lists/*/confirmations', async (route) => {
      await route.fetch()
      lost++
      await route.abort('internetdisconnected')
    }, { times: 1 })
    await context.setOffline(false)
    await poll(() => lost).toBe(1)
    await page.clock.runFor(6_000) // the next retry
    await poll(() => queued()).toBe(0)
    expect(await confirmed(list.id)).toEqual([5, 3])
    expect(await storedCount()).toBe(0)
    await poll(netState).toBe('online')
    await expectIssuedOnce(list.id, [5, 3])
  })

  it('keeps waiting confirmations through a reload', async () => {
    const list = await spacerList(6)
    await open(list.id)
    await context.setOffline(true)
    await confirmSpacer(2)
    await poll(() => queued()).toBe(1)
    // The page comes back, the confirmations still can't get through.
    await page.route('**/api/pick-lists/*/confirmations', (route) => route.abort('internetdisconnected'))
    await context.setOffline(false)
    await page.reload()
    await poll(() => queued()).toBe(1)
    expect(await page.locator('[data-test="line-left"]').textContent()).toBe('faltan 4 uds.')
    await page.unroute('**/api/pick-lists/*/confirmations')
    await page.clock.runFor(6_000)
    await poll(() => queued()).toBe(0)
    expect(await confirmed(list.id)).toEqual([2])
    await expectIssuedOnce(list.id, [2])
  })
})

describe('conflicts and sessions', () => {
  it('shows a replay refused because someone else picked the line, and discards it with a reason', async () => {
    const list = await spacerList(6)
    await open(list.id)
    await context.setOffline(true)
    await confirmSpacer(6)
    await poll(() => queued()).toBe(1)
    // Meanwhile another picker takes the whole line.
    const other = await signedInAgent(h.built.app, 'admin', DEMO_PASSWORD)
    const taken = await other.post(`/api/pick-lists/${list.id}/confirmations`).set(CSRF).set('Idempotency-Key', `other-${list.id}-picker`)
      .send({ lineId: list.lineId, binScan: 'B:A-02-1', itemScan: s.spacer.sku, qty: 6 })
    expect(taken.status).toBe(201)
    await context.setOffline(false)
    await poll(() => queued('refused')).toBe(1)
    expect(await page.locator('[data-test="refusal"]').textContent()).toContain('otra persona la preparó')
    expect(await page.locator('[data-test="refused-count"]').textContent()).toContain('1 rechazada')
    await h.screenshot(page, 'pick-refused-replay')
    // The device tells the server what it holds, for the warehouse's start page. This browser's report only: the
    // demo warehouse user signs in on other test browsers too (each a device of its own).
    const device = await page.evaluate(() => localStorage.getItem('lumenyard.deviceId'))
    expect(device).toBeTruthy()
    await poll(async () => (await h.ds.query(`SELECT r.refused FROM device_outbox_reports r JOIN users u ON u.id = r.user_id WHERE u.username = 'warehouse' AND r.device_id = ?`, [device]))
      .map((r: { refused: number }) => r.refused)).toEqual([1])

    await page.locator('[data-test="outbox-link"]').click()
    await page.locator('[data-test="outbox-page"]').waitFor()
    await page.locator('[data-test="discard"]').click()
    await page.locator('[data-test="discard-dialog"]').waitFor()
    await h.screenshot(page, 'pick-outbox-discard')
    await page.locator('[data-test="discard-confirm"]').click()
    await page.locator('[data-test="outbox-empty"]').waitFor()
    expect(await storedCount()).toBe(0)
    const [entry] = await h.ds.query(`SELECT detail FROM audit_entries WHERE action = 'pick_confirmation.discard' AND entity_id = ?`, [String(list.id)])
    expect(JSON.parse(entry.detail)).toMatchObject({ lineId: list.lineId, qty: 6, refusedCode: 'over_pick', reason: 'refusal_seen' })
    expect(await confirmed(list.id)).toEqual([6]) // the other picker's, once
    await expectIssuedOnce(list.id, [6])
  })

  it('sends what waited after the session ended offline, once signed in again', async () => {
    const list = await spacerList(5)
    await open(list.id)
    await context.setOffline(true)
    await confirmSpacer(5)
    await poll(() => queued()).toBe(1)
    // The session ends on the server while the phone is offline.
    const cookie = (await context.cookies()).find((c) => c.name.startsWith('lumenyard'))
    const sid = decodeURIComponent(cookie!.value).replace(/^s:/, '').replace(/\.[^.]*$/, '')
    expect(await h.ds.query('DELETE FROM sessions WHERE session_id = ?', [sid])).toMatchObject({ affectedRows: 1 })
    await context.setOffline(false)
    // The picker signs in again over the pick screen, which stays where it was.
    await page.locator('[data-test="session-resume"]').waitFor()
    expect(new URL(page.url()).pathname).toBe(`/warehouse/pick/${list.id}`)
    expect(await confirmed(list.id)).toEqual([])
    await page.locator('[data-test="resume-password"]').fill(DEMO_PASSWORD)
    await page.keyboard.press('Enter')
    await page.locator('[data-test="session-resume"]').waitFor({ state: 'hidden' })
    await poll(() => confirmed(list.id)).toEqual([5])
    await poll(() => queued()).toBe(0)
    await expectIssuedOnce(list.id, [5])
  })
})
