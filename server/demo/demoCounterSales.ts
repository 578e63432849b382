// The counter selling in the demo: a few quotes of Brightcourse's contractors in different states (draft,
// offered, lost with its reason) and three taken into sales orders: two with deposits on their made-to-order
// shower bases, one paid in cash and one by card (recorded as the provider would have settled it), the cash
// one's blocks sent to the warehouse (an open pick list for the handheld), and a third picked in full with its
// pickup ticket waiting for the contractor's signature, so a newcomer's first `npm start` shows the counter
// selling and the warehouse handing over. Small quantities of well-stocked blocks only, so the holds leave
// the rest of the demo's stock free. Made through the services themselves.
import { randomUUID } from 'node:crypto'
import type { DataSource, EntityManager } from 'typeorm'
import { inTransaction } from '../db/transaction.js'
import { Bin } from '../entities/Bin.js'
import { Customer } from '../entities/Customer.js'
import { Item } from '../entities/Item.js'
import { Lot } from '../entities/Lot.js'
import { PickListLine } from '../entities/PickList.js'
import { Quote } from '../entities/Quote.js'
import { User } from '../entities/User.js'
import { Warehouse } from '../entities/Warehouse.js'
import { completePickList } from '../services/picking/pickCompletion.js'
import { confirmPick } from '../services/picking/pickConfirmations.js'
import { createQuote, loseQuote } from '../services/quotes/quoteWrite.js'
import { sendOrderToPick } from '../services/sales/fulfilment.js'
import { createTicket } from '../services/sales/handoverTickets.js'
import { recordPayment } from '../services/sales/payments.js'
import { takeQuote } from '../services/sales/salesOrderWrite.js'

interface DemoQuote {
  customer: string
  lines: [sku: string, qty: number][]
  then: 'draft' | 'offered' | { lost: string } | { taken: 'cash' | 'card' | 'no deposit'; next?: 'to the warehouse' | 'ticket waiting' }
}

const QUOTES: DemoQuote[] = [
  { customer: 'COPPERLINE', lines: [['GB-0606-WV-SQ', 48]], then: 'draft' },
  { customer: 'BROOKMOOR', lines: [['GB-0808-CL-SQ', 36]], then: 'offered' },
  { customer: 'QUILLFEATHER', lines: [['GB-0808-CL-SQ', 60]], then: { lost: 'Job postponed to next spring' } },
  { customer: 'ALDERCREEK', lines: [['GB-0606-WV-SQ', 24], ['SB-3648-CTR', 1]], then: { taken: 'cash', next: 'to the warehouse' } },
  { customer: 'COPPERLINE', lines: [['GB-0808-CL-SQ', 16], ['SB-3648-CTR', 1]], then: { taken: 'card' } },
  { customer: 'BROOKMOOR', lines: [['GB-0808-CL-SQ', 12]], then: { taken: 'no deposit', next: 'ticket waiting' } },
]

export async function loadDemoCounterSales(em: EntityManager, ds: DataSource): Promise<void> {
  // Loaded once: Alder Creek's quote is the demo's own (no other step or fixture quotes for that account).
  const alder = await em.findOneBy(Customer, { code: 'ALDERCREEK' })
  if (!alder || (await em.existsBy(Quote, { customerId: alder.id }))) return
  const clerk = await em.findOneByOrFail(User, { username: 'counter' })
  const actor = { userId: clerk.id, name: clerk.displayName, roles: clerk.roles }
  const crew = { userId: (await em.findOneByOrFail(User, { username: 'warehouse' })).id }
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
    if (order.depositDue !== '0.00' && q.then.taken !== 'no deposit') {
      await recordPayment(ds, actor, order.id, q.then.taken === 'cash'
        ? { method: 'cash', amount: order.depositDue }
        : { method: 'card', amount: order.depositDue, reference: `pi_demo_${order.number}`, status: 'settled' })
    }
    if (!q.then.next) continue
    const { pickListId } = await inTransaction(ds, (tx) => sendOrderToPick(tx, actor, order.id))
    if (q.then.next === 'ticket waiting') await pickAndTicket(ds, actor, crew, order.id, pickListId)
  }
}

/** The crew picks the order's list in full, scanning each bin and item, and the counter makes its pickup ticket. */
async function pickAndTicket(ds: DataSource, clerk: { userId: number }, crew: { userId: number }, orderId: number, pickListId: number): Promise<void> {
  const lines = await ds.getRepository(PickListLine).findBy({ pickListId })
  for (const line of lines) {
    const bin = await ds.getRepository(Bin).findOneByOrFail({ id: line.binId })
    const item = await ds.getRepository(Item).findOneByOrFail({ id: line.itemId })
    const lot = line.lotId === null ? null : await ds.getRepository(Lot).findOneByOrFail({ id: line.lotId })
    const scans = { lineId: line.id, binScan: `B:${bin.code}`, itemScan: item.sku, lotScan: lot?.code ?? null, qty: line.qty }
    await inTransaction(ds, (tx) => confirmPick(tx, crew, pickListId, scans, randomUUID()))
  }
  await inTransaction(ds, (tx) => completePickList(tx, crew, pickListId, { acceptShort: false }))
  const picked = new Map<number, number>()
  for (const line of lines) if (line.salesOrderLineId !== null) picked.set(line.salesOrderLineId, (picked.get(line.salesOrderLineId) ?? 0) + line.qty)
  const ticketLines = [...picked].map(([salesOrderLineId, qty]) => ({ salesOrderLineId, qty }))
  await inTransaction(ds, (tx) => createTicket(tx, clerk, orderId, { kind: 'pickup', deliverTo: null, note: null, lines: ticketLines }))
}
