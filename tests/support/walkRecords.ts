// Records the demo data lacks that the walks of every screen need (accessibility, the Spanish screens): a
// released pick list, a quote taken into a sales order, and an open cycle count.
import { CSRF } from './apiHarness.js'
import { DEMO_PASSWORD, type E2eHarness } from './browser.js'
import { fxBom, pickScenario, releasedPickList, signedInAgent } from './pickFixtures.js'

export async function walkRecords(h: E2eHarness): Promise<void> {
  // The demo has no pick list and no cycle count: one of each gives their screens a record to open.
  const crew = await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD)
  const s = await pickScenario(h.ds, crew)
  const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 16 }, { itemId: s.spacer.id, qty: 10 }])
  const counter = await signedInAgent(h.built.app, 'counter', DEMO_PASSWORD)
  await releasedPickList(counter, bom.bomId, s.main.id)
  // Nor a quote or a sales order: one quote by hand, offered over the counter, then taken. It holds some of
  // the same spacers the open pick list needs, in the same warehouse, so the handheld pick screen is walked
  // with another document's holds on its line's stock.
  const [{ customerId }] = (await h.ds.query('SELECT MIN(id) AS customerId FROM customers')) as { customerId: number }[]
  const quote = await counter.post('/api/quotes').set(CSRF).send({ customerId, warehouseId: s.main.id, lines: [{ itemId: s.spacer.id, qty: 2 }] })
  if (quote.status !== 201) throw new Error(`making a quote failed: ${quote.status} ${JSON.stringify(quote.body)}`)
  await h.ds.query("UPDATE quotes SET status = 'offered', offered_at = NOW() WHERE id = ?", [quote.body.id])
  const order = await counter.post('/api/sales-orders').set(CSRF).send({ quoteId: quote.body.id })
  if (order.status !== 201) throw new Error(`taking the quote failed: ${order.status} ${JSON.stringify(order.body)}`)
  const count = await crew.post('/api/counts').set(CSRF).send({ warehouseId: s.main.id, scope: 'bins', binIds: [s.main.bins['A-03-1']] })
  if (count.status !== 201) throw new Error(`opening a count failed: ${count.status} ${JSON.stringify(count.body)}`)
}
