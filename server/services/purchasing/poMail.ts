// E-mailing a purchase order to its vendor with the order's sheet attached, through nodemailer's
// SMTP transport (config.smtp). Every attempt lands in outbox_messages, sent or failed, so the admin
// outbox works whatever server took the mail. The SMTP conversation runs outside any transaction.
import nodemailer from 'nodemailer'
import type { DataSource } from 'typeorm'
import type { AppConfig } from '../../config.js'
import type { PoSendInput } from '../../../shared/schemas/purchasing.js'
import type { PoDetail } from '../../../shared/schemas/purchasingViews.js'
import { canDo } from '../../../shared/purchasing/poStatus.js'
import { formatMoney } from '../../../shared/money.js'
import { OutboxAttachment, OutboxMessage } from '../../entities/OutboxMessage.js'
import { PurchaseOrder } from '../../entities/PurchaseOrder.js'
import { inTransaction } from '../../db/transaction.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { lockPo } from './poLifecycle.js'
import { poDetail } from './poRead.js'
import { ensureDepositsPaid } from '../sales/salesDeposits.js'
import { XLSX_TYPE } from '../exports/xlsxWriter.js'
import { poWorkbook } from './poSpreadsheet.js'
import { poPaper, type PoPaper } from './poDocument.js'
import { PDF_TYPE, poPdf } from './poPdf.js'

export function mailTransport(smtp: AppConfig['smtp']) {
  return nodemailer.createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: smtp.secure,
    // Not secure means plain SMTP to a local relay or the mail fake: never try STARTTLS there.
    ignoreTLS: !smtp.secure,
    auth: smtp.user ? { user: smtp.user, pass: smtp.password ?? '' } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  })
}

function bodyText(paper: PoPaper, message: string | null): string {
  const { po, company } = paper
  const lines = paper.lines.flatMap((l) => [
    `  ${l.lineNo}. ${l.vendorSku ?? l.sku}  ${l.description}  ${l.packsOrdered} × ${l.packQty} = ${l.qtyOrdered} ${l.stockUnit}`,
    ...(l.specification ? [`     Specification: ${l.specification}`] : []),
  ])
  const indent = (text: string) => text.split('\n').join('\n  ')
  return [
    `Hello${po.vendor.contactName ? ' ' + po.vendor.contactName : ''},`,
    '',
    message ?? `Please find our purchase order ${po.number} attached, as a PDF and as a spreadsheet.`,
    '',
    `Order: ${po.number}`,
    po.expectedDate ? `Wanted by: ${po.expectedDate}` : null,
    `Bill to:\n  ${indent(paper.billTo)}`,
    `Ship to:\n  ${indent(paper.shipTo)}`,
    po.job ? `For job: ${po.job.name}` : null,
    '',
    ...lines,
    '',
    po.orderTotal !== undefined ? `Total: ${formatMoney(po.orderTotal, { symbol: po.currency + ' ' })}` : null,
    '',
    `Please confirm the order and the ship date by reply${paper.replyTo ? ` to ${paper.replyTo}` : ''}.`,
    '',
    paper.buyer?.name ?? null,
    company.legalName,
    [company.phone, company.email].filter(Boolean).join(' · ') || null,
  ]
    .filter((l) => l !== null)
    .join('\n')
}

interface MailFile {
  name: string
  type: string
  bytes: Buffer
}

interface Attempt {
  poId: number
  to: string
  cc: string[]
  subject: string
  text: string
  replyTo: string | null
  files: MailFile[]
  retryOf?: number
}

/** What goes to the vendor with the message: the order as a printable PDF and as a spreadsheet. */
async function poFiles(paper: PoPaper): Promise<MailFile[]> {
  return [
    { name: `${paper.po.number}.pdf`, type: PDF_TYPE, bytes: await poPdf(paper) },
    { name: `${paper.po.number}.xlsx`, type: XLSX_TYPE, bytes: await poWorkbook(paper) },
  ]
}

async function record(ds: DataSource, actor: AuditActor, from: string, a: Attempt, outcome: { messageId?: string; error?: string }) {
  return inTransaction(ds, async (em) => {
    const row = em.create(OutboxMessage, {
      status: outcome.error ? 'failed' : 'sent', sentAt: outcome.error ? null : new Date(), fromAddress: from, toAddress: a.to,
      cc: a.cc.length ? a.cc.join(', ') : null, replyTo: a.replyTo, subject: a.subject, bodyText: a.text, error: outcome.error?.slice(0, 500) ?? null,
      messageId: outcome.messageId ?? null, poId: a.poId, createdBy: actor.userId, retryOf: a.retryOf ?? null,
    })
    await em.save(row)
    for (const f of a.files) await em.insert(OutboxAttachment, { messageId: row.id, name: f.name, contentType: f.type, bytes: f.bytes })
    const po = await lockPo(em, a.poId)
    if (outcome.error) {
      await em.update(PurchaseOrder, { id: po.id }, { sendError: outcome.error.slice(0, 500) })
      await audit(em, actor, 'po.send_failed', 'purchase_order', po.id, { to: a.to, error: outcome.error })
    } else {
      const stamp = po.status === 'approved' ? { status: 'sent' as const, sentBy: actor.userId, sentAt: new Date() } : {}
      await em.update(PurchaseOrder, { id: po.id }, { ...stamp, sendError: null })
      await audit(em, actor, 'po.sent', 'purchase_order', po.id, { number: po.number, from: po.status, to: a.to, outboxId: row.id })
    }
    return row.id
  })
}

/** One SMTP attempt, recorded sent or failed; a failure leaves the PO unsent and answers 502. */
async function attempt(ds: DataSource, config: AppConfig, actor: AuditActor, a: Attempt) {
  try {
    const info = await mailTransport(config.smtp).sendMail({
      from: config.smtp.from, to: a.to, cc: a.cc, replyTo: a.replyTo ?? undefined, subject: a.subject, text: a.text,
      attachments: a.files.map((f) => ({ filename: f.name, content: f.bytes, contentType: f.type })),
    })
    const outboxId = await record(ds, actor, config.smtp.from, a, { messageId: info.messageId })
    return { outboxId, status: 'sent' as const, po: await poDetail(ds, a.poId) }
  } catch (err) {
    if (err instanceof AppError) throw err
    const error = err instanceof Error ? err.message : String(err)
    await record(ds, actor, config.smtp.from, a, { error })
    throw new AppError(502, 'mail_failed', `The e-mail could not be sent (${error}). The order stays unsent; check the address or the mail server and send again.`, { params: { detail: error } })
  }
}

function ensureSendable(po: PoDetail): void {
  if (!canDo('send', po.status) && !canDo('resend', po.status)) {
    throw AppError.conflict('po_not_sendable', `A ${po.status.replace('_', ' ')} purchase order cannot be e-mailed; approve it first.`, { params: { poStatus: po.status } })
  }
}

/**
 * Sends (or sends again) the order to the vendor, saying who orders: refused until the company profile is filled in.
 * `costs`: whether the sender may see costs; the attached PDF and sheet carry prices only then.
 */
export async function sendPurchaseOrder(ds: DataSource, config: AppConfig, actor: AuditActor, poId: number, input: PoSendInput, costs: boolean) {
  const paper = await poPaper(ds, poId, costs, actor.userId)
  const { po } = paper
  ensureSendable(po)
  if (po.status === 'approved') await ensureDepositsPaid(ds, poId)
  if (!paper.company.complete) {
    throw AppError.conflict('company_profile_missing', 'Fill in the company profile (Admin → Company profile) first: a vendor must see who orders and where to bill.')
  }
  const to = input.to ?? po.vendor.email
  if (!to) throw AppError.badRequest('vendor_email_missing', 'This vendor has no e-mail address: enter one.', { fields: { to: problem('required') } })
  return attempt(ds, config, actor, {
    poId, to, cc: input.cc, replyTo: paper.replyTo, subject: `Purchase order ${po.number} from ${paper.company.legalName}`,
    text: bodyText(paper, input.message), files: await poFiles(paper),
  })
}

/** Messages being sent again right now: a second click while the first is with the mail server is refused. */
const inFlight = new Set<number>()

/**
 * Sends a failed message again exactly as it was (same address, text and attachments), once: the outbox's
 * retry_of key holds even across processes, and a click repeated while the first is out is refused.
 */
export async function sendAgain(ds: DataSource, config: AppConfig, actor: AuditActor, messageId: number) {
  const message = await ds.getRepository(OutboxMessage).findOneBy({ id: messageId })
  if (!message) throw AppError.notFound('message_not_found', 'That message was not found.')
  if (message.status !== 'failed') throw AppError.conflict('message_was_sent', 'That message was sent; there is nothing to send again.')
  if (!message.poId) throw AppError.conflict('message_without_order', 'That message belongs to no purchase order.')
  const [again] = await ds.query('SELECT id FROM outbox_messages WHERE retry_of = ?', [messageId])
  if (again || inFlight.has(messageId)) throw AppError.conflict('already_sent_again', 'That message was already sent again; see the newer attempt.')
  inFlight.add(messageId)
  try {
    ensureSendable(await poDetail(ds, message.poId))
    const files: { name: string; content_type: string; bytes: Buffer }[] = await ds.query(
      'SELECT name, content_type, bytes FROM outbox_attachments WHERE message_id = ? ORDER BY id', [messageId])
    return await attempt(ds, config, actor, {
      poId: message.poId, to: message.toAddress, cc: message.cc ? message.cc.split(', ') : [], replyTo: message.replyTo, subject: message.subject, text: message.bodyText,
      files: files.map((f) => ({ name: f.name, type: f.content_type, bytes: f.bytes })), retryOf: messageId,
    })
  } finally {
    inFlight.delete(messageId)
  }
}
