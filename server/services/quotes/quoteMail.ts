// Offering a quote: e-mailed to the contractor with its PDF, through the same SMTP transport as purchase
// orders (the mail fake here); every attempt lands in outbox_messages (quote_id). The SMTP conversation
// runs outside any transaction; only a sent message marks the quote offered.
import type { DataSource } from 'typeorm'
import { formatMoney } from '../../../shared/money.js'
import type { CompanyProfile } from '../../../shared/schemas/purchasing.js'
import type { QuoteDetail, QuoteSendInput } from '../../../shared/schemas/quotes.js'
import type { AppConfig } from '../../config.js'
import { OutboxAttachment, OutboxMessage } from '../../entities/OutboxMessage.js'
import { Quote } from '../../entities/Quote.js'
import { inTransaction } from '../../db/transaction.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { companyLogo, companyProfile } from '../companyProfile.js'
import { mailTransport } from '../purchasing/poMail.js'
import { ensureQuote, lockQuote } from './quoteWrite.js'
import { quoteDetail } from './quoteRead.js'
import { PDF_TYPE, QUOTE_CAUTIONS, quotePdf } from './quotePdf.js'

function bodyText(q: QuoteDetail, company: CompanyProfile, message: string | null): string {
  return [
    `Hello${q.contactName ? ' ' + q.contactName : ''},`,
    '',
    message ?? `Please find our quote ${q.number}${q.jobName ? ` for ${q.jobName}` : ''} attached as a PDF.`,
    '',
    ...q.lines.map((l) => `  ${l.lineNo}. ${l.sku}  ${l.description}  ${l.qty} ${l.stockUnit}  ${formatMoney(l.extension)}`),
    '',
    `Subtotal: ${formatMoney(q.subtotal)}`,
    `Sales tax: ${formatMoney(q.taxAmount)}`,
    `Amount due: ${formatMoney(q.amountDue)}`,
    `Valid until: ${q.validUntil}`,
    '',
    QUOTE_CAUTIONS,
    '',
    company.legalName,
    [company.phone, company.email].filter(Boolean).join(' · ') || null,
  ].filter((l) => l !== null).join('\n')
}

export async function quotePdfFile(ds: DataSource, id: number): Promise<{ name: string; bytes: Buffer }> {
  const quote = await quoteDetail(ds, id)
  return { name: `${quote.number}-r${quote.revision}.pdf`, bytes: await quotePdf(quote, await companyProfile(ds), await companyLogo(ds)) }
}

export async function offerQuote(ds: DataSource, config: AppConfig, actor: AuditActor & { userId: number }, id: number, input: QuoteSendInput): Promise<QuoteDetail> {
  const quote = await quoteDetail(ds, id)
  ensureQuote('offer', quote)
  const company = await companyProfile(ds)
  if (!company.complete) throw AppError.conflict('company_profile_missing', 'Fill in the company profile first: the contractor must see who quotes.')
  const to = input.to ?? quote.customerEmail
  if (!to) throw AppError.badRequest('customer_email_missing', 'This account has no e-mail address: enter one.', { fields: { to: problem('customer_email_missing') } })
  const subject = `Quote ${quote.number}${quote.revision > 1 ? ` revision ${quote.revision}` : ''} from ${company.legalName}`
  const text = bodyText(quote, company, input.message)
  const file = { name: `${quote.number}-r${quote.revision}.pdf`, bytes: await quotePdf(quote, company, await companyLogo(ds)) }
  let outcome: { messageId?: string; error?: string }
  try {
    const info = await mailTransport(config.smtp).sendMail({
      from: config.smtp.from, to, replyTo: company.replyTo ?? undefined, subject, text,
      attachments: [{ filename: file.name, content: file.bytes, contentType: PDF_TYPE }],
    })
    outcome = { messageId: info.messageId }
  } catch (err) {
    outcome = { error: err instanceof Error ? err.message : String(err) }
  }
  await inTransaction(ds, async (em) => {
    const row = await em.save(em.create(OutboxMessage, {
      status: outcome.error ? 'failed' : 'sent', sentAt: outcome.error ? null : new Date(), fromAddress: config.smtp.from, toAddress: to,
      cc: null, replyTo: company.replyTo, subject, bodyText: text, error: outcome.error?.slice(0, 500) ?? null, messageId: outcome.messageId ?? null,
      poId: null, quoteId: id, createdBy: actor.userId, retryOf: null,
    }))
    await em.insert(OutboxAttachment, { messageId: row.id, name: file.name, contentType: PDF_TYPE, bytes: file.bytes })
    const locked = await lockQuote(em, id)
    if (outcome.error) {
      await audit(em, actor, 'quote.offer_failed', 'quote', id, { to, error: outcome.error })
      return
    }
    // A quote changed meanwhile (taken, lost) keeps its status; the message is recorded either way.
    if (locked.status === 'draft' || locked.status === 'offered') await em.update(Quote, { id }, { status: 'offered', offeredAt: new Date() })
    await audit(em, actor, 'quote.offered', 'quote', id, { number: quote.number, revision: quote.revision, to, outboxId: row.id })
  })
  if (outcome.error) {
    throw new AppError(502, 'quote_mail_failed', `The e-mail could not be sent (${outcome.error}).`, { params: { detail: outcome.error } })
  }
  return quoteDetail(ds, id)
}
