// Receiving at the dock in the real browser, as the warehouse crew works it (in Spanish, the demo warehouse
// user's language): an order that cannot be received says why before anything is scanned; a post the server
// refuses shows the server's reason, never only "post again"; and the lot labels a receipt prints decode with
// zbarimg (zbar-tools) from the page Chromium prints, rasterised at 300 dpi by pdftoppm (poppler-utils).
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { normalizeGtin } from '../../shared/barcode/checkDigit.js'
import { classifyScan } from '../../shared/barcode/scan.js'
import { CSRF } from '../support/apiHarness.js'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { signedInAgent } from '../support/pickFixtures.js'
import { gs1CheckDigitOk, printAndDecode, sortedSymbols } from '../support/printDecode.js'
import { createPurchasingFixture, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: E2eHarness
let f: PurchasingFixture
let buyer: supertest.Agent
let approvedId: number
let sentId: number
const dir = mkdtempSync(path.join(tmpdir(), 'lumenyard-dock-'))

async function order(): Promise<number> {
  const res = await buyer.post('/api/purchase-orders').set(CSRF).send({
    vendorId: f.vendorA, warehouseId: f.warehouse.id, expectedDate: '2031-05-15',
    lines: [
      { itemId: f.block.id, packsOrdered: 2, packQty: 24, unitCost: '2.5000' },
      { itemId: f.sealant.id, packsOrdered: 1, packQty: 12, unitCost: '6.2500' },
    ],
  })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  expect((await buyer.post(`/api/purchase-orders/${res.body.id}/approve`).set(CSRF).send({ version: res.body.version })).status).toBe(200)
  return res.body.id
}

beforeAll(async () => {
  h = await startE2e()
  f = await createPurchasingFixture(h.ds)
  buyer = await signedInAgent(h.built.app, 'buyer', DEMO_PASSWORD)
  approvedId = await order()
  sentId = await order()
  expect((await buyer.post(`/api/purchase-orders/${sentId}/mark-sent`).set(CSRF)).status).toBe(200)
})
afterAll(async () => {
  rmSync(dir, { recursive: true, force: true })
  await h?.close()
})

describe('receiving at the dock', () => {
  it('says why an order cannot be received, shows the server’s refusal, and prints lot labels that scan', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 1100, height: 1000 } })
    try {
      await h.signInByApi(page, 'warehouse')
      const post = page.locator('[data-test="post-receipt"]')
      const feedback = page.locator('[data-test="scan-feedback"]')
      const notice = page.locator('[data-test="not-receivable"]')

      // Approved but not sent to the vendor: the reason on screen, in Spanish, and nothing to post.
      await page.goto(`/warehouse/receiving/${approvedId}`)
      await expect.poll(() => notice.textContent(), { timeout: 15_000 }).toContain('aún no se ha enviado al proveedor')
      expect(await post.isDisabled()).toBe(true)

      // A sent order: two lots scanned, posted, and their labels printed.
      await page.goto(`/warehouse/receiving/${sentId}`)
      const scan = page.locator('[data-test="scan-input"]')
      await scan.waitFor()
      expect(await notice.count()).toBe(0)
      const gtin14 = (normalizeGtin(f.block.gtin!) as { gtin14: string }).gtin14
      const blockLot = `RA${f.tag}`.slice(0, 20)
      const sealantLot = `RB${f.tag}`.slice(0, 20)
      // source: GS1 General Specifications §3.2 (AI (01) GTIN, AI (10) batch/lot), typed as its human-readable line
      for (const code of [`(01)${gtin14}(10)${blockLot}`, `L:${f.sealant.sku}|${sealantLot}`]) {
        await scan.fill(code)
        await scan.press('Enter')
      }
      await expect.poll(() => page.locator('[data-test="receipt-row"]').count()).toBe(2)
      await post.click()
      await expect.poll(() => page.locator('[data-test="receive-status"]').getAttribute('data-status'), { timeout: 15_000 }).toBe('partly_received')
      await page.locator('[data-test="lot-labels"] [data-barcode]').nth(1).waitFor()
      const decoded = await printAndDecode(page, dir, 'receiving-lot-labels', { format: 'Letter', margin: { top: '10mm', bottom: '10mm', left: '10mm', right: '10mm' } })
      expect(sortedSymbols(decoded)).toEqual(sortedSymbols([
        { type: 'CODE-128', gs1: true, data: `01${gtin14}10${blockLot}` },
        { type: 'CODE-128', gs1: false, data: `L:${f.sealant.sku}|${sealantLot}` },
      ]))
      for (const d of decoded) {
        if (d.gs1) expect(gs1CheckDigitOk(d.data.slice(2, 16)), d.data).toBe(true)
        // what the scanner reads back is that lot of that item
        expect(classifyScan(d.data)).toMatchObject(d.gs1 ? { kind: 'gs1', gtin: gtin14, lot: blockLot } : { kind: 'lot', itemSku: f.sealant.sku, lotCode: sealantLot })
      }

      // The buyer closes the order while the dock is still scanning: the post is refused with the server's reason,
      // and the page shows the order as it is now.
      await scan.fill(`(01)${gtin14}(10)${blockLot}`)
      await scan.press('Enter')
      await expect.poll(() => page.locator('[data-test="receipt-row"]').count()).toBe(1)
      expect((await buyer.post(`/api/purchase-orders/${sentId}/close`).set(CSRF).send({ reason: 'The rest will not come.' })).status).toBe(200)
      await post.click()
      await expect.poll(() => notice.textContent(), { timeout: 15_000 }).toContain('Esta orden está cerrada')
      const said = await feedback.textContent()
      expect(said).toContain('Esta orden está cerrada') // the refusal's reason, in the crew's language
      expect(said).not.toContain('vuelva a registrar')
      expect(await post.isDisabled()).toBe(true)
      await h.screenshot(page, 'receiving-refused')
      const [{ n }] = await h.ds.query('SELECT COUNT(*) AS n FROM po_receipts WHERE po_id = ?', [sentId])
      expect(Number(n)).toBe(1) // the refused post changed nothing
    } finally {
      await context.close()
    }
  })
})
