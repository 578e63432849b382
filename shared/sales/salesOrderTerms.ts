// Sales orders and their payments, in our own words. An order is booked when the contractor takes a
// quote (stock held, special orders raised), ready when everything stocked is picked, handed over when
// it has all left the counter or the truck, and cancelled (holds released) while nothing has left.
export const SALES_ORDER_STATUSES = ['booked', 'ready', 'handed_over', 'cancelled'] as const
export type SalesOrderStatus = (typeof SALES_ORDER_STATUSES)[number]

/** How a payment came in: by hand at the counter (cash, cheque) or through the payment provider (card). */
export const PAYMENT_METHODS = ['cash', 'cheque', 'card'] as const
export type PaymentMethod = (typeof PAYMENT_METHODS)[number]

/**
 * A payment's state: 'pending' while a provider has not confirmed it, 'settled' once the money is in
 * (cash and cheque are settled when recorded), 'failed' when the provider refused it, 'refunded' when all
 * of it went back. Only settled amounts, less what was refunded, count as paid on the order.
 */
export const PAYMENT_STATUSES = ['pending', 'settled', 'failed', 'refunded'] as const
export type PaymentStatus = (typeof PAYMENT_STATUSES)[number]

/** The admin's default deposit on made-to-order lines, in percent (common practice: half up front for goods built to order). */
export const DEFAULT_DEPOSIT_PERCENT = '50'
