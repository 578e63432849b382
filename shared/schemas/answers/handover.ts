// The answers' schemas for the interfaces in shared/schemas/handover.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { TicketLineView, TicketSummary, TicketDetail, FulfilmentLine, OrderFulfilment } from '../handover.js'
import { handlingCautionShape, handoverKindShape, handoverStatusShape, salesOrderStatusShape } from './terms.js'
import { salesOrderLineViewShape } from './salesOrders.js'
import { pickListStatusShape } from './picking.js'

const ticketLineViewShape = z.object({
  id: z.number(),
  salesOrderLineId: z.number(),
  lineNo: z.number(),
  itemId: z.number(),
  sku: z.string(),
  itemName: z.string(),
  family: z.string(),
  stockUnit: z.string(),
  binCode: z.string(),
  lotCode: z.string().nullable(),
  qty: z.number(),
  totalKg: z.string(),
  cautions: z.array(handlingCautionShape)
}) satisfies z.ZodType<TicketLineView>

export const ticketSummaryShape = z.object({
  id: z.number(),
  number: z.string(),
  salesOrderId: z.number(),
  orderNumber: z.string(),
  customerName: z.string(),
  jobName: z.string().nullable(),
  kind: handoverKindShape,
  status: handoverStatusShape,
  qty: z.number(),
  createdAt: z.string(),
  signedAt: z.string().nullable()
}) satisfies z.ZodType<TicketSummary>

export const ticketDetailShape = ticketSummaryShape.extend({
  warehouseCode: z.string(),
  deliverTo: z.string().nullable(),
  note: z.string().nullable(),
  signerName: z.string().nullable(),
  signedBy: z.string().nullable(),
  createdBy: z.string().nullable(),
  hasSignature: z.boolean(),
  lines: z.array(ticketLineViewShape),
  totalKg: z.string(),
  heavy: z.boolean()
}) satisfies z.ZodType<TicketDetail>

const fulfilmentLineShape = salesOrderLineViewShape.pick({ 'id': true, 'lineNo': true, 'itemId': true, 'sku': true, 'description': true, 'qty': true, 'madeToOrder': true }).extend({
  held: z.number(),
  onPickList: z.number(),
  picked: z.number(),
  handedOver: z.number(),
  waiting: z.number(),
  onOpenTickets: z.number(),
  backordered: z.number(),
  cancelled: z.number()
}) satisfies z.ZodType<FulfilmentLine>

export const orderFulfilmentShape = z.object({
  orderId: z.number(),
  orderNumber: z.string(),
  status: salesOrderStatusShape,
  readyAt: z.string().nullable(),
  readyMailedAt: z.string().nullable(),
  readyMailError: z.string().nullable(),
  lines: z.array(fulfilmentLineShape),
  pickLists: z.array(z.object({
    id: z.number(),
    number: z.string(),
    status: pickListStatusShape
  })),
  tickets: z.array(ticketSummaryShape)
}) satisfies z.ZodType<OrderFulfilment>
