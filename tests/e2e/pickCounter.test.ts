// The counter's side of pick lists in a real browser: make a list from a saved bill of materials
// (choosing the warehouse and backordering the shortage), watch the status page follow the
// warehouse's confirmations without reloading, and print the sheet, whose barcodes an independent
// decoder (ZXing) reads back as the handheld expects them.
import { randomUUID } from 'node:crypto'
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF } from '../support/apiHarness.js'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { decodePng } from '../support/decodePng.js'
import { fxBom, pickScenario, signedInAgent, type FxBom, type PickScenario } from '../support/pickFixtures.js'

let h: E2eHarness
let s: PickScenario
let bom: FxBom
let crew: supertest.Agent
beforeAll(async () => {
  h = await startE2e()
  crew = await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD)
  s = await pickScenario(h.ds, crew)
  // 250 blocks wanted, 200 at the main warehouse: 50 short
  bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 250 }, { itemId: s.spacer.id, qty: 20 }])
})
afterAll(() => h?.close())

describe('counter and pick lists', () => {
  it('makes a list with a backorder, follows the picking live, and prints a sheet that scans back', async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signInByApi(page, 'counter')
      await page.goto('/counter/picking')
      await page.locator(`[data-test="make-${bom.bomId}"]`).click()
      await page.waitForURL(/\/counter\/picking\/new\//)
      await page.locator('[data-test="plan-warehouse"]').click()
      await page.locator('.el-select-dropdown__item', { hasText: `${s.main.code} ·` }).click()
      await page.locator(`[data-test="plan-list-${s.main.code}"]`).waitFor()
      await page.locator(`[data-test="shortage-${bom.lineIds[0]}"] [data-test="action-backorder"]`).click()
      await h.screenshot(page, 'pick-counter-plan')
      await page.locator('[data-test="plan-create"]').click()
      await page.waitForURL(/\/counter\/pick-lists\/\d+/)
      const id = Number(/pick-lists\/(\d+)/.exec(page.url())![1])
      await expect.poll(() => page.locator('[data-test="pick-list-status"]').getAttribute('data-status')).toBe('released')
      const [suggestion] = await h.ds.query(`SELECT qty, source, status FROM purchase_suggestions WHERE item_id = ?`, [s.block.id])
      expect(suggestion).toEqual({ qty: 50, source: 'backorder', status: 'accepted' })

      // The warehouse confirms the spacer line; the open page follows by itself.
      const detail = (await crew.get(`/api/pick-lists/${id}`)).body
      const spacer = detail.lines.find((l: { sku: string }) => l.sku === s.spacer.sku)
      const res = await crew.post(`/api/pick-lists/${id}/confirmations`).set(CSRF).set('Idempotency-Key', randomUUID())
        .send({ lineId: spacer.id, binScan: 'B:A-02-1', itemScan: s.spacer.sku, qty: 20 })
      expect(res.status).toBe(201)
      await expect.poll(() => page.locator('[data-test="progress-unit"][data-unit="each"]').getAttribute('data-confirmed'), { timeout: 15_000 }).toBe('20')
      await expect.poll(() => page.locator('[data-test="pick-list-status"]').getAttribute('data-status')).toBe('picking')
      await h.screenshot(page, 'pick-counter-status')

      await page.goto(`/warehouse/pick-lists/${id}/sheet`)
      const rows = page.locator('[data-test="sheet-lines"] tbody tr[data-bin]')
      await expect.poll(() => rows.count()).toBe(detail.lines.length)
      expect(await rows.evaluateAll((els) => els.map((e) => e.getAttribute('data-bin')))).toEqual(detail.lines.map((l: { binCode: string }) => l.binCode))
      await h.screenshot(page, 'pick-sheet')
      // Barcodes are drawn at their printed size (0.25 mm modules are about one screen pixel): zoom in to read them off the screen.
      await page.evaluate(() => { document.body.style.zoom = '4' })
      const binCode = page.locator('[data-barcode="B:A-02-1"]').first()
      // source: decoded by ZXing (@zxing/library), an independent general-purpose barcode reader
      expect(decodePng(await binCode.screenshot(), 'code128')).toBe('B:A-02-1')
      const itemCode = page.locator(`[data-barcode^="01"]`).first()
      expect(decodePng(await itemCode.screenshot(), 'code128')).toBe(`]C101${s.block.gtin}`)
      expect(await page.locator('[data-caution="glass_edges"]').count()).toBeGreaterThan(0)
    } finally {
      await context.close()
    }
  })
})
