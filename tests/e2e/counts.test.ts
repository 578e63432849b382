// A blind cycle count on a 412 px phone (the demo warehouse user works in Spanish), then the owner
// approves the difference on a desktop: the stock adjusts by it, once. Scans are typed as a
// keyboard-wedge scanner sends them (text then Enter).
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { balanceOf, fxItem, fxLot, fxWarehouse, ledgerMismatches, receive, signedInAgent, tagOf, type FxItem, type FxWarehouse } from '../support/pickFixtures.js'
import { CSRF } from '../support/apiHarness.js'

let h: E2eHarness
let wh: FxWarehouse
let block: FxItem
let grout: FxItem
let countId: number
const tag = tagOf()

beforeAll(async () => {
  h = await startE2e()
  const crew = await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD)
  wh = await fxWarehouse(h.ds, `E${tag}`, ['A-01-1', 'A-02-1'])
  block = await fxItem(h.ds, `EB-${tag}`, { matchLot: true })
  grout = await fxItem(h.ds, `EG-${tag}`, { family: 'grout' })
  const lot = await fxLot(h.ds, block.id, `R7${tag}`, '2026-09-01')
  await receive(crew, wh.id, [{ itemId: block.id, binId: wh.bins['A-01-1'], lotId: lot, qty: 37 }, { itemId: grout.id, binId: wh.bins['A-02-1'], qty: 12 }])
  const res = await crew.post('/api/counts').set(CSRF).send({ warehouseId: wh.id, scope: 'bins', binIds: [wh.bins['A-01-1'], wh.bins['A-02-1']] })
  countId = res.body.id
})
afterAll(() => h?.close())

async function scan(page: Page, text: string) {
  const box = page.locator('[data-test="count-scan"]')
  await box.fill(text)
  await box.press('Enter')
}
const step = (page: Page) => page.locator('[data-test="count-step"]').getAttribute('data-step')

async function countBin(page: Page, bin: string, item: string, qty: number) {
  await scan(page, `B:${bin}`)
  await expect.poll(() => step(page)).toBe('item')
  await scan(page, item)
  if ((await step(page)) === 'lot') await scan(page, `L:${block.sku}|R7${tag}`)
  await expect.poll(() => step(page)).toBe('qty')
  await page.locator('[data-test="count-qty"]').fill(String(qty))
  await page.locator('[data-test="count-save"]').click()
  await page.locator('[data-test="count-entered"]').waitFor()
  await page.locator('[data-test="count-finish"]').click()
  await page.locator('.el-message-box .el-button--primary').click()
  await expect.poll(() => step(page)).toBe('bin')
}

describe('a blind count on a phone, approved by the owner', () => {
  it('counts two bins without ever showing what the records say', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 412, height: 915 } })
    try {
      await h.signInByApi(page, 'warehouse')
      await page.goto(`/warehouse/counts/${countId}/count`)
      await page.locator('[data-test="count-handheld"]').waitFor()
      expect(await page.locator('[data-test="count-step"]').textContent()).toContain('Escanee la ubicación')
      expect(await page.locator('[data-test="count-caution"]').textContent()).toContain('vidrio')
      await scan(page, 'B:A-01-1')
      await expect.poll(() => step(page)).toBe('item')
      await scan(page, block.sku)
      await expect.poll(() => step(page)).toBe('lot')
      await scan(page, `L:${block.sku}|R7${tag}`)
      await expect.poll(() => step(page)).toBe('qty')
      // Blind: the 37 on record appears nowhere on the phone.
      expect(await page.locator('body').innerText()).not.toMatch(/\b37\b/)
      await page.locator('[data-test="count-qty"]').fill('35')
      await h.screenshot(page, 'count-phone-qty')
      await page.locator('[data-test="count-save"]').click()
      await page.locator('[data-test="count-entered"]').waitFor()
      await page.locator('[data-test="count-finish"]').click()
      expect(await page.locator('.el-message-box').textContent()).toContain('A-01-1')
      await page.locator('.el-message-box .el-button--primary').click()
      await expect.poll(() => step(page)).toBe('bin')
      await countBin(page, 'A-02-1', grout.sku, 12)
      await page.locator('[data-test="count-all-done"]').waitFor()
      await h.screenshot(page, 'count-phone-done')
    } finally {
      await context.close()
    }
  })

  it('the owner sees the difference with its working and approves it: stock adjusts once', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 1280, height: 860 } })
    try {
      await h.signInByApi(page, 'admin')
      await page.goto(`/warehouse/counts/${countId}`)
      await page.locator('[data-test="count-lines"]').waitFor()
      const row = page.locator('[data-test="count-lines"] tr', { hasText: block.sku })
      // 37 on record, 35 counted: −2.
      await expect.poll(() => row.locator('[data-test^="variance-"]').textContent()).toBe('-2')
      await row.locator('.el-checkbox').click()
      await page.locator('[data-test="count-approve"]').click()
      await page.locator('.el-message-box .el-button--primary').click()
      await expect.poll(() => row.locator('[data-test^="line-status-"]').textContent()).toMatch(/Adjusted/)
      await expect.poll(() => page.locator('[data-test="count-status"]').textContent()).toMatch(/Closed/)
      await h.screenshot(page, 'count-review-approved')
      expect(await balanceOf(h.ds, block.id, wh.bins['A-01-1'])).toEqual({ onHand: 35, reserved: 0 })
      const moves = await h.ds.query("SELECT qty FROM stock_moves WHERE doc_type = 'cycle_count' AND doc_id = ?", [countId])
      expect(moves).toEqual([{ qty: -2 }])
      expect(await ledgerMismatches(h.ds, [block.id, grout.id])).toEqual([])
    } finally {
      await context.close()
    }
  })
})
