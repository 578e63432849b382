// Handing an order's goods over, in our own words. A handover ticket is a pickup (the contractor collects at
// the counter) or a delivery (our truck takes it to the site); it is open until signed, then its stock has
// left; an open ticket may be voided (nothing left). The doc types on the stock tables say which step holds or
// issued a unit.
export const HANDOVER_KINDS = ['pickup', 'delivery'] as const
export type HandoverKind = (typeof HANDOVER_KINDS)[number]

export const HANDOVER_STATUSES = ['open', 'signed', 'voided'] as const
export type HandoverStatus = (typeof HANDOVER_STATUSES)[number]

/** Units picked for an order and waiting at the counter (stock_reservations.doc_type, doc_id = the order, doc_line_id = its line). */
export const ORDER_PICKED_DOC = 'order_picked'
/** The stock moves a signed ticket made (stock_moves.doc_type, doc_id = the ticket, doc_line_id = its line). */
export const HANDOVER_DOC = 'handover_ticket'

export const ticketNumber = (id: number) => `HT-${String(id).padStart(5, '0')}`
