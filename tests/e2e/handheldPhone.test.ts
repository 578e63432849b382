// The warehouse crew's handheld screens on a 412 px phone, in Chromium. The scan box and the quantity stepper
// come first: no other control on the screen is as tall as they are or covers more of it, at each step of
// picking, counting, receiving, moving and adjusting (every control measured by its own box). The dialogs
// those screens open (a short pick, a stock change to confirm) pass axe open, on the phone.
// source: WCAG 2.2 SC 2.5.5 Target Size (Enhanced): 44 × 44 CSS px is the floor every control already meets;
// the main control being the largest target on a gloved handheld is common practice for warehouse scanners.
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { CSRF } from '../support/apiHarness.js'
import { axeFindings, blocking, describeFindings } from '../support/axeCheck.js'
import { mainControlSizes, placeholdersCutOff } from '../support/layoutChecks.js'
import { fxBom, pickScenario, releasedPickList, signedInAgent, type PickScenario } from '../support/pickFixtures.js'
import { openInApp } from '../support/routeWalk.js'

// A 412 px phone: the warehouse's handheld width in the team's trials.
const PHONE = { width: 412, height: 900 }

let h: E2eHarness
let s: PickScenario
let page: Page
let context: BrowserContext
let listId: number
let countId: number
let poId: number
beforeAll(async () => {
  h = await startE2e()
  const crew = await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD)
  const counter = await signedInAgent(h.built.app, 'counter', DEMO_PASSWORD)
  s = await pickScenario(h.ds, crew)
  const bom = await fxBom(h.ds, s.tag, [{ itemId: s.spacer.id, qty: 10 }])
  listId = await releasedPickList(counter, bom.bomId, s.main.id)
  const count = await crew.post('/api/counts').set(CSRF).send({ warehouseId: s.main.id, scope: 'bins', binIds: [s.main.bins['A-03-1']] })
  if (count.status !== 201) throw new Error(`opening a count failed: ${count.status} ${JSON.stringify(count.body)}`)
  countId = count.body.id
  const [po] = (await h.ds.query("SELECT MIN(id) AS id FROM purchase_orders WHERE status IN ('sent', 'partly_received')")) as { id: number | null }[]
  if (!po?.id) throw new Error('the demo has no purchase order to receive')
  poId = po.id
  ;({ page, context } = await h.newPage({ viewport: PHONE }))
  await page.emulateMedia({ reducedMotion: 'reduce' })
  await h.signIn(page, 'warehouse')
})
afterAll(async () => {
  await context?.close()
  await h?.close()
})

async function scan(testId: string, text: string) {
  const box = page.locator(`[data-test="${testId}"]`)
  await box.fill(text)
  await box.press('Enter')
}

/**
 * Measures the screen as it stands: the scan box or stepper must show, and nothing else may rival it. Every text
 * box's hint shows whole, in the crew's Spanish: a cut-off placeholder ("… y pulse" without what to press) reads as
 * another instruction (common practice: a box's hint fits it, the rest of the instruction goes beneath).
 */
async function measure(where: string, main: string, wanted: number) {
  const sizes = await mainControlSizes(page, main)
  expect(sizes.main.length, `${where}: scan box and stepper showing (${sizes.main.join(', ')})`).toBe(wanted)
  expect(sizes.rivals, `${where}: controls as tall as, or larger than, ${sizes.main.join(' and ')}`).toEqual([])
  expect(await page.locator('html').getAttribute('lang'), where).toBe('es')
  expect(await placeholdersCutOff(page, 'input[placeholder]'), `${where}: hints cut off`).toEqual([])
}

// Each screen's scan box, and its quantity stepper (the − field + group) when it shows.
const PICK = '#pick-scan, [data-test="pick-line"] .qty'
const COUNT = '#count-scan, [data-test="count-entry"] .qty'

describe('the scan box and the quantity stepper are the largest controls on a phone', () => {
  it('on the handheld pick screen, at the bin step and the quantity step', async () => {
    await openInApp(page, `/warehouse/pick/${listId}`)
    await page.locator('[data-test="line-bin"]').waitFor()
    await measure('pick, bin step', PICK, 1)
    await scan('scan-input', 'B:A-02-1')
    await page.locator('[data-test="step"][data-step="item"]').waitFor()
    await scan('scan-input', s.spacer.sku)
    await page.locator('[data-test="qty-value"]').waitFor()
    await measure('pick, quantity step', PICK, 2)
  })

  it('on the handheld count, at the bin step and the quantity step', async () => {
    await openInApp(page, `/warehouse/counts/${countId}/count`)
    await page.locator('[data-test="count-scan"]').waitFor()
    await measure('count, bin step', COUNT, 1)
    await scan('count-scan', 'B:A-03-1')
    await page.locator('[data-test="count-bin"]').waitFor()
    await scan('count-scan', s.spacer.sku)
    await page.locator('[data-test="count-qty"]').waitFor()
    await measure('count, quantity step', COUNT, 2)
  })

  it('on receiving against a purchase order, with a line to receive', async () => {
    await openInApp(page, `/warehouse/receiving/${poId}`)
    await page.locator('[data-test="add-by-hand"]').click()
    await page.locator('.el-dropdown-menu__item >> visible=true').first().click()
    await page.locator('[data-test="receipt-row"]').first().waitFor()
    await page.locator('.el-dropdown-menu >> visible=true').waitFor({ state: 'detached' })
    // The scan box, and the row's received and damaged quantities.
    await measure('receive', '#receive-scan, [data-test="receipt-row"] .ly-number', 3)
  })

  it('on moving and adjusting stock', async () => {
    await openInApp(page, '/stock/move')
    await page.locator('[data-test="move-qty"]').waitFor()
    await measure('move', '[data-test="scan"], [data-test="move-qty"]', 2)
    await openInApp(page, '/stock/adjust')
    await page.locator('[data-test="adjust-qty"]').waitFor()
    await measure('adjust', '[data-test="scan"], [data-test="adjust-qty"]', 2)
  })

})

// source: W3C, WCAG 2.2 levels A and AA, as axe-core implements them; SC 2.4.3 Focus Order (focus back to the opener)
describe('the handheld dialogs on a phone', () => {
  async function axeOpen(where: string) {
    const bad = blocking(await axeFindings(page, where))
    expect(bad, describeFindings(bad)).toEqual([])
  }

  it('the short pick, opened on the line being picked', async () => {
    await openInApp(page, `/warehouse/pick/${listId}`)
    await page.locator('[data-test="step"][data-step="bin"]').waitFor()
    await scan('scan-input', 'B:A-02-1')
    await page.locator('[data-test="step"][data-step="item"]').waitFor()
    await page.locator('[data-test="short-pick"]').click()
    const dialog = page.locator('[data-test="short-dialog"]')
    await dialog.waitFor()
    await axeOpen('pick, short pick dialog (phone)')
    await page.keyboard.press('Escape')
    await dialog.waitFor({ state: 'hidden' })
  })

  it('the stock change to confirm, opened from adjusting', async () => {
    await openInApp(page, `/stock/adjust?binId=${s.main.bins['A-02-1']}&itemId=${s.spacer.id}`)
    await page.locator('[data-test="adjust-here"]').waitFor()
    await page.locator('[data-reason="damaged"]').click()
    await page.locator('[data-test="adjust-qty"] input').fill('1')
    await page.locator('[data-test="adjust-review"]').click()
    const dialog = page.locator('[data-test="confirm-dialog"]')
    await dialog.waitFor()
    await axeOpen('adjust, confirmation dialog (phone)')
    await page.keyboard.press('Escape')
    await dialog.waitFor({ state: 'hidden' })
    expect(await page.evaluate(() => document.activeElement?.getAttribute('data-test'))).toBe('adjust-review')
  })
})
