// Dropped connections on the handheld, in a real browser: confirmations made offline wait in
// IndexedDB and show as queued; when the connection is back they go out in order. One answer is
// lost on the way back (the server did record it): the resend carries the same Idempotency-Key,
// so the ledger still has each move exactly once.
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { countRows, fxBom, ledgerMismatches, pickScenario, releasedPickList, signedInAgent, type PickScenario } from '../support/pickFixtures.js'

let h: E2eHarness
let s: PickScenario
let listId: number
beforeAll(async () => {
  h = await startE2e()
  const crew = await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD)
  const counter = await signedInAgent(h.built.app, 'counter', DEMO_PASSWORD)
  s = await pickScenario(h.ds, crew)
  const bom = await fxBom(h.ds, s.tag, [{ itemId: s.spacer.id, qty: 12 }])
  listId = await releasedPickList(counter, bom.bomId, s.main.id)
})
afterAll(() => h?.close())

async function scan(page: Page, text: string) {
  const box = page.locator('[data-test="scan-input"]')
  await box.fill(text)
  await box.press('Enter')
}

async function confirmSpacer(page: Page, qty: number) {
  await scan(page, 'B:A-02-1')
  await scan(page, s.spacer.sku)
  await expect.poll(() => page.locator('[data-test="step"]').getAttribute('data-step')).toBe('qty')
  await scan(page, String(qty))
}

const storedCount = (page: Page) => page.evaluate(() => new Promise<number>((resolve, reject) => {
  const open = indexedDB.open('lumenyard-picking')
  open.onerror = () => reject(open.error)
  open.onsuccess = () => {
    const req = open.result.transaction('confirmations').objectStore('confirmations').count()
    req.onsuccess = () => { resolve(req.result); open.result.close() }
  }
}))

describe('handheld without a connection', () => {
  it('queues confirmations, sends them in order when back, and never issues one twice', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 800, height: 1100 } })
    try {
      await h.signIn(page, 'warehouse')
      await page.goto(`/warehouse/pick/${listId}`)
      await page.locator('[data-test="line-bin"]').waitFor()

      await context.setOffline(true)
      await confirmSpacer(page, 5)
      await confirmSpacer(page, 3)
      await expect.poll(() => page.locator('[data-test="queue-item"]').count()).toBe(2)
      await expect.poll(() => page.locator('[data-test="online-state"]').getAttribute('data-online')).toBe('false')
      expect(await storedCount(page)).toBe(2)
      expect(await countRows(h.ds, 'pick_confirmations', 'pick_list_id = ?', [listId])).toBe(0)
      await h.screenshot(page, 'pick-offline-queued')

      // The first resend reaches the server, but its answer is lost: the handheld must send it again.
      let lost = 0
      await page.route('**/api/pick-lists/*/confirmations', async (route) => {
        await route.fetch()
        lost++
        await route.abort('internetdisconnected')
      }, { times: 1 })
      await context.setOffline(false)
      await expect.poll(() => lost).toBe(1)
      await expect.poll(() => page.locator('[data-test="queue-item"]').count(), { timeout: 20_000 }).toBe(0)
      expect(await storedCount(page)).toBe(0)
      const rows = await h.ds.query('SELECT qty FROM pick_confirmations WHERE pick_list_id = ? ORDER BY id', [listId])
      expect(rows.map((r: { qty: number }) => r.qty)).toEqual([5, 3])

      await confirmSpacer(page, 4)
      await page.locator('[data-test="all-done"]').waitFor()
      await expect.poll(() => page.locator('[data-test="queue-item"]').count()).toBe(0)
      expect(await countRows(h.ds, 'pick_confirmations', 'pick_list_id = ?', [listId])).toBe(3)
      await page.locator('[data-test="complete"]').click()
      await expect.poll(async () => (await h.ds.query('SELECT status FROM pick_lists WHERE id = ?', [listId]))[0].status).toBe('picked')
      const moves = await h.ds.query(`SELECT qty, note FROM stock_moves WHERE doc_type = 'pick_list' AND doc_id = ? ORDER BY id`, [listId])
      expect(moves.map((m: { qty: number }) => m.qty)).toEqual([-5, -3, -4])
      expect(new Set(moves.map((m: { note: string }) => m.note)).size).toBe(3)
      expect(await ledgerMismatches(h.ds, [s.spacer.id])).toEqual([])
    } finally {
      await context.close()
    }
  })
})
