// What the purchasing API answers. Money is decimal text; cost fields are absent (not null) for users
// who may not see costs (server/services/costVisibility.ts), so a client can't show what the server never sent.
import type { RowProblem } from '../errors/errorCodes.js'
import type { PoStatus } from './purchasing.js'

export interface VendorView {
  id: number
  code: string
  name: string
  contactName: string | null
  email: string | null
  phone: string | null
  address: string | null
  terms: string | null
  currency: string
  leadTimeDays: number
  active: boolean
  itemCount: number
  /** Goes up with every change; an edit sends the version it loaded. */
  version: number
}

export interface VendorItemView {
  id: number
  vendorId: number
  itemId: number
  sku: string
  itemName: string
  stockUnit: string
  vendorSku: string
  packQty: number
  minOrderQty: number
  unitCost: string
  leadTimeDays: number | null
  preferred: boolean
  /** Goes up with every change (a price list taken in, another vendor made preferred); an edit sends the version it loaded. */
  version: number
}

export interface ItemChoice {
  id: number
  sku: string
  name: string
  stockUnit: string
  madeToOrder: boolean
  gtin: string | null
}

export interface WarehouseChoice {
  id: number
  code: string
  name: string
}

export interface PoTimelineEntry {
  /** 'delivery' is one receipt (part or all of the order); 'received' is the order complete. */
  event: 'created' | 'approved' | 'sent' | 'delivery' | 'received' | 'closed' | 'cancelled'
  at: string
  by: string | null
  note?: string | null
  /** A delivery's good and damaged units. */
  qty?: number
  damaged?: number
}

export interface PoLineView {
  id: number
  lineNo: number
  itemId: number
  sku: string
  itemName: string
  gtin: string | null
  stockUnit: string
  madeToOrder: boolean
  matchLot: boolean
  vendorSku: string | null
  description: string
  /** Made-to-order spec (shower base dimensions) as stored, and as one line of text. */
  spec: Record<string, unknown> | null
  specText: string | null
  bomLineId: number | null
  packQty: number
  packsOrdered: number
  qtyOrdered: number
  qtyReceived: number
  qtyDamaged: number
  unitCost?: string
  lineTotal?: string
}

export interface PoSummary {
  id: number
  number: string
  status: PoStatus
  vendor: { id: number; code: string; name: string }
  warehouse: { id: number; code: string; name: string }
  job: { id: number; name: string; dueDate: string | null } | null
  currency: string
  expectedDate: string | null
  createdAt: string
  lineCount: number
  orderTotal?: string
  /** Goes up with every change; send it back with an edit or approval. */
  version: number
  /** The vendor's expected date is after the job's due date: the job would wait for this order. */
  arrivesAfterDue: boolean
}

export interface OutboxSummary {
  id: number
  createdAt: string
  sentAt: string | null
  status: 'sent' | 'failed'
  fromAddress: string
  toAddress: string
  cc: string | null
  subject: string
  bodyText: string
  error: string | null
  poId: number | null
  poNumber: string | null
  attachments: { id: number; name: string; bytes: number }[]
  createdBy: string | null
  /** The failed message this one sent again. */
  retryOf: number | null
  /** The message that sent this failed one again, once it was. */
  sentAgainAs: number | null
}

export interface PoDetail extends PoSummary {
  vendor: PoSummary['vendor'] & { email: string | null; contactName: string | null; phone: string | null; address: string | null; terms: string | null }
  warehouse: PoSummary['warehouse'] & { address: string | null }
  notes: string | null
  sendError: string | null
  closeReason: string | null
  cancelReason: string | null
  timeline: PoTimelineEntry[]
  lines: PoLineView[]
  messages: Omit<OutboxSummary, 'bodyText'>[]
}

export interface BinChoice {
  id: number
  code: string
  kind: string
}

export interface ReceivingContext {
  po: PoDetail
  bins: BinChoice[]
}

export interface ReceiptLineView {
  id: number
  poLineId: number
  itemId: number
  sku: string
  itemName: string
  gtin: string | null
  binCode: string
  lotId: number | null
  lotCode: string | null
  qty: number
  qtyDamaged: number
  variance: 'over' | 'short' | 'damaged' | null
  reason: string | null
  issuedToJobId: number | null
}

export interface ReceiptView {
  id: number
  poId: number
  receivedAt: string
  receivedBy: string | null
  note: string | null
  lines: ReceiptLineView[]
}

export interface ReceiveResult {
  receipt: ReceiptView
  status: PoStatus
}

export interface SuggestionView {
  id: number
  itemId: number
  sku: string
  itemName: string
  stockUnit: string
  warehouse: { id: number; code: string; name: string }
  vendor: { id: number; code: string; name: string } | null
  qty: number
  source: string
  acceptedAt: string
  /** The vendor item the line would be ordered as; null when the vendor has no price for the item. */
  packQty: number | null
  packs: number | null
  /** Only buyers and admins read suggestions, so the vendor's price is always there (null without one). */
  unitCost: string | null
}

export interface JobPurchaseLine {
  poId: number
  poNumber: string
  status: PoStatus
  vendorName: string
  expectedDate: string | null
  poLineId: number
  description: string
  specText: string | null
  qtyOrdered: number
  qtyReceived: number
  /** The PO is expected after the job is due. */
  late: boolean
}

export interface JobOpenSpecialOrder {
  bomLineId: number
  itemId: number | null
  sku: string | null
  description: string
  specText: string | null
  qty: number
  orderedQty: number
}

export interface JobPurchaseLines {
  job: { id: number; name: string; dueDate: string | null; status: string; customerName: string | null }
  lines: JobPurchaseLine[]
  toOrder: JobOpenSpecialOrder[]
}

export interface SpecialOrderJob {
  jobId: number
  jobName: string
  customerName: string | null
  dueDate: string | null
  linesToOrder: number
  /** The job's warehouse (of its latest pick list), where its special orders ship by default. */
  warehouseId: number | null
}

/** One row of a vendor's price list as checked before it is taken in. */
export interface PriceListPreviewRow {
  row: number
  sku: string | null
  vendorSku: string | null
  action: 'add' | 'update'
  unitCost: string | null
  previousCost: string | null
  errors: RowProblem[]
}

/** A vendor's price list, checked (preview) or taken in (commit). */
export interface PriceListPreview {
  filename: string
  total: number
  adds: number
  updates: number
  errorRows: number
  /** Rows with errors first (up to 1,000), then a sample of good rows. */
  rows: PriceListPreviewRow[]
}
