// The working of a reorder line as keyed steps with their figures, so a screen words them in the reader's
// language. The English below is the text the computation writes for logs and accepted suggestions, and the
// client's English messages use this same table (one wording). Templates use the message files' syntax:
// `{name}` is a value; no literal @ $ | or braces. Figures arrive already written (formulas keep a decimal point).

export const REORDER_STEPS_EN = {
  demandMean: 'd̄ = Σx / n = {sum} / {days} = {mean} (n counts every day of the window, {withUse} with use)',
  demandSd: 'σd = √((Σx² − (Σx)²/n) / (n − 1)) = √(({sumSquares} − {sum}²/{days}) / {daysLess}) = {sd}',
  position: 'position = on hand + on order − reserved = {onHand} + {onOrder} − {reserved} = {position}',
  positionPending: 'position = on hand + on order + pending − reserved = {onHand} + {onOrder} + {pending} − {reserved} = {position}',
  z: 'z = Φ⁻¹({serviceLevel}) = {z}',
  safetyStock: 'SS = z·σd·√L = {z} × {sd} × √{L} = {ss}',
  safetyStockLeadSpread: 'SS = z·√(L·σd² + d̄²·σL²) = {z} × √({L} × {sd}² + {d}² × {sL}²) = {ss}',
  override: '{symbol} = {value} (override: {reason})',
  reorderPoint: 'ROP = d̄·L + SS = {d} × {L} + {ss} = {raw} → {rop}',
  orderUpTo: 'T = d̄·(R+L) + z·√((R+L)·σd² + d̄²·σL²) = {d} × {period} + {ssPeriod} = {raw} → {level}',
  annual: 'D = d̄ × {year} = {D}; H = i × C = {rate} × {cost} = {H}',
  eoqNone: 'EOQ undefined (H = 0): lot size from need, pack and minimum only',
  eoq: 'EOQ = √(2DS/H) = √(2 × {D} × {S} / {H}) = {eoq}',
  lotSize: 'lot size = {base} → whole packs of {pack}, minimum {minimum} → {lot}',
  deadNoUse: 'dead stock: {free} unreserved and no use recorded (limit {limit})',
  deadIdle: 'dead stock: {free} unreserved and no use for {idle} days (limit {limit})',
  orderNow: 'order now: position {position} ≤ ROP {rop}',
  orderSoon: 'order soon: position {position} ≤ ROP + d̄ × {days} days = {limit}',
  overstocked: 'overstocked: position {position} > ceiling {ceiling} + d̄ × {days} days = {limit}',
  ok: 'ok: ROP {rop} < position {position} ≤ {limit}',
  orderToLevel: 'order = T − position = {level} − {position} = {raw} → {qty}',
  orderLot: 'order = max(lot size, ROP + 1 − position) = max({lot}, {need}) → {qty}',
} as const

export type ReorderStepKey = keyof typeof REORDER_STEPS_EN
/** One step of the working: its phrase and figures (numbers and texts as the English writes them). */
export interface ReorderStep {
  k: ReorderStepKey
  p?: Record<string, string | number>
}

/** A step in English. */
export function stepEnglish(step: ReorderStep): string {
  return REORDER_STEPS_EN[step.k].replace(/\{(\w+)\}/g, (_, name: string) => String(step.p?.[name] ?? ''))
}

/** Steps as they are worked out: each is kept keyed (for screens) and in English (for logs and saved suggestions). */
export class Working {
  readonly steps: string[] = []
  readonly words: ReorderStep[] = []
  add(k: ReorderStepKey, p?: ReorderStep['p']): void {
    const step: ReorderStep = p ? { k, p } : { k }
    this.words.push(step)
    this.steps.push(stepEnglish(step))
  }
}
