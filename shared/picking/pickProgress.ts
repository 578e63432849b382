// How far a pick list is, told truthfully: a line closed short is not done (it stays short until
// someone resolves it), and units are added up per stock unit (blocks, feet of strip and tubes of
// sealant are never summed into one number).

export interface ProgressLine {
  qty: number
  confirmedQty: number
  shortQty: number
  stockUnit: string
}

/** done: everything confirmed; short: closed with units missing; partial: some confirmed; open: nothing yet. */
export type LineProgress = 'open' | 'partial' | 'done' | 'short'

export function lineProgress(l: ProgressLine): LineProgress {
  if (l.shortQty > 0) return 'short'
  if (l.confirmedQty >= l.qty) return 'done'
  return l.confirmedQty > 0 ? 'partial' : 'open'
}

export interface UnitProgress {
  unit: string
  qty: number
  confirmed: number
  short: number
  /** Neither confirmed nor closed short. */
  left: number
}

export interface PickProgress {
  lines: { total: number; done: number; short: number; left: number }
  units: UnitProgress[]
}

export function pickProgress(lines: readonly ProgressLine[]): PickProgress {
  const byUnit = new Map<string, UnitProgress>()
  const counts = { total: lines.length, done: 0, short: 0, left: 0 }
  for (const l of lines) {
    const state = lineProgress(l)
    if (state === 'done') counts.done++
    else if (state === 'short') counts.short++
    else counts.left++
    const u = byUnit.get(l.stockUnit) ?? { unit: l.stockUnit, qty: 0, confirmed: 0, short: 0, left: 0 }
    u.qty += l.qty
    u.confirmed += l.confirmedQty
    u.short += l.shortQty
    u.left += Math.max(0, l.qty - l.confirmedQty - l.shortQty)
    byUnit.set(l.stockUnit, u)
  }
  return { lines: counts, units: [...byUnit.values()] }
}
