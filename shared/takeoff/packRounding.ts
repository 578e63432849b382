// Turning an exact need into what is ordered: add the waste allowance, round up to whole stock units,
// then up to whole packs when the item is sold by the pack. Never less than needed.
import { Decimal } from 'decimal.js'
import { explainText, type ExplainToken } from './explainWords.js'

export interface StockQuantity {
  /** Need with the waste allowance, before rounding. */
  withWaste: number
  /** Whole stock units covering the need. */
  units: number
  /** Packs to order when sold by the pack. */
  packs?: number
  /** Stock units ordered (units, or packs × pack size). */
  quantity: number
  /** The rounding, in words and numbers (English). */
  text: string
  /** The same as phrases a screen words in its language. */
  tokens: ExplainToken[]
}

const show = (d: Decimal) => d.toDecimalPlaces(3).toString()

/**
 * Decimal arithmetic so 100 × 1.10 is 110, not 110.00000000000001 (which would round up to 111).
 * The need is first snapped to 9 decimals to drop binary noise from the length math.
 */
export function roundUpToStock(
  needed: number,
  wastePct: number,
  packSize: number,
  sellByPack: boolean,
  unit: string,
): StockQuantity {
  const need = new Decimal(Math.max(0, needed)).toDecimalPlaces(9, Decimal.ROUND_HALF_UP)
  const withWaste = need.times(new Decimal(100).plus(wastePct)).div(100)
  const units = withWaste.ceil().toNumber()
  const tokens: ExplainToken[] = [
    { k: 'step.waste', p: { need: show(need), pct: wastePct, withWaste: show(withWaste) } }, '; ',
    { k: 'step.roundedUp', p: { units, unit } },
  ]
  const result = { withWaste: withWaste.toNumber(), units, tokens }
  if (!sellByPack || packSize <= 1) return { ...result, quantity: units, text: explainText(tokens) }
  const packs = Math.ceil(units / packSize)
  tokens.push('; ', { k: packs === 1 ? 'step.onePack' : 'step.packs', p: { size: packSize, packs, qty: packs * packSize, unit } })
  return { ...result, packs, quantity: packs * packSize, text: explainText(tokens) }
}
