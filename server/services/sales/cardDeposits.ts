// Card deposits on a sales order through the payment provider (services/payments/payProvider.ts). Starting
// one makes a payment intent for the deposit still due and a 'pending' card payment row naming it; the card is
// entered on the provider's side and confirmed with its token; the provider's signed event then settles the
// row (deposit_paid rewritten in the same transaction). Cancelling an order refunds its settled card payments.
import type { DataSource, EntityManager } from 'typeorm'
import { addMoney, compareMoney, roundMoney, subtractMoney } from '../../../shared/money.js'
import { fromMinorUnits, toMinorUnits } from '../../../shared/payments/minorUnits.js'
import { Payment } from '../../entities/SalesOrder.js'
import type { CardDepositStage, CardDepositState } from '../../../shared/schemas/salesOrders.js'
import { SalesOrder } from '../../entities/SalesOrder.js'
import { AppError, problem } from '../../errors.js'
import { inTransaction } from '../../db/transaction.js'
import { audit, type AuditActor } from '../auditService.js'
import type { PayProvider, ProviderEvent } from '../payments/payProvider.js'
import { recordPaymentIn, refreshPaid } from './payments.js'
import { lockSalesOrder } from './salesOrderWrite.js'

export interface CardDepositView {
  paymentId: number
  salesOrderId: number
  amount: string
  status: string
  /** The provider's payment intent (its id only: no card detail ever reaches Lumenyard). */
  intentId: string
  providerStatus: string
  /** The provider's page where the customer enters the card (null when the provider gives none). */
  payPageUrl: string | null
}

const view = (pay: PayProvider, p: Payment, providerStatus: string): CardDepositView => ({
  paymentId: p.id, salesOrderId: p.salesOrderId, amount: p.amount, status: p.status, intentId: p.reference ?? '', providerStatus,
  payPageUrl: p.reference ? pay.customerPageUrl(p.reference) : null,
})

/**
 * Starts a card deposit for the deposit still due, or the part of it asked (`amount`, never more than is due).
 * The order is locked first, so a second submit waits and then finds the pending card payment; the provider
 * call carries an idempotency key made from the order and its count of card payments, so a retried
 * transaction gets the same payment intent back, never a second one.
 */
export async function startCardDepositIn(em: EntityManager, pay: PayProvider, actor: AuditActor, orderId: number, asked?: string): Promise<CardDepositView> {
  const order = await lockSalesOrder(em, orderId)
  if (order.status === 'cancelled' || order.status === 'handed_over') {
    throw AppError.conflict('sales_order_wrong_status', `A sales order that is ${order.status} takes no deposit.`, { params: { orderStatus: order.status } })
  }
  const pending = await em.findOne(Payment, { where: { salesOrderId: orderId, method: 'card', status: 'pending' } })
  if (pending) return view(pay, pending, 'requires_payment_method')
  const owed = subtractMoney(order.depositRequired, order.depositPaid)
  if (compareMoney(owed, '0') <= 0) {
    throw AppError.conflict('deposit_already_paid', `The deposit on ${order.number} is paid.`, { params: { order: order.number ?? String(orderId) } })
  }
  if (asked !== undefined && compareMoney(asked, owed) > 0) {
    const text = roundMoney(owed)
    throw AppError.conflict('payment_over_balance', `${asked} is more than the ${text} of deposit still due.`, { params: { due: text }, fields: { amount: problem('payment_over_balance', { due: text }) } })
  }
  const due = roundMoney(asked ?? owed)
  const cards: { n: number }[] = await em.query("SELECT COUNT(*) AS n FROM payments WHERE sales_order_id = ? AND method = 'card'", [orderId])
  const intent = await pay.createIntent({
    amountMinor: toMinorUnits(due, pay.currency),
    description: `Deposit, sales order ${order.number}`,
    metadata: { salesOrderId: String(orderId), salesOrder: order.number ?? '' },
    idempotencyKey: `lumenyard-deposit-${orderId}-${Number(cards[0]?.n ?? 0) + 1}`,
  })
  const payment = await em.save(em.create(Payment, {
    salesOrderId: orderId, method: 'card', amount: due, status: 'pending', reference: intent.id, providerEventId: null, recordedBy: actor.userId, refundedAmount: '0.00',
  }))
  await audit(em, actor, 'payment.card_start', 'sales_order', orderId, { number: order.number, paymentId: payment.id, amount: due, intent: intent.id })
  return view(pay, payment, intent.status)
}

/** One card payment of the order, with its payment intent (no lock); `pending` refuses one no longer waiting for a card. */
async function cardPayment(ds: DataSource, orderId: number, paymentId: number, opts: { pending?: boolean } = {}): Promise<Payment & { reference: string }> {
  const payment = await ds.getRepository(Payment).findOneBy({ id: paymentId, salesOrderId: orderId, method: 'card' })
  if (!payment || !payment.reference) throw AppError.notFound('payment_not_found', `Card payment ${paymentId} of this order was not found.`)
  if (opts.pending && payment.status !== 'pending') {
    throw AppError.conflict('payment_not_pending', `This card payment is ${payment.status}, no longer waiting for a card.`)
  }
  return payment as Payment & { reference: string }
}

/** The order a provider's event names in its metadata, or null when it names none. */
function orderOfEvent(event: ProviderEvent): number | null {
  const orderId = Number((event.data.object as { metadata?: Record<string, string> }).metadata?.salesOrderId)
  return Number.isSafeInteger(orderId) && orderId > 0 ? orderId : null
}

/**
 * Confirms a pending card deposit with the token the provider gave for the card entered on its side. No
 * database lock is held while the provider answers; the payment is settled by the provider's event.
 */
export async function confirmCardDeposit(ds: DataSource, pay: PayProvider, orderId: number, paymentId: number, cardToken: string): Promise<CardDepositView> {
  const payment = await cardPayment(ds, orderId, paymentId, { pending: true })
  const intent = await pay.confirmIntent(payment.reference, cardToken, `lumenyard-confirm-${payment.id}-${cardToken}`)
  return view(pay, payment, intent.status)
}

/** A pending card payment as the provider sees it: the customer still at the page, declined, cancelled or paid. */
function pendingStage(intent: { status: string; last_payment_error?: unknown }): CardDepositStage {
  if (intent.status === 'succeeded') return 'settling'
  if (intent.status === 'canceled') return 'cancelled'
  return intent.last_payment_error ? 'declined' : 'waiting'
}

const SETTLED_STAGES: Record<string, CardDepositStage> = { settled: 'paid', refunded: 'refunded', failed: 'cancelled' }

/**
 * Where one card deposit stands, for the counter to follow: the row's own status once the provider's event
 * has settled or closed it, else the provider's word on its payment intent (read through the SDK, no lock held).
 */
export async function cardDepositState(ds: DataSource, pay: PayProvider, orderId: number, paymentId: number): Promise<CardDepositState> {
  const order = await ds.getRepository(SalesOrder).findOneBy({ id: orderId })
  if (!order) throw AppError.notFound('sales_order_not_found', 'That sales order was not found.')
  const payment = await cardPayment(ds, orderId, paymentId)
  const stage = payment.status === 'pending' ? pendingStage(await pay.retrieveIntent(payment.reference)) : SETTLED_STAGES[payment.status] ?? 'cancelled'
  const owed = subtractMoney(order.depositRequired, order.depositPaid)
  return {
    paymentId: payment.id, salesOrderId: orderId, amount: payment.amount, stage, intentId: payment.reference,
    payPageUrl: stage === 'waiting' || stage === 'declined' ? pay.customerPageUrl(payment.reference) : null,
    depositPaid: roundMoney(order.depositPaid), depositDue: compareMoney(owed, '0') > 0 ? roundMoney(owed) : '0.00',
  }
}

/**
 * The clerk cancels a card deposit still waiting (the customer walked away, or will pay another way): the
 * provider cancels its payment intent first, so the card can no longer be taken on its page, then the row is
 * closed as failed under the order's lock. A payment that is no longer waiting is refused and left alone; an
 * intent the customer paid meanwhile is refused by the provider and settles by its event as usual.
 */
export async function cancelCardDeposit(ds: DataSource, pay: PayProvider, actor: AuditActor, orderId: number, paymentId: number): Promise<CardDepositState> {
  const payment = await cardPayment(ds, orderId, paymentId, { pending: true })
  const intent = await pay.retrieveIntent(payment.reference)
  if (intent.status === 'succeeded') throw AppError.conflict('payment_not_pending', 'The customer has just paid this card payment.')
  if (intent.status !== 'canceled') await pay.cancelIntent(payment.reference, `lumenyard-cancel-${payment.id}`)
  await inTransaction(ds, async (em) => {
    await lockSalesOrder(em, orderId)
    const res = await em.update(Payment, { id: payment.id, status: 'pending' }, { status: 'failed' })
    if (res.affected) await audit(em, actor, 'payment.card_cancel', 'sales_order', orderId, { paymentId: payment.id, amount: payment.amount, intent: payment.reference, by: 'counter' })
  })
  return cardDepositState(ds, pay, orderId, paymentId)
}

const SYSTEM: AuditActor = { userId: null }

/**
 * The provider's `payment_intent.succeeded` event: settles the pending card payment it names, once. A card
 * confirmed on the provider's side after its order was cancelled (the clerk cancelled while the customer was
 * still paying) is refunded in full at once through the provider, keyed by the payment intent so a retried
 * transaction repeats the same refund, and recorded as a refunded payment; a replayed event finds its
 * payment_events row first (paymentEvents.ts) and changes nothing.
 */
export function cardSettlement(pay: PayProvider) {
  return async function settleCardPaymentIn(em: EntityManager, event: ProviderEvent): Promise<string> {
    const intent = event.data.object as unknown as { id: string; amount_received: number; currency: string }
    const orderId = orderOfEvent(event)
    if (orderId === null) return 'no_order'
    let order
    try {
      order = await lockSalesOrder(em, orderId)
    } catch (err) {
      if (err instanceof AppError && err.status === 404) return 'no_order'
      throw err
    }
    const amount = fromMinorUnits(intent.amount_received, intent.currency)
    const payment = await em.findOne(Payment, { where: { salesOrderId: orderId, method: 'card', reference: intent.id }, lock: { mode: 'pessimistic_write' } })
    if (payment && payment.status !== 'pending' && payment.status !== 'failed') return 'already_recorded'
    if (order.status === 'cancelled') return refundLateCard(em, pay, event, order.id, order.number, payment, intent.id, amount)
    if (payment?.status === 'failed') return 'already_recorded'
    if (!payment) {
      try {
        await recordPaymentIn(em, SYSTEM, orderId, { method: 'card', amount, reference: intent.id, status: 'settled', providerEventId: event.id })
        return 'settled'
      } catch (err) {
        if (err instanceof AppError) return err.code.slice(0, 40)
        throw err
      }
    }
    await em.update(Payment, { id: payment.id }, { status: 'settled', amount, providerEventId: event.id })
    const paid = await refreshPaid(em, orderId)
    await audit(em, SYSTEM, 'payment.record', 'sales_order', orderId, { number: order.number, paymentId: payment.id, method: 'card', amount, reference: intent.id, paid, event: event.id })
    return 'settled'
  }
}

/** A card paid after its order was cancelled: all of it goes back through the provider; the row says so. */
async function refundLateCard(
  em: EntityManager, pay: PayProvider, event: ProviderEvent, orderId: number, number: string | null,
  payment: Payment | null, intentId: string, amount: string,
): Promise<string> {
  if (compareMoney(amount, '0') <= 0) return 'order_cancelled'
  const refund = await pay.refund({
    intentId,
    amountMinor: toMinorUnits(amount, pay.currency),
    idempotencyKey: `lumenyard-late-refund-${intentId}`,
    metadata: { salesOrderId: String(orderId), reason: 'order_cancelled' },
  })
  const fields = { amount, status: 'refunded' as const, refundedAmount: amount, providerEventId: event.id }
  const row = payment
    ? (await em.update(Payment, { id: payment.id }, fields), payment.id)
    : (await em.save(em.create(Payment, { salesOrderId: orderId, method: 'card', reference: intentId, recordedBy: null, ...fields }))).id
  await refreshPaid(em, orderId)
  await audit(em, SYSTEM, 'payment.refund', 'sales_order', orderId, { number, paymentId: row, amount, refund: refund.id, event: event.id, late: true })
  return 'refunded_late'
}

/**
 * On cancellation (inside its transaction, the order locked): every settled card payment is refunded in full
 * through the provider, keyed by the payment and what was refunded before, so a retried transaction repeats
 * the same refund instead of making a second; pending card payments are closed as failed.
 */
export async function refundCardPaymentsIn(em: EntityManager, pay: PayProvider, actor: AuditActor, orderId: number): Promise<string> {
  const payments = await em.find(Payment, { where: { salesOrderId: orderId, method: 'card' }, lock: { mode: 'pessimistic_write' } })
  let refunded = '0.00'
  for (const p of payments) {
    if (p.status === 'pending') {
      await em.update(Payment, { id: p.id }, { status: 'failed' })
      continue
    }
    if (p.status !== 'settled' || !p.reference) continue
    const left = subtractMoney(p.amount, p.refundedAmount)
    if (compareMoney(left, '0') <= 0) continue
    const refund = await pay.refund({
      intentId: p.reference,
      amountMinor: toMinorUnits(left, pay.currency),
      idempotencyKey: `lumenyard-refund-${p.id}-${p.refundedAmount}`,
      metadata: { salesOrderId: String(orderId), paymentId: String(p.id) },
    })
    await em.update(Payment, { id: p.id }, { refundedAmount: p.amount, status: 'refunded' })
    await audit(em, actor, 'payment.refund', 'sales_order', orderId, { paymentId: p.id, amount: left, refund: refund.id })
    refunded = addMoney(refunded, left)
  }
  await refreshPaid(em, orderId)
  return refunded
}

/**
 * The provider's `payment_intent.canceled` event (the customer cancelled on the provider's page): the pending
 * card payment naming it is closed as failed, once, so the counter can start another.
 */
export async function closeCancelledCardIn(em: EntityManager, event: ProviderEvent): Promise<string> {
  const intent = event.data.object as unknown as { id: string }
  const orderId = orderOfEvent(event)
  if (orderId === null) return 'no_order'
  const payment = await em.findOne(Payment, { where: { salesOrderId: orderId, method: 'card', reference: intent.id }, lock: { mode: 'pessimistic_write' } })
  if (!payment || payment.status !== 'pending') return 'already_recorded'
  await em.update(Payment, { id: payment.id }, { status: 'failed', providerEventId: event.id })
  await audit(em, SYSTEM, 'payment.card_cancel', 'sales_order', orderId, { paymentId: payment.id, amount: payment.amount, intent: intent.id, event: event.id })
  return 'cancelled'
}
