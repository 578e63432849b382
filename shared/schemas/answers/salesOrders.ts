// The answers' schemas for the interfaces in shared/schemas/salesOrders.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import { CARD_DEPOSIT_STAGES } from '../salesOrders.js'
import type { CardDepositState, SalesSettings, SalesOrderLineView, PaymentView, SalesOrderSummary, SalesOrderDetail } from '../salesOrders.js'
import { paymentMethodShape, paymentStatusShape, salesOrderStatusShape } from './terms.js'

export const salesSettingsShape = z.object({
  depositPercent: z.string(),
  returnWindowDays: z.number(),
  restockingPercent: z.string()
}) satisfies z.ZodType<SalesSettings>

export const salesOrderLineViewShape = z.object({
  id: z.number(),
  lineNo: z.number(),
  itemId: z.number(),
  sku: z.string(),
  description: z.string(),
  qty: z.number(),
  unitPrice: z.string(),
  extension: z.string(),
  tax: z.string(),
  madeToOrder: z.boolean(),
  qtyReserved: z.number(),
  qtyOnPickList: z.number(),
  qtyPicked: z.number(),
  qtyHandedOver: z.number(),
  qtyReturned: z.number(),
  qtyShort: z.number(),
  poLineId: z.number().nullable(),
  poId: z.number().nullable(),
  poNumber: z.string().nullable(),
  poStatus: z.string().nullable()
}) satisfies z.ZodType<SalesOrderLineView>

export const paymentViewShape = z.object({
  id: z.number(),
  method: paymentMethodShape,
  amount: z.string(),
  status: paymentStatusShape,
  reference: z.string().nullable(),
  recordedBy: z.string().nullable(),
  recordedAt: z.string(),
  refundedAmount: z.string()
}) satisfies z.ZodType<PaymentView>

export const salesOrderSummaryShape = z.object({
  id: z.number(),
  number: z.string(),
  quoteId: z.number(),
  quoteNumber: z.string(),
  status: salesOrderStatusShape,
  customerId: z.number(),
  customerName: z.string(),
  jobId: z.number().nullable(),
  jobName: z.string().nullable(),
  warehouseId: z.number(),
  warehouseCode: z.string(),
  total: z.string(),
  depositRequired: z.string(),
  depositPaid: z.string(),
  depositDue: z.string(),
  createdAt: z.string()
}) satisfies z.ZodType<SalesOrderSummary>

export const salesOrderDetailShape = salesOrderSummaryShape.extend({
  subtotal: z.string(),
  taxAmount: z.string(),
  depositPercent: z.string(),
  balanceDue: z.string(),
  cancelReason: z.string().nullable(),
  cancelledAt: z.string().nullable(),
  createdBy: z.string().nullable(),
  lines: z.array(salesOrderLineViewShape),
  payments: z.array(paymentViewShape)
}) satisfies z.ZodType<SalesOrderDetail>

/** Where a card deposit stands, as the counter follows it while the customer pays on the provider's page. */
export const cardDepositStateShape = z.object({
  paymentId: z.number().int().positive(),
  salesOrderId: z.number().int().positive(),
  amount: z.string(),
  stage: z.enum(CARD_DEPOSIT_STAGES),
  intentId: z.string(),
  payPageUrl: z.string().nullable(),
  depositPaid: z.string(),
  depositDue: z.string(),
}) satisfies z.ZodType<CardDepositState>
