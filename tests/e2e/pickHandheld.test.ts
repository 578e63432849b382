// The handheld pick screen in a real browser on a phone-sized page, driven like a keyboard-wedge
// scanner: typed scans ending with Enter. Wrong item, wrong bin, wrong lot and an over-pick are
// refused on screen (in Spanish: the demo warehouse user's locale) and change nothing; the right
// scans confirm, and completing issues the stock. The counter's note for the warehouse is on the
// handheld; a lot's label can be printed again from the line; a short line stays short until settled.
import type supertest from 'supertest'
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { CSRF } from '../support/apiHarness.js'
import { countRows, fxBom, ledgerMismatches, pickLedgerCheck, pickScenario, releasedPickList, signedInAgent, type PickScenario } from '../support/pickFixtures.js'

let h: E2eHarness
let s: PickScenario
let counter: supertest.Agent
let crew: supertest.Agent
let listId: number
let page: Page
let context: BrowserContext
beforeAll(async () => {
  h = await startE2e()
  crew = await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD)
  counter = await signedInAgent(h.built.app, 'counter', DEMO_PASSWORD)
  s = await pickScenario(h.ds, crew)
  // hand-worked: block 16 from the oldest lot R1 (B-01-1 10, then A-03-1 6); spacer 10 from A-02-1; walked A-02-1, A-03-1, B-01-1
  const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 16 }, { itemId: s.spacer.id, qty: 10 }])
  listId = await releasedPickList(counter, bom.bomId, s.main.id, 'Deliver to the back gate; pallets wrapped twice')
  ;({ page, context } = await h.newPage({ viewport: { width: 390, height: 844 } }))
  await h.signIn(page, 'warehouse')
})
afterAll(async () => {
  await context?.close()
  await h?.close()
})

async function scan(page: Page, text: string) {
  const box = page.locator('[data-test="scan-input"]')
  await box.fill(text)
  await box.press('Enter')
}
/** The page answers over the network on a busy machine: wait up to 10 s (vitest's default poll gives up after 1 s). */
const poll = <T>(read: () => T | Promise<T>) => expect.poll(read, { timeout: 10_000 })
const feedback = (page: Page) => page.locator('[data-test="feedback"]')
const step = (page: Page) => page.locator('[data-test="step"]').getAttribute('data-step')

describe('handheld pick screen', () => {
  it('picks a list with typed scans, refusing the wrong item, bin, lot and an over-pick', async () => {
    await page.goto('/warehouse')
    await page.locator(`[data-test="open-list-${listId}"]`).waitFor()
    await h.screenshot(page, 'warehouse-home')
    await page.locator(`[data-test="pick-${listId}"]`).click()
    await page.waitForURL(new RegExp(`/warehouse/pick/${listId}$`))
    await poll(() => page.locator('[data-test="line-bin"]').textContent()).toBe('A-02-1')
    expect(await page.locator('[data-test="step"]').textContent()).toContain('Escanee la etiqueta de la ubicación')
    expect(await page.locator('[data-test="counter-note"]').textContent()).toContain('Nota del mostrador: Deliver to the back gate; pallets wrapped twice')

    await scan(page, 'B:A-02-1')
    await poll(() => step(page)).toBe('item')
    await scan(page, s.block.sku) // the wrong item for this line
    await poll(() => feedback(page).getAttribute('data-kind')).toBe('error')
    expect(await feedback(page).textContent()).toContain('¡Artículo equivocado!')
    expect(await step(page)).toBe('item')
    await h.screenshot(page, 'pick-handheld-wrong-item')
    expect(await countRows(h.ds, 'pick_confirmations', 'pick_list_id = ?', [listId])).toBe(0)

    await scan(page, s.spacer.sku)
    await poll(() => step(page)).toBe('qty')
    await scan(page, '10')
    await poll(() => page.locator('[data-test="line-bin"]').textContent()).toBe('A-03-1')

    // source: GS1 Barcode Syntax Dictionary, (02) contained GTIN with (37) count and (10) lot
    await scan(page, 'B:A-03-1')
    await scan(page, `(02)${s.block.gtin}(37)6(10)R1${s.tag}`)
    await poll(() => page.locator('[data-test="qty-value"]').inputValue()).toBe('6')
    await page.locator('[data-test="confirm"]').click()
    await poll(() => page.locator('[data-test="line-bin"]').textContent()).toBe('B-01-1')

    await scan(page, 'B:A-01-1')
    await poll(() => feedback(page).textContent()).toContain('¡Ubicación equivocada!')
    await scan(page, 'B:B-01-1')
    await scan(page, String(s.block.gtin))
    await poll(() => step(page)).toBe('lot')
    await scan(page, `R2${s.tag}`)
    await poll(() => feedback(page).textContent()).toContain('¡Lote equivocado!')
    await scan(page, `R1${s.tag}`)
    await poll(() => step(page)).toBe('qty')
    await scan(page, '11')
    await poll(() => feedback(page).textContent()).toContain('solo faltan 10')
    await scan(page, '10')
    await page.locator('[data-test="all-done"]').waitFor()
    await poll(() => page.locator('[data-test="queue-item"]').count()).toBe(0)
    expect(await countRows(h.ds, 'pick_confirmations', 'pick_list_id = ?', [listId])).toBe(3)
    await h.screenshot(page, 'pick-handheld-all-done')

    await page.locator('[data-test="complete"]').click()
    await poll(async () => (await h.ds.query('SELECT status FROM pick_lists WHERE id = ?', [listId]))[0].status).toBe('picked')
    const moves = await h.ds.query(`SELECT qty FROM stock_moves WHERE doc_type = 'pick_list' AND doc_id = ? ORDER BY id`, [listId])
    expect(moves.map((m: { qty: number }) => m.qty)).toEqual([-10, -6, -10])
    expect(await ledgerMismatches(h.ds, [s.block.id, s.spacer.id])).toEqual([])
    expect(await pickLedgerCheck(h.ds, listId)).toEqual({ taken: [10, 6, 10], problems: [] })
  })

  it('records a short pick with how many were found and why', async () => {
    // The spacers (A-02-1) come first on the walk; this test leaves them to pick.
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.altBlock.id, qty: 10 }, { itemId: s.spacer.id, qty: 5 }])
    const id = await releasedPickList(counter, bom.bomId, s.main.id)
    await page.goto(`/warehouse/pick/${id}`)
    await page.locator('[data-test="view-list"]').click()
    await page.locator('[data-test="pick-row-B-02-1"]').click()
    // A torn lot label: printed again from the line, with the lot's own code on it.
    await page.locator('[data-test="reprint-lot"]').click()
    await page.waitForURL(/\/stock\/labels\?kind=lot/)
    await poll(() => page.locator('[data-test="label"]').allTextContents()).toEqual([expect.stringContaining(`${s.altBlock.sku} · W1${s.tag}`)])
    await page.goBack()
    await page.locator('[data-test="view-list"]').click()
    await page.locator('[data-test="pick-row-B-02-1"]').click()
    await scan(page, 'B:B-02-1')
    await scan(page, `L:${s.altBlock.sku}|W1${s.tag}`) // our own lot label: item and lot in one scan
    await poll(() => step(page)).toBe('qty')
    await page.locator('[data-test="short-pick"]').click()
    // Escape closes the form and hands the focus back to the button that opened it (WCAG 2.2, 2.4.3 focus order).
    const shortDialog = page.locator('[data-test="short-dialog"]')
    await shortDialog.waitFor()
    await page.keyboard.press('Escape')
    await shortDialog.waitFor({ state: 'hidden' })
    await poll(() => page.evaluate(() => document.activeElement?.getAttribute('data-test'))).toBe('short-pick')
    await page.locator('[data-test="short-pick"]').click()
    // 12 found of 10 wanted can't be a short pick: refused beside the field, never quietly made 9.
    await page.locator('[data-test="short-found"]').fill('12')
    await page.locator('[data-test="short-reason-damaged"]').click()
    await page.locator('[data-test="short-save"]').click()
    expect(await page.locator('[data-test="short-found-problem"]').textContent())
      .toBe('Escriba un número entero de 0 a 9 uds.: si encontró todas, confirme la línea en vez de marcar faltante.')
    await page.locator('[data-test="short-found"]').fill('1,5')
    await page.locator('[data-test="short-save"]').click()
    await page.locator('[data-test="short-found-problem"]').waitFor()
    expect(await countRows(h.ds, 'pick_confirmations', 'pick_list_id = ?', [id])).toBe(0)
    await page.locator('[data-test="short-found"]').fill('4')
    await page.locator('[data-test="short-reason-damaged"]').click()
    await h.screenshot(page, 'pick-handheld-short')
    await page.locator('[data-test="short-save"]').click()
    // Saved, the scan box has the focus again (the next scan goes in), not the button that opened the form.
    await shortDialog.waitFor({ state: 'hidden' })
    await poll(() => page.evaluate(() => document.activeElement?.getAttribute('data-test'))).toBe('scan-input')
    await poll(() => page.locator('[data-test="line-bin"]').textContent()).toBe('A-02-1') // on to the spacers
    await poll(() => page.locator('[data-test="queue-item"]').count()).toBe(0)
    const [row] = await h.ds.query('SELECT qty, short_qty, short_reason FROM pick_confirmations WHERE pick_list_id = ?', [id])
    expect(row).toEqual({ qty: 4, short_qty: 6, short_reason: 'damaged' })
    // A short line stays short (amber, with what was found and why), and the list is not called done.
    await page.locator('[data-test="view-list"]').click()
    const rowButton = page.locator('[data-test="pick-row-B-02-1"]')
    await poll(() => rowButton.getAttribute('data-state')).toBe('short')
    // hand-worked: 4 of the 10 found, 6 short for damage
    expect(await rowButton.locator('[data-test="row-state"]').textContent()).toBe('Faltante: 4 uds. de 10 uds. encontradas · Dañado o roto')
    expect(await page.locator('[data-test="progress-lines"]').textContent()).toBe('Líneas: 0 de 2 hechas · 1 con faltante · 1 por preparar')
    await h.screenshot(page, 'pick-handheld-short-line')
    // The counter's buyer will order the 6 missing: the line reads settled, still not done.
    await page.locator('[data-test="settle-B-02-1"]').click()
    await page.locator('[data-test="resolve-backorder"]').click()
    await page.locator('[data-test="resolve-qty"]').fill('7')
    await page.locator('[data-test="resolve-save"]').click()
    expect(await page.locator('[data-test="resolve-dialog-problem"]').textContent()).toBe('Escriba un número entero de 1 a 6.')
    await page.locator('[data-test="resolve-qty"]').fill('6')
    await page.locator('[data-test="resolve-save"]').click()
    await poll(() => rowButton.getAttribute('data-state')).toBe('resolved')
    expect(await rowButton.locator('[data-test="row-state"]').textContent()).toBe('Faltante resuelto: 6 uds. pedidas')
    expect(await page.locator('[data-test="progress-lines"]').textContent()).toBe('Líneas: 0 de 2 hechas · 1 resuelta · 1 por preparar')
    expect(await page.locator('[data-test="settle-B-02-1"]').count()).toBe(0)
    expect((await crew.post(`/api/pick-lists/${id}/complete`).set(CSRF).send({ acceptShort: true })).status).toBe(200)
    expect(await pickLedgerCheck(h.ds, id)).toEqual({ taken: [4], problems: [] })
  })
})
