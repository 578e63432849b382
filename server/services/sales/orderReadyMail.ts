// Telling the contractor the order is ready: once per time it becomes ready (ready_mailed_at is claimed
// before sending, so two completions at once send one e-mail), through the same SMTP transport as quotes
// and purchase orders (the mail fake here). The SMTP conversation runs after the pick's transaction; every
// attempt lands in outbox_messages (sales_order_id). A failed attempt gives the claim back, so the order
// shows the failure and the clerk's "send again" tries once more; a success
// keeps the claim, so it is never sent twice.
import type { DataSource } from 'typeorm'
import { READY_MAIL_NO_ADDRESS } from '../../../shared/schemas/handover.js'
import type { AppConfig } from '../../config.js'
import { OutboxMessage } from '../../entities/OutboxMessage.js'
import { inTransaction } from '../../db/transaction.js'
import { AppError } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { companyProfile } from '../companyProfile.js'
import { mailTransport } from '../purchasing/poMail.js'
import { HANDOVER_CAUTIONS } from './handoverPdf.js'
import { orderFulfilment } from './handoverRead.js'

type Row = { id: number; number: string; email: string | null; contact_name: string | null; customer_name: string; wh_name: string; job_name: string | null }

/** After a pick list completes: if it made its sales order ready, the contractor is e-mailed (once). */
export async function mailReadyAfterPick(ds: DataSource, config: AppConfig, actor: AuditActor & { userId: number }, pickListId: number): Promise<void> {
  const [list]: { sales_order_id: number | null }[] = await ds.query('SELECT sales_order_id FROM pick_lists WHERE id = ?', [pickListId])
  if (list?.sales_order_id) await mailOrderReady(ds, config, actor, Number(list.sales_order_id))
}

export async function mailOrderReady(ds: DataSource, config: AppConfig, actor: AuditActor & { userId: number }, orderId: number): Promise<boolean> {
  return (await attemptReadyMail(ds, config, actor, orderId)).sent
}

/** One attempt: `claimed` false when the order is not ready or already mailed (nothing sent), else sent or the error. */
async function attemptReadyMail(ds: DataSource, config: AppConfig, actor: AuditActor & { userId: number }, orderId: number): Promise<{ sent: boolean; error?: string }> {
  const claimed: { affectedRows?: number } = await ds.query(
    "UPDATE sales_orders SET ready_mailed_at = NOW() WHERE id = ? AND status = 'ready' AND ready_mailed_at IS NULL",
    [orderId],
  )
  if (!claimed.affectedRows) return { sent: false }
  const [o]: Row[] = await ds.query(
    `SELECT o.id, o.number, c.email, c.contact_name, c.name AS customer_name, w.name AS wh_name, j.name AS job_name
       FROM sales_orders o JOIN customers c ON c.id = o.customer_id JOIN warehouses w ON w.id = o.warehouse_id LEFT JOIN jobs j ON j.id = o.job_id
      WHERE o.id = ?`,
    [orderId],
  )
  const company = await companyProfile(ds)
  const f = await orderFulfilment(ds, orderId)
  const subject = `Your order ${o.number} is ready${company.legalName ? ` at ${company.legalName}` : ''}`
  const text = [
    `Hello ${o.contact_name ?? o.customer_name},`,
    '',
    `Your order ${o.number}${o.job_name ? ` for ${o.job_name}` : ''} is picked and ready at ${o.wh_name}:`,
    ...f.lines.filter((l) => l.waiting > 0).map((l) => `  ${l.sku}  ${l.description}  ${l.waiting}`),
    ...(f.lines.some((l) => l.backordered > 0)
      ? ['', 'Still to come (backordered):', ...f.lines.filter((l) => l.backordered > 0).map((l) => `  ${l.sku}  ${l.description}  ${l.backordered}`)]
      : []),
    '',
    'Bring this e-mail or the order number; someone signs for the goods when they leave.',
    HANDOVER_CAUTIONS,
    '',
    company.legalName,
    [company.phone, company.email].filter(Boolean).join(' · ') || null,
  ].filter((l) => l !== null).join('\n')
  let outcome: { messageId?: string; error?: string }
  if (!o.email) outcome = { error: READY_MAIL_NO_ADDRESS }
  else {
    try {
      const info = await mailTransport(config.smtp).sendMail({ from: config.smtp.from, to: o.email, replyTo: company.replyTo ?? undefined, subject, text })
      outcome = { messageId: info.messageId }
    } catch (err) {
      outcome = { error: err instanceof Error ? err.message : String(err) }
    }
  }
  await inTransaction(ds, async (em) => {
    // A failure gives the claim back: the next attempt may send; a success keeps it.
    if (outcome.error) await em.query('UPDATE sales_orders SET ready_mailed_at = NULL WHERE id = ?', [orderId])
    const row = await em.save(em.create(OutboxMessage, {
      status: outcome.error ? 'failed' : 'sent', sentAt: outcome.error ? null : new Date(), fromAddress: config.smtp.from, toAddress: o.email ?? '',
      cc: null, replyTo: company.replyTo, subject, bodyText: text, error: outcome.error?.slice(0, 500) ?? null, messageId: outcome.messageId ?? null,
      poId: null, quoteId: null, salesOrderId: orderId, createdBy: actor.userId, retryOf: null,
    }))
    await audit(em, actor, outcome.error ? 'sales_order.ready_mail_failed' : 'sales_order.ready_mail', 'sales_order', orderId, { number: o.number, to: o.email, outboxId: row.id, error: outcome.error ?? null })
  })
  return outcome.error ? { sent: false, error: outcome.error } : { sent: true }
}

/**
 * The clerk's "send again": tries the ready e-mail once more. Answers whether this call sent it, and when the
 * order was mailed; a failure is recorded (outbox, audit) and answered as 502 ready_mail_failed.
 */
export async function sendReadyAgain(ds: DataSource, config: AppConfig, actor: AuditActor & { userId: number }, orderId: number): Promise<{ sent: boolean; mailedAt: string | null }> {
  const [o]: { status: string; ready_mailed_at: Date | null }[] = await ds.query('SELECT status, ready_mailed_at FROM sales_orders WHERE id = ?', [orderId])
  if (!o) throw AppError.notFound('sales_order_not_found', 'That sales order was not found.')
  if (o.status !== 'ready') throw AppError.conflict('sales_order_wrong_status', 'Only a ready order is e-mailed as ready.', { params: { orderStatus: o.status } })
  const { sent, error } = await attemptReadyMail(ds, config, actor, orderId)
  if (error !== undefined) {
    throw AppError.of(502, 'ready_mail_failed', `The ready e-mail could not be sent: ${error}`, { params: { detail: error.slice(0, 200) } })
  }
  const [after]: { ready_mailed_at: Date | null }[] = await ds.query('SELECT ready_mailed_at FROM sales_orders WHERE id = ?', [orderId])
  return { sent, mailedAt: after?.ready_mailed_at ? new Date(after.ready_mailed_at).toISOString() : null }
}
