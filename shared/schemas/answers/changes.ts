// What a change answers when it answers only that it happened (an id, a count, a new status). Screens read these
// figures to say what was done; the client checks them like every other answer.
import { z } from 'zod'
import { moveTypeShape, paymentMethodShape, paymentStatusShape } from './terms.js'
import { pickListSummaryShape } from './picking.js'
import { poDetailShape } from './purchasingViews.js'

const id = z.number().int()
const count = z.number()

export { okAnswerSchema as okShape } from '../auth.js'
export const createdShape = z.object({ id })
export const deletedShape = z.object({ deleted: count })

// Stock
export const moveSummaryShape = z.object({
  batchId: z.string(),
  moves: z.array(z.object({ id: z.string(), moveType: moveTypeShape, itemId: id, binId: id, lotId: id.nullable(), qty: count })),
})
export const transferShippedShape = z.object({ transfer: z.object({ id }) })
export const transferReceivedShape = z.object({ id, status: z.string() })

// Cycle counts
export const binStartedShape = z.object({ binId: id })
export const countEnteredShape = z.object({ lineId: id })
export const binFinishedShape = z.object({ closed: z.boolean(), lines: count, differences: count })
export const countReviewedShape = z.object({ approved: count, recounts: count, closed: z.boolean() })
export const countCancelledShape = z.object({ cancelled: z.literal(true) })

// Pick lists
export const pickListsMadeShape = z.object({ ids: z.array(id), lists: z.array(pickListSummaryShape) })
export const pickListStepShape = z.object({ id, status: z.string(), released: count.optional() })
export const pickCompletedShape = z.object({ issued: count, closedShort: count })
export const pickShippedShape = z.object({ transferId: id, qty: count })

// Sales orders and handover
export const paymentRecordedShape = z.object({
  id, salesOrderId: id, method: paymentMethodShape, amount: z.string(), status: paymentStatusShape, reference: z.string().nullable(),
})
/** A card deposit started: the provider's page to pay on (null when the provider answers without one). */
export const cardDepositStartedShape = z.object({ paymentId: id, amount: z.string(), payPageUrl: z.string().nullable() })
/** The ready e-mail sent again (or not, when the mail server still refuses it). */
export const readyMailShape = z.object({ sent: z.boolean(), mailedAt: z.string().nullable() })
export const orderCancelledShape = z.object({ released: count, refunded: z.string() })
export const sentToPickShape = z.object({ pickListId: id, lines: count, qty: count })
export const restCancelledShape = z.object({ cancelled: count })
export const ticketMadeShape = z.object({ id, number: z.string() })
export const ticketSignedShape = z.object({ issued: count, replayed: z.boolean(), orderStatus: z.string() })
export const ticketVoidedShape = z.object({ id, status: z.literal('voided') })

// Purchasing
/** An order's e-mail sent (or sent again): the outbox entry and the order as it now is. */
export const poMailedShape = z.object({ outboxId: id, status: z.literal('sent'), po: poDetailShape })
