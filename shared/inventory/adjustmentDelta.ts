// What an adjustment changes, from what the person entered: units removed (damaged, written off),
// units found, or the count of what is in the bin. The sign rules are adjustmentSchema's.
import type { AdjustmentReason } from '../catalog.js'

export function adjustmentDelta(reason: AdjustmentReason | null, entered: number | null, onHand: number): number | null {
  if (reason === null || entered === null || !Number.isFinite(entered)) return null
  if (reason === 'counted') return entered - onHand
  return reason === 'found' ? entered : -entered
}
