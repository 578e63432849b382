// The counter selling in the demo: a few quotes of Brightcourse's contractors in different states (draft,
// offered, lost with its reason) and two taken into sales orders, with deposits on their made-to-order
// shower bases, one paid in cash and one by card (recorded as the provider would have settled it), so a
// newcomer's first `npm start` shows Counter → Quotes and orders at work. Small quantities of well-stocked
// blocks only, so the holds leave the rest of the demo's stock free. Made through the services themselves.
import type { DataSource, EntityManager } from 'typeorm'
import { Customer } from '../entities/Customer.js'
import { Item } from '../entities/Item.js'
import { Quote } from '../entities/Quote.js'
import { User } from '../entities/User.js'
import { Warehouse } from '../entities/Warehouse.js'
import { createQuote, loseQuote } from '../services/quotes/quoteWrite.js'
import { recordPayment } from '../services/sales/payments.js'
import { takeQuote } from '../services/sales/salesOrderWrite.js'

interface DemoQuote {
  customer: string
  lines: [sku: string, qty: number][]
  then: 'draft' | 'offered' | { lost: string } | { taken: 'cash' | 'card' }
}

const QUOTES: DemoQuote[] = [
  { customer: 'COPPERLINE', lines: [['GB-0606-WV-SQ', 48]], then: 'draft' },
  { customer: 'BROOKMOOR', lines: [['GB-0808-CL-SQ', 36]], then: 'offered' },
  { customer: 'QUILLFEATHER', lines: [['GB-0808-CL-SQ', 60]], then: { lost: 'Job postponed to next spring' } },
  { customer: 'ALDERCREEK', lines: [['GB-0606-WV-SQ', 24], ['SB-3648-CTR', 1]], then: { taken: 'cash' } },
  { customer: 'COPPERLINE', lines: [['GB-0808-CL-SQ', 16], ['SB-3648-CTR', 1]], then: { taken: 'card' } },
]

export async function loadDemoCounterSales(em: EntityManager, ds: DataSource): Promise<void> {
  // Loaded once: Alder Creek's quote is the demo's own (no other step or fixture quotes for that account).
  const alder = await em.findOneBy(Customer, { code: 'ALDERCREEK' })
  if (!alder || (await em.existsBy(Quote, { customerId: alder.id }))) return
  const clerk = await em.findOneByOrFail(User, { username: 'counter' })
  const actor = { userId: clerk.id }
  const warehouse = await em.findOneByOrFail(Warehouse, { code: 'HRY' })
  const base = await em.findOne(Item, { where: { family: 'shower_base', madeToOrder: true }, order: { id: 'ASC' } })
  for (const q of QUOTES) {
    const customer = await em.findOneBy(Customer, { code: q.customer })
    if (!customer) continue
    const lines = []
    for (const [sku, qty] of q.lines) {
      const item = sku === 'SB-3648-CTR' ? base : await em.findOneBy(Item, { sku })
      if (item) lines.push({ itemId: item.id, qty, unitPrice: null, overrideReason: null, bomLineId: null })
    }
    if (!lines.length) continue
    // Services open their own transactions: this step's own transaction writes nothing.
    const quote = await createQuote(ds, actor, { customerId: customer.id, jobId: null, bomId: null, lines, warehouseId: warehouse.id, terms: null, notes: null })
    if (q.then === 'draft') continue
    await ds.getRepository(Quote).update({ id: quote.id }, { status: 'offered', offeredAt: new Date() })
    if (q.then === 'offered') continue
    if ('lost' in q.then) {
      await loseQuote(ds, actor, quote.id, q.then.lost)
      continue
    }
    const order = await takeQuote(ds, actor, quote.id)
    if (order.depositDue === '0.00') continue
    await recordPayment(ds, actor, order.id, q.then.taken === 'cash'
      ? { method: 'cash', amount: order.depositDue }
      : { method: 'card', amount: order.depositDue, reference: `pi_demo_${order.number}`, status: 'settled' })
  }
}
