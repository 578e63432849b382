// Every barcode Lumenyard prints, read by a program nobody on the project wrote: the page printed to PDF by
// Chromium, rasterised at 300 dpi by pdftoppm (poppler-utils) and decoded by zbarimg (zbar-tools). Each page
// must give back exactly the barcodes it shows, with the expected data: bins, SKUs, lots, and GS1 element
// strings whose GTIN check digit is right.
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { classifyScan } from '../../shared/barcode/scan.js'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { gs1CheckDigitOk, printAndDecode as printOnPaper, sortedSymbols, type Decoded } from '../support/printDecode.js'
import { fxBom, fxItem, fxLot, fxWarehouse, receive, releasedPickList, signedInAgent, tagOf, type FxItem, type FxWarehouse } from '../support/pickFixtures.js'

let h: E2eHarness
let tag: string
let yard: FxWarehouse
let items: FxItem[]
let lots: { item: FxItem; code: string; id: number }[]
let listId: number
const dir = mkdtempSync(path.join(tmpdir(), 'lumenyard-print-'))

const BINS = ['A-01-1', 'A-01-2', 'A-02-1', 'A-02-2', 'A-03-1', 'B-01-1', 'B-01-2', 'B-02-1', 'B-03-1', 'C-01-1']

beforeAll(async () => {
  h = await startE2e()
  const crew = await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD)
  const counter = await signedInAgent(h.built.app, 'counter', DEMO_PASSWORD)
  tag = tagOf()
  yard = await fxWarehouse(h.ds, `P${tag}`, BINS, { aisleOrder: 'A,B,C' })
  // Ten items: every other one with a GTIN (GS1-128 (01)), the rest by SKU (Code 128), one with a long SKU.
  items = []
  for (let i = 0; i < 10; i++) {
    const sku = i === 9 ? `GB-0808-WAVY-END-${tag}` : `GB${i}-${tag}`
    items.push(await fxItem(h.ds, sku, { gtin: i % 2 === 0, weightKg: '2.950', nominalSize: '8x8' }))
  }
  lots = []
  for (const item of [items[0], items[1]]) {
    const code = `R${tag.slice(0, 4)}${item === items[0] ? 'A' : 'B'}`
    lots.push({ item, code, id: await fxLot(h.ds, item.id, code, '2025-04-01') })
  }
  await receive(crew, yard.id, items.map((item, i) => ({
    itemId: item.id, binId: yard.bins[BINS[i]], qty: 40, lotId: lots.find((l) => l.item === item)?.id ?? null,
  })))
  const bom = await fxBom(h.ds, tag, items.map((item, i) => ({ itemId: item.id, qty: 2 + i })))
  listId = await releasedPickList(counter, bom.bomId, yard.id)
})
afterAll(async () => {
  rmSync(dir, { recursive: true, force: true })
  await h?.close()
})

const sorted = sortedSymbols
const printAndDecode = (page: Page, name: string, options: Parameters<Page['pdf']>[0]) => printOnPaper(page, dir, name, options)
const linearOf = (item: FxItem): Decoded =>
  item.gtin ? { type: 'CODE-128', gs1: true, data: `01${item.gtin}` } : { type: 'CODE-128', gs1: false, data: item.sku }

describe('printed barcodes decode with zbarimg', () => {
  it('the pick sheet: every bin and item barcode of a ten-line list', async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signInByApi(page, 'admin')
      await page.goto(`/warehouse/pick-lists/${listId}/sheet`)
      await page.locator('[data-test="sheet-lines"] [data-barcode]').first().waitFor()
      // Chromium's default print margins are about 0.4 in (common practice); Letter portrait as a yard prints it.
      const decoded = await printAndDecode(page, 'pick-sheet', { format: 'Letter', margin: { top: '10mm', bottom: '10mm', left: '10mm', right: '10mm' } })
      // The long SKU needs 319 modules: 81 mm at the smallest readable 0.254 mm, more than the 60 mm the item column
      // gives it, so it is printed as a QR Code of the same data rather than shrunk (11 modules a character, Code 128).
      const expected = items.flatMap((item, i) => [
        { type: 'CODE-128', gs1: false, data: `B:${BINS[i]}` },
        i === 9 ? { type: 'QR-Code', gs1: false, data: item.sku } : linearOf(item),
      ])
      expect(sorted(decoded)).toEqual(sorted(expected))
      for (const d of decoded.filter((x) => x.gs1)) expect(gs1CheckDigitOk(d.data.slice(2, 16)), d.data).toBe(true)
      // source: GS1 General Specifications §5.12.3 (X-dimension ranges; none below 0.250 mm, from memory)
      const widths = await page.locator('[data-barcode]').evaluateAll((els) => els.map((e) => Number(e.getAttribute('data-module-mm'))))
      expect(widths).toHaveLength(20)
      for (const x of widths) expect(x).toBeGreaterThanOrEqual(0.25)

      // Bin labels on the 30-up letter sheet, item and lot labels on 4 × 2 in rolls with a QR Code of the same data.
      await page.goto(`/stock/labels?kind=bin&warehouseId=${yard.id}&size=sheet30`)
      await page.locator('[data-test="label"] [data-barcode]').first().waitFor()
      const bins = await printAndDecode(page, 'bin-labels', { preferCSSPageSize: true })
      expect(sorted(bins)).toEqual(sorted(BINS.map((b) => ({ type: 'CODE-128', gs1: false, data: `B:${b}` }))))

      // 4 × 2 in and 4 × 6 in item labels: the bars and a QR Code of the same data on each
      const some = [items[0], items[1], items[2]]
      for (const size of ['medium', 'large']) {
        await page.goto(`/stock/labels?kind=item&ids=${some.map((i) => i.id).join(',')}&size=${size}`)
        await page.locator('[data-test="label"] [data-symbology="qr"]').first().waitFor()
        const itemCodes = await printAndDecode(page, `item-labels-${size}`, { preferCSSPageSize: true })
        expect(sorted(itemCodes), size).toEqual(sorted(some.flatMap((item) => [linearOf(item), { type: 'QR-Code', gs1: false, data: linearOf(item).data }])))
        // what the camera reads from the QR Code is what the scan parser takes for that item
        for (const d of itemCodes.filter((x) => x.type === 'QR-Code')) {
          const item = some.find((i) => d.data === linearOf(i).data)!
          expect(classifyScan(d.data)).toMatchObject(item.gtin ? { kind: 'gs1', gtin: item.gtin } : { kind: 'sku', sku: item.sku })
        }
      }

      for (const lot of lots) {
        await page.goto(`/stock/labels?kind=lot&itemId=${lot.item.id}&ids=${lot.id}&size=medium`)
        await page.locator('[data-test="label"] [data-symbology="qr"]').first().waitFor()
        const got = await printAndDecode(page, `lot-label-${lot.code}`, { preferCSSPageSize: true })
        const data = lot.item.gtin ? `01${lot.item.gtin}10${lot.code}` : `L:${lot.item.sku}|${lot.code}`
        expect(sorted(got)).toEqual(sorted([{ type: 'CODE-128', gs1: !!lot.item.gtin, data }, { type: 'QR-Code', gs1: false, data }]))
        for (const d of got) {
          expect(classifyScan(d.data)).toMatchObject(lot.item.gtin
            ? { kind: 'gs1', gtin: lot.item.gtin, lot: lot.code }
            : { kind: 'lot', itemSku: lot.item.sku, lotCode: lot.code })
        }
      }
    } finally {
      await context.close()
    }
  })
})
