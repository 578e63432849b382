// What one signed move does to a bin's balance, and whether it may: on hand never below zero, and
// never below what is reserved for pick lists (units held for a list are not there to take). The
// stock engine applies every move through this; the move and adjust forms run it on the figures they
// show, so they refuse before asking for confirmation, with the same rule the server will apply.

export interface BalanceFigures {
  onHand: number
  reserved: number
}

export type BalanceProblem = 'not_enough_on_hand' | 'not_enough_available'

export type BalanceAfter =
  | { ok: true; onHand: number; reserved: number }
  | { ok: false; problem: BalanceProblem; onHand: number; reserved: number; available: number; wanted: number }

/**
 * @param qty signed move in stock units (negative takes units out)
 * @param fromReserved units of an outgoing move that were reserved for it (a pick consuming its reservation)
 */
export function balanceAfter(before: BalanceFigures, qty: number, fromReserved = 0): BalanceAfter {
  const onHand = before.onHand + qty
  const reserved = before.reserved - fromReserved
  const refusal = (problem: BalanceProblem): BalanceAfter => ({
    ok: false, problem, onHand: before.onHand, reserved: before.reserved, available: before.onHand - before.reserved, wanted: -qty,
  })
  if (onHand < 0) return refusal('not_enough_on_hand')
  if (onHand < reserved) return refusal('not_enough_available')
  return { ok: true, onHand, reserved }
}
