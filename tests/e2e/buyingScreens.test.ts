// Buying and set-up screens in a real browser, signed in once as the admin:
// - a draft purchase order: removing a line asks first, and approving with edits on screen that were never
//   saved asks to save them, then approves what the screen shows (before, the approval went through with the
//   old quantities and the edits were silently dropped);
// - warehouses: after creating a warehouse, a range of bins goes to the new one even when the previous
//   warehouse's answer arrives last (before, 30 bins landed in the previously chosen warehouse); the dialog
//   names its warehouse; taking a bin out of use and deleting one ask first;
// - the company profile: edited, saved, and still there after a reload;
// - ready to order: an accepted line's quantity changed and another dismissed, each after a question;
// - special orders: the ship-to column shows each job's own warehouse, or asks for one, and follows the
//   ship-to chosen for all.
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { createPurchasingFixture, insertId, jobWithShowerBase, suggestion, type PurchasingFixture } from '../support/purchasingFixtures.js'

// Screens on a loaded machine can take seconds to answer: wait for conditions, long enough.
const poll = <T>(read: () => Promise<T> | T) => expect.poll(read, { timeout: 30_000 })

let h: E2eHarness
let f: PurchasingFixture
let page: Page
let context: BrowserContext
beforeAll(async () => {
  h = await startE2e()
  f = await createPurchasingFixture(h.ds)
  ;({ page, context } = await h.newPage({ viewport: { width: 1440, height: 900 } }))
  await h.signIn(page, 'admin')
})
afterAll(async () => {
  await context?.close()
  await h?.close()
})

describe('a draft purchase order on screen', () => {
  it('asks before removing a line and saves unsaved edits before approving', async () => {
    const created = await page.evaluate(async (body) => {
      const res = await fetch('/api/purchase-orders', {
        method: 'POST', credentials: 'same-origin', body: JSON.stringify(body),
        headers: { 'Content-Type': 'application/json', 'X-Lumenyard-Request': '1' },
      })
      return (await res.json()) as { id: number }
    }, { vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.block.id, packsOrdered: 2 }, { itemId: f.sealant.id, packsOrdered: 1 }] })
    await page.goto(`/purchasing/orders/${created.id}`)
    const rows = page.locator('[data-test="po-lines"] tbody tr')
    await poll(() => rows.count()).toBe(2)

    // Remove line: the question comes first; "Cancel" keeps the line.
    await rows.nth(1).locator('[data-test="remove-line"]').click()
    const box = page.locator('.el-message-box')
    await poll(() => box.textContent()).toContain(f.sealant.sku)
    await box.locator('button', { hasText: 'Cancel' }).click()
    expect(await rows.count()).toBe(2)
    await rows.nth(1).locator('[data-test="remove-line"]').click()
    await box.locator('.el-button--primary').click()
    await poll(() => rows.count()).toBe(1)

    // 2 packs → 5 packs typed, not saved; approve asks, and approves 5 packs of 24 = 120 units.
    const packs = rows.first().locator('.ly-number input').first()
    await packs.fill('5')
    await packs.press('Tab')
    await poll(() => page.locator('[data-test="unsaved-note"]').isVisible()).toBe(true)
    await page.locator('[data-test="approve"]').click()
    await poll(() => box.textContent()).toContain('not saved')
    await h.screenshot(page, 'po-approve-unsaved')
    await box.locator('button', { hasText: 'Cancel' }).click()
    expect(await page.locator('[data-test="po-status"]').getAttribute('data-status')).toBe('draft')
    await page.locator('[data-test="approve"]').click()
    await box.locator('.el-button--primary').click()
    await poll(() => page.locator('[data-test="po-status"]').getAttribute('data-status')).toBe('approved')
    const lines = await h.ds.query('SELECT packs_ordered, qty_ordered FROM purchase_order_lines WHERE po_id = ?', [created.id])
    expect(lines).toEqual([{ packs_ordered: 5, qty_ordered: 120 }]) // vendor A's pack of 24 (fixture) × 5
  })
})

describe('warehouses and bins on screen', () => {
  it('puts a range of bins in the warehouse just created, names it, and asks before taking out or deleting', async () => {
    const box = page.locator('.el-message-box')
    const binsOf = async (id: number) => Number((await h.ds.query('SELECT COUNT(*) AS n FROM bins WHERE warehouse_id = ?', [id]))[0].n)
    await page.goto(`/stock/warehouses?warehouse=${f.warehouse.id}`)
    await page.locator('[data-test="bins-table"]').waitFor()
    // The previously chosen warehouse's answer comes back slowly, after the new warehouse's.
    await page.route(`**/api/warehouses/${f.warehouse.id}`, async (route) => {
      await new Promise((r) => setTimeout(r, 1500))
      await route.continue()
    })
    const code = `N${f.tag}`
    await page.locator('[data-test="wh-add"]').click()
    await page.locator('[data-test="wh-code"]').fill(code)
    await page.locator('[data-test="wh-name"]').fill(`Yard ${code}`)
    await page.locator('[data-test="wh-save"]').click()
    await page.waitForURL(/warehouse=\d+/)
    await page.waitForTimeout(2000) // let the slow, older answer arrive
    await page.locator('[data-test="bins-range"]').click()
    await poll(() => page.locator('.el-dialog__title', { hasText: 'Range of bins' }).textContent()).toContain(code)
    await page.locator('[data-test="range-save"]').click()
    const [created] = await h.ds.query('SELECT id FROM warehouses WHERE code = ?', [code])
    // The form's default range, A–C × 1–10 × 1–3 = 90 bins, all in the new warehouse; the fixture's keeps its 3.
    await poll(() => binsOf(created.id)).toBe(90)
    expect(await binsOf(f.warehouse.id)).toBe(3)
    await page.unroute(`**/api/warehouses/${f.warehouse.id}`)

    const first = page.locator('[data-test="bins-table"] tbody tr').first()
    // The list reloads after the range; on a busy machine that takes a while.
    await poll(() => page.locator('.el-loading-mask:visible').count()).toBe(0)
    await first.locator('[data-test="bin-take-out"]').click({ timeout: 30_000 })
    await poll(() => box.textContent()).toContain('A-01-1')
    await box.locator('button', { hasText: 'Cancel' }).click()
    const [bin] = await h.ds.query("SELECT id, active FROM bins WHERE warehouse_id = ? AND code = 'A-01-1'", [created.id])
    expect(bin.active).toBe(1)
    await first.locator('[data-test="bin-delete"]').click()
    await box.locator('.el-button--primary').click()
    await poll(() => binsOf(created.id)).toBe(89)
    await h.screenshot(page, 'warehouse-bins-after-delete')
  })
})

describe('the company profile on screen', () => {
  it('saves an edit that a reload still shows', async () => {
    await page.goto('/admin/company')
    const phone = page.locator('input[data-test="company-phone"], [data-test="company-phone"] input').first()
    const replyTo = page.locator('input[data-test="company-replyTo"], [data-test="company-replyTo"] input').first()
    await phone.waitFor()
    const [before] = await h.ds.query('SELECT phone, reply_to FROM company_profile WHERE id = 1')
    try {
      await phone.fill('555-0199 ext. 12')
      await replyTo.fill('orders@brightcourse.example')
      await page.locator('[data-test="company-save"]').click()
      await poll(async () => (await h.ds.query('SELECT phone FROM company_profile WHERE id = 1'))[0].phone).toBe('555-0199 ext. 12')
      await page.reload()
      await phone.waitFor()
      await poll(() => phone.inputValue()).toBe('555-0199 ext. 12')
      expect(await replyTo.inputValue()).toBe('orders@brightcourse.example')
      await h.screenshot(page, 'admin-company-profile-saved')
    } finally {
      await h.ds.query('UPDATE company_profile SET phone = ?, reply_to = ? WHERE id = 1', [before.phone, before.reply_to])
    }
  })
})

describe('ready to order on screen', () => {
  it('changes an accepted line\'s quantity and dismisses another, each after a question', async () => {
    const keep = await suggestion(h.ds, { itemId: f.block.id, warehouseId: f.otherWarehouse.id, vendorId: f.vendorA, qty: 30 })
    const drop = await suggestion(h.ds, { itemId: f.sealant.id, warehouseId: f.otherWarehouse.id, vendorId: f.vendorA, qty: 12 })
    const box = page.locator('.el-message-box')
    await page.goto('/purchasing/ready-to-order')
    const rowOf = (sku: string) => page.locator('[data-test="suggestions-table"] tbody tr', { hasText: sku }).filter({ hasText: f.otherWarehouse.code })
    await poll(() => rowOf(f.block.sku).count()).toBe(1)

    await rowOf(f.block.sku).locator('[data-test="suggestion-change"]').click()
    await box.locator('input').fill('50')
    await box.locator('.el-button--primary').click()
    await poll(async () => (await h.ds.query('SELECT qty FROM purchase_suggestions WHERE id = ?', [keep]))[0].qty).toBe(50)
    await poll(() => rowOf(f.block.sku).textContent()).toContain('50 each')

    // Dismiss asks; "Cancel" keeps the line, the second time it goes.
    await rowOf(f.sealant.sku).locator('[data-test="suggestion-dismiss"]').click()
    await poll(() => box.textContent()).toContain(f.sealant.sku)
    await box.locator('button', { hasText: 'Cancel' }).click()
    expect((await h.ds.query('SELECT status FROM purchase_suggestions WHERE id = ?', [drop]))[0].status).toBe('accepted')
    await rowOf(f.sealant.sku).locator('[data-test="suggestion-dismiss"]').click()
    await box.locator('.el-button--primary').click()
    await poll(() => rowOf(f.sealant.sku).count()).toBe(0)
    expect((await h.ds.query('SELECT status FROM purchase_suggestions WHERE id = ?', [drop]))[0].status).toBe('dismissed')
    await h.screenshot(page, 'ready-to-order-changed')
  })
})

describe('special orders on screen', () => {
  it('ships each job to its own warehouse, asks when a job has none, and follows a ship-to chosen for all', async () => {
    const due = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10)
    const picked = await jobWithShowerBase(h.ds, f, due)
    const unpicked = await jobWithShowerBase(h.ds, f, due)
    const [bom] = await h.ds.query('SELECT bom_id FROM bom_lines WHERE id = ?', [picked.bomLineId])
    await insertId(h.ds, 'INSERT INTO pick_lists (bom_id, job_id, warehouse_id) VALUES (?, ?, ?)', [bom.bom_id, picked.jobId, f.otherWarehouse.id])
    const nameOf = async (jobId: number) => (await h.ds.query('SELECT name FROM jobs WHERE id = ?', [jobId]))[0].name as string
    await h.ds.query('UPDATE jobs SET name = CONCAT(name, \' picked\') WHERE id = ?', [picked.jobId])
    await page.goto('/purchasing/special-orders')
    const rowOf = async (jobId: number) => page.locator('[data-test="special-orders"] tbody tr', { hasText: await nameOf(jobId) })
    const pickedRow = await rowOf(picked.jobId)
    const unpickedRow = page.locator('[data-test="special-orders"] tbody tr', { hasText: await nameOf(unpicked.jobId) }).filter({ hasNotText: ' picked' })
    await poll(() => pickedRow.textContent()).toContain(f.otherWarehouse.code)
    await poll(() => unpickedRow.textContent()).toContain('choose above')
    await page.locator('[data-test="special-ship-to"]').click()
    await page.locator('.el-select-dropdown__item:visible', { hasText: f.warehouse.code }).first().click()
    await poll(() => unpickedRow.textContent()).toContain(f.warehouse.code)
    expect(await pickedRow.textContent()).toContain(f.warehouse.code)
    await h.screenshot(page, 'special-orders-ship-to')
  })
})
