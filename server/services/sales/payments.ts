// Payments against a sales order. Cash and cheque are recorded by hand at the counter (settled at once);
// card rows come from the payment provider (pending until it confirms). The order's deposit_paid is
// always Σ (amount − refunded) of its settled and refunded payments, rewritten in the same transaction as
// the payment row, under the order's lock.
import type { DataSource, EntityManager } from 'typeorm'
import { compareMoney, parseMoney } from '../../../shared/money.js'
import { balanceDue } from '../../../shared/sales/salesOrderMoney.js'
import type { PaymentMethod, PaymentStatus } from '../../../shared/sales/salesOrderTerms.js'
import { Payment, SalesOrder } from '../../entities/SalesOrder.js'
import { inTransaction } from '../../db/transaction.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { lockSalesOrder } from './salesOrderWrite.js'

export interface PaymentInput {
  method: PaymentMethod
  /** Decimal text, e.g. '380.38'. */
  amount: string
  /** The cheque number, or the provider's payment id. */
  reference?: string | null
  /** Hand payments are settled when recorded; a provider's may start pending. */
  status?: PaymentStatus
  /** The provider's event id: a second event with the same id records nothing. */
  providerEventId?: string | null
}

/** Sets the order's deposit_paid from its payments (call under the order's lock, after changing a payment). */
export async function refreshPaid(em: EntityManager, orderId: number): Promise<string> {
  const [row]: { paid: string | null }[] = await em.query(
    `SELECT SUM(amount - refunded_amount) AS paid FROM payments WHERE sales_order_id = ? AND status IN ('settled', 'refunded')`,
    [orderId],
  )
  const paid = parseMoney(String(row?.paid ?? '0'))
  await em.update(SalesOrder, { id: orderId }, { depositPaid: paid })
  return paid
}

/** Records a payment in the caller's transaction (the order locked first); answers the payment row. */
export async function recordPaymentIn(em: EntityManager, actor: AuditActor, orderId: number, input: PaymentInput): Promise<Payment> {
  const order = await lockSalesOrder(em, orderId)
  if (input.providerEventId) {
    const seen = await em.findOne(Payment, { where: { providerEventId: input.providerEventId }, lock: { mode: 'pessimistic_write' } })
    if (seen) return seen
  }
  if (order.status === 'cancelled') {
    throw AppError.conflict('sales_order_wrong_status', 'A cancelled sales order takes no payment.', { params: { orderStatus: order.status } })
  }
  const amount = parseMoney(input.amount)
  if (compareMoney(amount, '0') <= 0) throw AppError.badRequest('at_least', 'A payment is above zero.', { params: { min: 0.01 }, fields: { amount: problem('at_least', { min: 0.01 }) } })
  const due = balanceDue(order.total, order.depositPaid)
  if (compareMoney(amount, due) > 0) {
    throw AppError.conflict('payment_over_balance', `Only ${due} is still owed on ${order.number}.`, { params: { due }, fields: { amount: problem('payment_over_balance', { due }) } })
  }
  const payment = await em.save(em.create(Payment, {
    salesOrderId: orderId, method: input.method, amount, status: input.status ?? 'settled', reference: input.reference ?? null,
    providerEventId: input.providerEventId ?? null, recordedBy: actor.userId, refundedAmount: '0.00',
  }))
  const paid = await refreshPaid(em, orderId)
  await audit(em, actor, 'payment.record', 'sales_order', orderId, { number: order.number, paymentId: payment.id, method: input.method, amount, reference: payment.reference, paid })
  return payment
}

/** Records a payment against an order and updates its deposit_paid, in one transaction. */
export async function recordPayment(ds: DataSource, actor: AuditActor, orderId: number, input: PaymentInput): Promise<Payment> {
  return inTransaction(ds, (em) => recordPaymentIn(em, actor, orderId, input))
}
