// Fulfilling a sales order at the counter: what each line has reached (held, on a pick list, picked and
// waiting, handed over, backordered, cancelled), and the handover tickets (pickup or delivery) that take
// picked goods out, signed on a tablet.
import { z } from 'zod'
import { issueOf } from '../errors/zodProblems.js'
import type { HandlingCaution } from '../picking/handling.js'
import type { PickListStatus } from './picking.js'
import { HANDOVER_KINDS, type HandoverKind, type HandoverStatus } from '../sales/handoverTerms.js'
import type { SalesOrderStatus } from '../sales/salesOrderTerms.js'
import type { SalesOrderLineView } from './salesOrders.js'
import { newestPageQuery } from './newestPage.js'
import { idSchema, qtySchema } from './stock.js'

const optionalText = (max: number) => z.preprocess((v) => (v === '' || v === undefined ? null : v), z.string().trim().max(max).nullable()).default(null)

export const ticketCreateSchema = z
  .object({
    kind: z.enum(HANDOVER_KINDS).default('pickup'),
    deliverTo: optionalText(300),
    note: optionalText(200),
    lines: z.array(z.object({ salesOrderLineId: idSchema, qty: qtySchema })).min(1, issueOf('ticket_empty')).max(500),
  })
  .superRefine((v, ctx) => {
    if (v.kind === 'delivery' && !v.deliverTo) ctx.addIssue({ code: 'custom', path: ['deliverTo'], ...issueOf('delivery_address_needed') })
  })
export type TicketCreateInput = z.infer<typeof ticketCreateSchema>

/** The PNG the signature pad drew, as a data URL (about 10 to 60 kB for a signature; 500 kB at most). */
export const SIGNATURE_PREFIX = 'data:image/png;base64,'
export const ticketSignSchema = z.object({
  signerName: z.string().trim().min(1).max(100),
  signature: z.string().max(700_000).refine((s) => s.startsWith(SIGNATURE_PREFIX) && s.length > SIGNATURE_PREFIX.length + 40, issueOf('signature_invalid')),
})
export type TicketSignInput = z.infer<typeof ticketSignSchema>

export const ticketQuerySchema = z.object({
  status: z.enum(['open', 'signed', 'voided', 'all']).default('open'),
  /** Part of the ticket's number, its order's number or the contractor's name. */
  q: z.string().trim().max(80).optional(),
  ...newestPageQuery,
})

export interface TicketLineView {
  id: number
  salesOrderLineId: number
  lineNo: number
  itemId: number
  sku: string
  itemName: string
  family: string
  stockUnit: string
  binCode: string
  lotCode: string | null
  qty: number
  /** The line's weight, kg, 1 decimal. */
  totalKg: string
  cautions: HandlingCaution[]
}

export interface TicketSummary {
  id: number
  number: string
  salesOrderId: number
  orderNumber: string
  customerName: string
  jobName: string | null
  kind: HandoverKind
  status: HandoverStatus
  qty: number
  createdAt: string
  signedAt: string | null
}

export interface TicketDetail extends TicketSummary {
  warehouseCode: string
  deliverTo: string | null
  note: string | null
  signerName: string | null
  signedBy: string | null
  createdBy: string | null
  hasSignature: boolean
  lines: TicketLineView[]
  totalKg: string
  /** Any line calls for a team lift or equipment. */
  heavy: boolean
}

export interface FulfilmentLine extends Pick<SalesOrderLineView, 'id' | 'lineNo' | 'itemId' | 'sku' | 'description' | 'qty' | 'madeToOrder'> {
  /** Held at the counter, not sent to the warehouse yet. */
  held: number
  onPickList: number
  picked: number
  handedOver: number
  /** Picked, not handed over and not on an open ticket: what a new ticket can take. */
  waiting: number
  onOpenTickets: number
  backordered: number
  cancelled: number
}

export interface OrderFulfilment {
  orderId: number
  orderNumber: string
  status: SalesOrderStatus
  readyAt: string | null
  readyMailedAt: string | null
  /** Why the last ready e-mail failed, while the ready order has not been mailed since (READY_MAIL_NO_ADDRESS: the account has none). */
  readyMailError: string | null
  lines: FulfilmentLine[]
  pickLists: { id: number; number: string; status: PickListStatus }[]
  tickets: TicketSummary[]
}

/** The ready e-mail's failure when the contractor's account has no address (the client words it in the reader's language). */
export const READY_MAIL_NO_ADDRESS = 'The account has no e-mail address.'
