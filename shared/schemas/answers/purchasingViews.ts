// The answers' schemas for the interfaces in shared/schemas/purchasingViews.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { VendorView, VendorItemView, ItemChoice, WarehouseChoice, PoTimelineEntry, PoLineView, OutboxSummary, BinChoice, ReceiptLineView, ReceiptView, SuggestionView, JobOpenSpecialOrder, SpecialOrderJob, PoSummary, PoDetail, ReceivingContext, ReceiveResult, JobPurchaseLine, JobPurchaseLines, PriceListPreviewRow, PriceListPreview } from '../purchasingViews.js'
import { poStatusShape } from './purchasing.js'
import { codedRefShape, rowProblemShape, withheldCost } from './terms.js'

export const vendorViewShape = z.object({
  id: z.number(),
  code: z.string(),
  name: z.string(),
  contactName: z.string().nullable(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  address: z.string().nullable(),
  terms: z.string().nullable(),
  currency: z.string(),
  leadTimeDays: z.number(),
  active: z.boolean(),
  itemCount: z.number(),
  version: z.number().int(),
}) satisfies z.ZodType<VendorView>

export const vendorItemViewShape = z.object({
  id: z.number(),
  vendorId: z.number(),
  itemId: z.number(),
  sku: z.string(),
  itemName: z.string(),
  stockUnit: z.string(),
  vendorSku: z.string(),
  packQty: z.number(),
  minOrderQty: z.number(),
  unitCost: z.string(),
  leadTimeDays: z.number().nullable(),
  preferred: z.boolean(),
  version: z.number().int(),
}) satisfies z.ZodType<VendorItemView>

export const itemChoiceShape = z.object({
  id: z.number(),
  sku: z.string(),
  name: z.string(),
  stockUnit: z.string(),
  madeToOrder: z.boolean(),
  gtin: z.string().nullable()
}) satisfies z.ZodType<ItemChoice>

export const warehouseChoiceShape = codedRefShape satisfies z.ZodType<WarehouseChoice>

const poTimelineEntryShape = z.object({
  event: z.union([z.literal('created'), z.literal('approved'), z.literal('sent'), z.literal('delivery'), z.literal('received'), z.literal('closed'), z.literal('cancelled')]),
  at: z.string(),
  by: z.string().nullable(),
  note: z.string().optional().nullable(),
  qty: z.number().optional(),
  damaged: z.number().optional()
}) satisfies z.ZodType<PoTimelineEntry>

const poLineViewShape = z.object({
  id: z.number(),
  lineNo: z.number(),
  itemId: z.number(),
  sku: z.string(),
  itemName: z.string(),
  gtin: z.string().nullable(),
  stockUnit: z.string(),
  madeToOrder: z.boolean(),
  matchLot: z.boolean(),
  vendorSku: z.string().nullable(),
  description: z.string(),
  spec: z.record(z.string(), z.unknown()).nullable(),
  specText: z.string().nullable(),
  bomLineId: z.number().nullable(),
  packQty: z.number(),
  packsOrdered: z.number(),
  qtyOrdered: z.number(),
  qtyReceived: z.number(),
  qtyDamaged: z.number(),
  unitCost: withheldCost(z.string()),
  lineTotal: withheldCost(z.string())
}) satisfies z.ZodType<PoLineView>

export const outboxSummaryShape = z.object({
  id: z.number(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
  status: z.union([z.literal('sent'), z.literal('failed')]),
  fromAddress: z.string(),
  toAddress: z.string(),
  cc: z.string().nullable(),
  subject: z.string(),
  bodyText: z.string(),
  error: z.string().nullable(),
  poId: z.number().nullable(),
  poNumber: z.string().nullable(),
  attachments: z.array(z.object({
    id: z.number(),
    name: z.string(),
    bytes: z.number()
  })),
  createdBy: z.string().nullable(),
  retryOf: z.number().nullable(),
  sentAgainAs: z.number().nullable()
}) satisfies z.ZodType<OutboxSummary>

const binChoiceShape = z.object({
  id: z.number(),
  code: z.string(),
  kind: z.string()
}) satisfies z.ZodType<BinChoice>

const receiptLineViewShape = z.object({
  id: z.number(),
  poLineId: z.number(),
  itemId: z.number(),
  sku: z.string(),
  itemName: z.string(),
  gtin: z.string().nullable(),
  binCode: z.string(),
  lotId: z.number().nullable(),
  lotCode: z.string().nullable(),
  qty: z.number(),
  qtyDamaged: z.number(),
  variance: z.union([z.literal('over'), z.literal('short'), z.literal('damaged')]).nullable(),
  reason: z.string().nullable(),
  issuedToJobId: z.number().nullable()
}) satisfies z.ZodType<ReceiptLineView>

export const receiptViewShape = z.object({
  id: z.number(),
  poId: z.number(),
  receivedAt: z.string(),
  receivedBy: z.string().nullable(),
  note: z.string().nullable(),
  lines: z.array(receiptLineViewShape)
}) satisfies z.ZodType<ReceiptView>

export const suggestionViewShape = z.object({
  id: z.number(),
  itemId: z.number(),
  sku: z.string(),
  itemName: z.string(),
  stockUnit: z.string(),
  warehouse: codedRefShape,
  vendor: codedRefShape.nullable(),
  qty: z.number(),
  source: z.string(),
  acceptedAt: z.string(),
  packQty: z.number().nullable(),
  packs: z.number().nullable(),
  unitCost: z.string().nullable()
}) satisfies z.ZodType<SuggestionView>

const jobOpenSpecialOrderShape = z.object({
  bomLineId: z.number(),
  itemId: z.number().nullable(),
  sku: z.string().nullable(),
  description: z.string(),
  specText: z.string().nullable(),
  qty: z.number(),
  orderedQty: z.number()
}) satisfies z.ZodType<JobOpenSpecialOrder>

export const specialOrderJobShape = z.object({
  jobId: z.number(),
  jobName: z.string(),
  customerName: z.string().nullable(),
  dueDate: z.string().nullable(),
  linesToOrder: z.number(),
  warehouseId: z.number().nullable()
}) satisfies z.ZodType<SpecialOrderJob>

export const poSummaryShape = z.object({
  id: z.number(),
  number: z.string(),
  status: poStatusShape,
  vendor: codedRefShape,
  warehouse: codedRefShape,
  job: z.object({
    id: z.number(),
    name: z.string(),
    dueDate: z.string().nullable()
  }).nullable(),
  currency: z.string(),
  expectedDate: z.string().nullable(),
  createdAt: z.string(),
  lineCount: z.number(),
  orderTotal: withheldCost(z.string()),
  version: z.number(),
  arrivesAfterDue: z.boolean()
}) satisfies z.ZodType<PoSummary>

export const poDetailShape = poSummaryShape.extend({
  vendor: poSummaryShape.shape.vendor.and(z.object({
    email: z.string().nullable(),
    contactName: z.string().nullable(),
    phone: z.string().nullable(),
    address: z.string().nullable(),
    terms: z.string().nullable()
  })),
  warehouse: poSummaryShape.shape.warehouse.and(z.object({
    address: z.string().nullable()
  })),
  notes: z.string().nullable(),
  sendError: z.string().nullable(),
  closeReason: z.string().nullable(),
  cancelReason: z.string().nullable(),
  timeline: z.array(poTimelineEntryShape),
  lines: z.array(poLineViewShape),
  messages: z.array(outboxSummaryShape.omit({ 'bodyText': true }))
}) satisfies z.ZodType<PoDetail>

export const receivingContextShape = z.object({
  po: poDetailShape,
  bins: z.array(binChoiceShape)
}) satisfies z.ZodType<ReceivingContext>

export const receiveResultShape = z.object({
  receipt: receiptViewShape,
  status: poStatusShape
}) satisfies z.ZodType<ReceiveResult>

const jobPurchaseLineShape = z.object({
  poId: z.number(),
  poNumber: z.string(),
  status: poStatusShape,
  vendorName: z.string(),
  expectedDate: z.string().nullable(),
  poLineId: z.number(),
  description: z.string(),
  specText: z.string().nullable(),
  qtyOrdered: z.number(),
  qtyReceived: z.number(),
  late: z.boolean()
}) satisfies z.ZodType<JobPurchaseLine>

export const jobPurchaseLinesShape = z.object({
  job: z.object({
    id: z.number(),
    name: z.string(),
    dueDate: z.string().nullable(),
    status: z.string(),
    customerName: z.string().nullable()
  }),
  lines: z.array(jobPurchaseLineShape),
  toOrder: z.array(jobOpenSpecialOrderShape)
}) satisfies z.ZodType<JobPurchaseLines>

const priceListPreviewRowShape = z.object({
  row: z.number(),
  sku: z.string().nullable(),
  vendorSku: z.string().nullable(),
  action: z.union([z.literal('add'), z.literal('update')]),
  unitCost: z.string().nullable(),
  previousCost: z.string().nullable(),
  errors: z.array(rowProblemShape)
}) satisfies z.ZodType<PriceListPreviewRow>

export const priceListPreviewShape = z.object({
  filename: z.string(),
  total: z.number(),
  adds: z.number(),
  updates: z.number(),
  errorRows: z.number(),
  rows: z.array(priceListPreviewRowShape)
}) satisfies z.ZodType<PriceListPreview>
