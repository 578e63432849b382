// A line given away at no charge (a clerk's own price of 0.00: a replacement for a block broken on the
// truck, a sample panel) is a real thing at a supplier's counter, and a real cost: it is the manager's call,
// not the clerk's. Only an admin sets a line's own price to zero, always with the reason every own price
// carries; anyone else is refused beside that line's price, by the server and by the screen alike.
// source: common practice (a no-charge line needs a manager's approval at a trade counter; the reason is kept)
import { hasAnyRole, type Role } from '../roles.js'

export const NO_CHARGE_ROLES: readonly Role[] = ['admin']

/** Whether a typed own price is zero (0, 0.0, 0.00, .00); null or blank is no own price at all. */
export function isNoCharge(unitPrice: string | null | undefined): boolean {
  return typeof unitPrice === 'string' && /^\s*0*(\.0*)?\s*$/.test(unitPrice) && /\d/.test(unitPrice)
}

/** The indexes of lines whose own price is zero where `roles` may not give a line away. */
export function noChargeRefusals(lines: readonly { unitPrice?: string | null }[], roles: readonly Role[]): number[] {
  if (hasAnyRole(roles, NO_CHARGE_ROLES)) return []
  return lines.flatMap((l, i) => (isNoCharge(l.unitPrice) ? [i] : []))
}
