// Reading quotes: the list (open ones by default) and one quote with its lines and every revision of its
// number. A draft or offered quote past its validity date reads as lapsed.
import { SqlWhere } from '../../db/sqlWhere.js'
import type { DataSource, EntityManager } from 'typeorm'
import { quoteStatusOn, type QuoteStatus } from '../../../shared/sales/quoteStatus.js'
import type { DocumentTax } from '../../../shared/pricing/salesTax.js'
import type { NewestPage } from '../../../shared/schemas/newestPage.js'
import type { QuoteDetail, QuoteLineView, QuoteSummary } from '../../../shared/schemas/quotes.js'
import { MoneyDecimal } from '../../../shared/money.js'
import { AppError } from '../../errors.js'
import { todayIso } from '../pricing/priceEstimate.js'
import { containsPattern } from '../../db/likePattern.js'

type Row = Record<string, string | number | null | Date>

const SUMMARY_SQL = `SELECT q.id, q.number, q.revision, q.status, q.customer_id AS customerId, c.name AS customerName,
    q.job_id AS jobId, j.name AS jobName, q.bom_id AS bomId, b.revision AS bomRevision, q.warehouse_id AS warehouseId,
    w.code AS warehouseCode, DATE_FORMAT(q.quoted_on, '%Y-%m-%d') AS quotedOn, DATE_FORMAT(q.valid_until, '%Y-%m-%d') AS validUntil,
    q.subtotal, q.tax_amount AS taxAmount, q.amount_due AS amountDue, q.created_at AS createdAt
  FROM quotes q JOIN customers c ON c.id = q.customer_id JOIN warehouses w ON w.id = q.warehouse_id
  LEFT JOIN jobs j ON j.id = q.job_id LEFT JOIN boms b ON b.id = q.bom_id`

function toSummary(r: Row, today: string): QuoteSummary {
  const validUntil = String(r.validUntil)
  return {
    id: Number(r.id),
    number: String(r.number),
    revision: Number(r.revision),
    status: quoteStatusOn(r.status as QuoteStatus, validUntil, today),
    customerId: Number(r.customerId),
    customerName: String(r.customerName),
    jobId: r.jobId === null ? null : Number(r.jobId),
    jobName: r.jobName === null ? null : String(r.jobName),
    bomId: r.bomId === null ? null : Number(r.bomId),
    bomRevision: r.bomRevision === null ? null : Number(r.bomRevision),
    warehouseId: Number(r.warehouseId),
    warehouseCode: String(r.warehouseCode),
    quotedOn: String(r.quotedOn),
    validUntil,
    subtotal: String(r.subtotal),
    taxAmount: String(r.taxAmount),
    amountDue: String(r.amountDue),
    createdAt: new Date(r.createdAt as Date).toISOString(),
  }
}

export async function listQuotes(ds: DataSource, query: { status: string; customerId?: number; q?: string } & NewestPage): Promise<QuoteSummary[]> {
  const today = todayIso()
  const where = new SqlWhere()
  if (query.status === 'open') where.add("q.status IN ('draft', 'offered') AND q.valid_until >= ?", [today])
  else if (query.status === 'lapsed') where.add("q.status IN ('draft', 'offered') AND q.valid_until < ?", [today])
  else if (query.status === 'draft' || query.status === 'offered') where.add('q.status = ? AND q.valid_until >= ?', [query.status, today])
  else if (query.status !== 'all') where.add('q.status = ?', [query.status])
  if (query.customerId) where.add('q.customer_id = ?', [query.customerId])
  if (query.q) where.add('(q.number LIKE ? OR c.name LIKE ? OR j.name LIKE ?)', Array(3).fill(containsPattern(query.q)))
  if (query.beforeId) where.add('q.id < ?', [query.beforeId])
  const rows: Row[] = await ds.query(`${SUMMARY_SQL} ${where.sql()} ORDER BY q.id DESC LIMIT ?`, [...where.params, query.limit])
  return rows.map((r) => toSummary(r, today))
}

export async function quoteDetail(db: DataSource | EntityManager, id: number): Promise<QuoteDetail> {
  const today = todayIso()
  const [r]: Row[] = await db.query(
    `SELECT s.*, c.email AS customerEmail, c.contact_name AS contactName, q.version, q.terms, q.notes, q.lost_reason AS lostReason,
            q.offered_at AS offeredAt, q.taken_at AS takenAt, q.price_level_code AS priceLevelCode, q.tax_json AS taxJson,
            (SELECT so.id FROM sales_orders so WHERE so.quote_id = q.id) AS salesOrderId
       FROM (${SUMMARY_SQL} WHERE q.id = ?) s JOIN quotes q ON q.id = s.id JOIN customers c ON c.id = q.customer_id`,
    [id],
  )
  if (!r) throw AppError.notFound('quote_not_found', 'That quote was not found.')
  const lines: Row[] = await db.query(
    `SELECT l.id, l.line_no AS lineNo, l.item_id AS itemId, i.sku, l.description, l.asked_qty AS askedQty, l.qty, l.packs,
            l.pack_size AS packSize, i.stock_unit AS stockUnit, l.unit_price AS unitPrice, l.pack_price AS packPrice, l.extension,
            l.made_to_order AS madeToOrder, i.weight_kg AS weightKg, l.bom_line_id AS bomLineId, l.explanation_json AS explanationJson
       FROM quote_lines l JOIN items i ON i.id = l.item_id WHERE l.quote_id = ? ORDER BY l.line_no`,
    [id],
  )
  const revisions: Row[] = await db.query(
    'SELECT id, revision, status, DATE_FORMAT(valid_until, "%Y-%m-%d") AS validUntil, amount_due AS amountDue FROM quotes WHERE number = ? ORDER BY revision',
    [r.number],
  )
  const lineViews: QuoteLineView[] = lines.map((l) => ({
    id: Number(l.id),
    lineNo: Number(l.lineNo),
    itemId: Number(l.itemId),
    sku: String(l.sku),
    description: String(l.description),
    askedQty: Number(l.askedQty),
    qty: Number(l.qty),
    packs: l.packs === null ? null : Number(l.packs),
    packSize: Number(l.packSize),
    stockUnit: String(l.stockUnit),
    // Stored to 4 places for case prices shared out; whole cents read as cents.
    unitPrice: trimPrice(String(l.unitPrice)),
    packPrice: l.packPrice === null ? null : String(l.packPrice),
    extension: String(l.extension),
    madeToOrder: Number(l.madeToOrder) === 1,
    weightKg: String(l.weightKg),
    bomLineId: l.bomLineId === null ? null : Number(l.bomLineId),
    explanation: JSON.parse(String(l.explanationJson)),
  }))
  const weight = lineViews.reduce((sum, l) => sum.plus(new MoneyDecimal(l.weightKg).times(l.qty)), new MoneyDecimal(0))
  return {
    ...toSummary(r, today),
    version: Number(r.version),
    customerEmail: r.customerEmail === null ? null : String(r.customerEmail),
    contactName: r.contactName === null ? null : String(r.contactName),
    terms: r.terms === null ? null : String(r.terms),
    notes: r.notes === null ? null : String(r.notes),
    lostReason: r.lostReason === null ? null : String(r.lostReason),
    offeredAt: r.offeredAt === null ? null : new Date(r.offeredAt as Date).toISOString(),
    takenAt: r.takenAt === null ? null : new Date(r.takenAt as Date).toISOString(),
    priceLevelCode: r.priceLevelCode === null ? null : String(r.priceLevelCode),
    salesOrderId: r.salesOrderId === null ? null : Number(r.salesOrderId),
    tax: JSON.parse(String(r.taxJson ?? '{}')) as DocumentTax,
    revisions: revisions.map((v) => ({
      id: Number(v.id),
      revision: Number(v.revision),
      status: quoteStatusOn(v.status as QuoteStatus, String(v.validUntil), today),
      amountDue: String(v.amountDue),
    })),
    lines: lineViews,
    weightKg: weight.toFixed(1),
  }
}

/** '21.2400' → '21.24'; '0.3999' stays. */
function trimPrice(text: string): string {
  return text.replace(/^(-?\d+\.\d\d)(\d*?)0*$/, '$1$2')
}
