// Trial: a takeoff of large panels opened in the editor. Before, the page laid out and drew every block on
// its own thread (the largest takeoff allowed made 11 MB of SVG) and froze; now the bill is computed in a
// worker, large walls are drawn as section strips over one joint grid, and the page answers meanwhile.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF } from '../support/apiHarness.js'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { createCounterFixture, createCustomerAndJob, openingTakeoff } from '../support/counterFixtures.js'

let h: E2eHarness
beforeAll(async () => {
  h = await startE2e()
})
afterAll(() => h?.close())

describe('the editor with large panels', () => {
  it('computes off the page, draws large walls coarser and keeps answering', async () => {
    const fx = await createCounterFixture(h.ds)
    const { jobId } = await createCustomerAndJob(h.ds, `${fx.tag}X`)
    // 2 panels of 90 across × 100 courses = 18,000 blocks (a takeoff may hold 60,000; fewer keep the suite quick)
    const wall = openingTakeoff(fx, { sizing: 'count', heightMm: undefined, courses: 100, segments: [{ kind: 'straight', blocks: 90 }] }).walls[0]
    const input = { walls: Array.from({ length: 2 }, (_, i) => ({ ...wall, name: `Panel ${i + 1}` })), looseLines: [] }
    const { page, context } = await h.newPage({ viewport: { width: 1440, height: 1000 } })
    try {
      await h.signInByApi(page, 'counter')
      const created = await context.request.post(`/api/jobs/${jobId}/takeoffs`, { headers: CSRF, data: { name: 'Warehouse partition', input } })
      expect(created.status()).toBe(201)
      const { id } = (await created.json()) as { id: number }
      await page.goto(`/counter/takeoffs/${id}`)
      // the page answers while the bill is worked out: the name field takes typing at once
      const name = page.locator('[data-test="takeoff-name"] input, input[data-test="takeoff-name"]').first()
      await name.fill('Warehouse partition, east')
      await expect.poll(() => page.locator('[data-test="bill-totals"]').textContent(), { timeout: 60_000 }).toMatch(/18,?000/)
      // each 9,000-block panel is drawn as strips and one joint grid, not 9,000 rectangles
      await page.locator('[data-test="wall-drawing"] svg').first().waitFor({ timeout: 60_000 })
      expect(await page.locator('[data-test="wall-drawing"] svg path.joints').count()).toBe(2)
      expect(await page.locator('[data-test="wall-drawing"] svg rect[data-course]').count()).toBe(0)
      await h.screenshot(page, 'counter-large-panels')
    } finally {
      await context.close()
    }
  })
})
