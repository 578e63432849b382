// Writing quotes: a new quote from a saved bill (any revision: its lines and quantities) or from lines by
// hand, priced through the account's selling terms (priceLines); a draft changed as a whole; a new revision
// from an offered, lapsed or lost quote (the old one kept, marked replaced); a quote lost with its reason.
import { In, type DataSource, type EntityManager } from 'typeorm'
import { canQuote, quoteStatusOn, type QuoteAction } from '../../../shared/sales/quoteStatus.js'
import type { QuoteCreateInput, QuoteDetail, QuoteLineInput, QuoteUpdateInput } from '../../../shared/schemas/quotes.js'
import { Bom, BomLine } from '../../entities/Bom.js'
import { Job } from '../../entities/Customer.js'
import { Item } from '../../entities/Item.js'
import { Quote, QuoteLine } from '../../entities/Quote.js'
import { addDays } from '../../../shared/reports/zonedDays.js'
import { noChargeRefusals } from '../../../shared/pricing/noCharge.js'
import type { PriceExplanation } from '../../../shared/pricing/sellingPrice.js'
import { Decimal } from 'decimal.js'
import type { Role } from '../../../shared/roles.js'
import { inTransaction } from '../../db/transaction.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { lockAtVersion } from '../editVersion.js'
import { priceLines, todayIso } from '../pricing/priceEstimate.js'
import { quoteDetail } from './quoteRead.js'

/** How long a quote holds when the clerk gives no date (common practice: 30 days). */
export const DEFAULT_VALID_DAYS = 30

/** The signed-in pricer: the name signed on an own price, and the roles that decide what they may set. */
type Actor = AuditActor & { userId: number; name: string; roles: readonly Role[] }

/** Locks the quote for a change; with `seenVersion` (what the screen loaded), a save made meanwhile is refused. */
export function lockQuote(em: EntityManager, id: number, seenVersion?: number): Promise<Quote> {
  return lockAtVersion(em, Quote, id, seenVersion, {
    notFound: () => AppError.notFound('quote_not_found', 'That quote was not found.'),
    name: (quote) => quote.number ?? `#${quote.id}`,
  })
}

/** Refuses an action the quote's status (as a reader sees it today) does not allow. */
export function ensureQuote(action: QuoteAction, quote: Pick<Quote, 'status' | 'validUntil'>): void {
  const status = quoteStatusOn(quote.status, quote.validUntil, todayIso())
  if (!canQuote(action, status)) {
    throw AppError.conflict('quote_wrong_status', `A quote that is ${status} cannot be changed that way (${action}).`, { params: { quoteStatus: status } })
  }
}

/** An own price the quote already carries, per item: a line that repeats it keeps it as it stands, its author too. */
interface StandingPrice {
  unitPrice: string
  reason: string | null
  by: string
}
type Standing = ReadonlyMap<number, StandingPrice>

function standingPrices(lines: readonly QuoteLine[]): Map<number, StandingPrice> {
  return new Map(lines.flatMap((l) => (l.overridePrice === null ? [] : [[l.itemId, {
    unitPrice: l.overridePrice,
    reason: l.overrideReason,
    by: (JSON.parse(l.explanationJson) as PriceExplanation).overrideBy ?? '',
  }] as const])))
}

/** The standing own price a line repeats (same price, same reason), if any. */
function repeated(line: QuoteLineInput, standing: Standing): StandingPrice | undefined {
  const was = standing.get(line.itemId)
  if (!was || line.unitPrice === null) return undefined
  return new Decimal(was.unitPrice).equals(line.unitPrice) && (was.reason ?? '') === (line.overrideReason ?? '') ? was : undefined
}

/**
 * A line at no charge is an admin's call (shared/pricing/noCharge.ts): anyone else is refused beside that line's
 * price. A line repeating a no-charge price the quote already carries (an admin set it) stays when a clerk changes
 * other lines or revises the quote.
 */
function ensureNoChargeAllowed(lines: readonly QuoteLineInput[], roles: readonly Role[], standing: Standing): void {
  const refused = noChargeRefusals(lines, roles).filter((i) => !repeated(lines[i], standing))
  if (!refused.length) return
  throw AppError.of(403, 'no_charge_admin_only', 'Only an admin sets a line at no charge.', {
    fields: Object.fromEntries(refused.map((i) => [`lines.${i}.unitPrice`, problem('no_charge_admin_only')])),
  })
}

/** Prices the lines and writes them and the quote's totals (replacing any lines it had). */
async function writePricedLines(em: EntityManager, actor: Actor, quote: Quote, lines: readonly QuoteLineInput[], standing: Standing = new Map()): Promise<void> {
  const { name, roles } = actor
  ensureNoChargeAllowed(lines, roles, standing)
  // An own price signs with who set it: its first author while it stands unchanged, else whoever writes it now.
  const by = (l: QuoteLineInput) => repeated(l, standing)?.by || name
  const priced = await priceLines(em, {
    customerId: quote.customerId,
    warehouseId: quote.warehouseId,
    onDay: quote.quotedOn,
    lines: lines.map((l) => ({ itemId: l.itemId, qty: l.qty, override: l.unitPrice !== null ? { unitPrice: l.unitPrice, reason: l.overrideReason ?? '', by: by(l) } : null })),
  })
  const items = new Map((await em.findBy(Item, { id: In([...new Set(lines.map((l) => l.itemId))]) })).map((i) => [i.id, i]))
  await em.delete(QuoteLine, { quoteId: quote.id })
  await em.insert(
    QuoteLine,
    priced.lines.map((p, i) => ({
      quoteId: quote.id,
      lineNo: i + 1,
      itemId: p.itemId,
      bomLineId: lines[i].bomLineId,
      description: p.name,
      askedQty: p.askedQty,
      qty: p.qty,
      packs: p.packs,
      packSize: p.packSize,
      unitPrice: p.unitPrice,
      packPrice: p.packPrice,
      extension: p.extension,
      priceSource: p.explanation.source,
      explanationJson: JSON.stringify(p.explanation),
      overridePrice: lines[i].unitPrice,
      overrideReason: lines[i].unitPrice !== null ? lines[i].overrideReason : null,
      madeToOrder: items.get(p.itemId)?.madeToOrder ?? false,
    })),
  )
  await em.update(Quote, { id: quote.id }, {
    priceLevelCode: priced.priceLevelCode,
    subtotal: priced.subtotal,
    taxRate: priced.tax.ratePercent,
    taxAmount: priced.tax.tax,
    taxJson: JSON.stringify(priced.tax),
    amountDue: priced.amountDue,
  })
}

/** The bill's lines with a catalog item, in its order, as quote lines (any revision of the bill). */
async function billLines(em: EntityManager, bomId: number): Promise<{ bom: Bom; job: Job; lines: QuoteLineInput[] }> {
  const bom = await em.findOneBy(Bom, { id: bomId })
  if (!bom) throw AppError.badRequest('bill_not_found', 'That bill of materials was not found.', { fields: { bomId: problem('bill_not_found') } })
  const job = await em.findOneByOrFail(Job, { id: bom.jobId })
  const rows = await em.find(BomLine, { where: { bomId }, order: { lineNo: 'ASC' } })
  const lines = rows
    .filter((r) => r.itemId !== null && r.qty > 0)
    .map((r) => ({ itemId: r.itemId!, qty: r.qty, unitPrice: null, overrideReason: null, bomLineId: r.id }))
  return { bom, job, lines }
}

export async function createQuote(ds: DataSource, actor: Actor, input: QuoteCreateInput): Promise<QuoteDetail> {
  const id = await inTransaction(ds, async (em) => {
    let { customerId, jobId } = input
    let lines = input.lines
    if (input.bomId !== null) {
      const bill = await billLines(em, input.bomId)
      jobId = bill.job.id
      customerId = bill.job.customerId
      if (lines.length === 0) lines = bill.lines
    } else if (jobId !== null) {
      const job = await em.findOneBy(Job, { id: jobId })
      if (!job) throw AppError.badRequest('job_not_found', 'That job was not found.', { fields: { jobId: problem('job_not_found') } })
      customerId = job.customerId
    }
    if (customerId === null) throw AppError.badRequest('customer_not_found', 'Choose an account.', { fields: { customerId: problem('required') } })
    const quotedOn = todayIso()
    const quote = await em.save(em.create(Quote, {
      customerId,
      jobId,
      bomId: input.bomId,
      warehouseId: input.warehouseId,
      quotedOn,
      validUntil: input.validUntil ?? addDays(quotedOn, DEFAULT_VALID_DAYS),
      terms: input.terms,
      notes: input.notes,
      status: 'draft',
      revision: 1,
      createdBy: actor.userId,
    }))
    quote.number = `Q-${quotedOn.slice(0, 4)}-${String(quote.id).padStart(5, '0')}`
    await em.update(Quote, { id: quote.id }, { number: quote.number })
    await writePricedLines(em, actor, quote, lines)
    await audit(em, actor, 'quote.create', 'quote', quote.id, { number: quote.number, bomId: input.bomId, lines: lines.length })
    return quote.id
  })
  return quoteDetail(ds, id)
}

export async function updateQuote(ds: DataSource, actor: Actor, id: number, input: QuoteUpdateInput): Promise<QuoteDetail> {
  await inTransaction(ds, async (em) => {
    const quote = await lockQuote(em, id, input.version)
    ensureQuote('edit', quote)
    const next = { warehouseId: input.warehouseId, validUntil: input.validUntil ?? quote.validUntil, terms: input.terms, notes: input.notes }
    const standing = standingPrices(await em.findBy(QuoteLine, { quoteId: id }))
    await em.update(Quote, { id }, next)
    await writePricedLines(em, actor, { ...quote, ...next }, input.lines, standing)
    await audit(em, actor, 'quote.update', 'quote', id, { number: quote.number, lines: input.lines.length })
  })
  return quoteDetail(ds, id)
}

/** A new draft revision with the same lines (priced again today); the old revision is kept, marked replaced. */
export async function reviseQuote(ds: DataSource, actor: Actor, id: number): Promise<QuoteDetail> {
  const newId = await inTransaction(ds, async (em) => {
    const old = await lockQuote(em, id)
    ensureQuote('revise', old)
    const oldLines = await em.find(QuoteLine, { where: { quoteId: id }, order: { lineNo: 'ASC' } })
    const quotedOn = todayIso()
    const { id: _old, createdAt: _c, updatedAt: _u, version: _v, ...copy } = old
    const quote = await em.save(em.create(Quote, {
      ...copy,
      revision: old.revision + 1,
      status: 'draft',
      quotedOn,
      validUntil: addDays(quotedOn, DEFAULT_VALID_DAYS),
      lostReason: null,
      offeredAt: null,
      takenAt: null,
      createdBy: actor.userId,
    }))
    await em.update(Quote, { id }, { status: 'replaced' })
    // The revision carries the old one's lines as they were: own prices with their authors, a line at no charge an admin set included.
    await writePricedLines(em, actor, quote, oldLines.map((l) => ({
      itemId: l.itemId, qty: l.askedQty, bomLineId: l.bomLineId, unitPrice: l.overridePrice, overrideReason: l.overrideReason,
    })), standingPrices(oldLines))
    await audit(em, actor, 'quote.revise', 'quote', quote.id, { number: old.number, from: old.revision, to: quote.revision })
    return quote.id
  })
  return quoteDetail(ds, newId)
}

export async function loseQuote(ds: DataSource, actor: Actor, id: number, reason: string): Promise<QuoteDetail> {
  await inTransaction(ds, async (em) => {
    const quote = await lockQuote(em, id)
    ensureQuote('lose', quote)
    await em.update(Quote, { id }, { status: 'lost', lostReason: reason })
    await audit(em, actor, 'quote.lost', 'quote', id, { number: quote.number, reason })
  })
  return quoteDetail(ds, id)
}
