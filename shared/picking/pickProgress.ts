// How far a pick list is, told truthfully: a line closed short is not done (it stays short until
// someone settles it with a backorder or a substitute, or a recount puts the units back on the line),
// and units are added up per stock unit (blocks, feet of strip and tubes of sealant are never summed
// into one number).

export interface ProgressLine {
  qty: number
  confirmedQty: number
  shortQty: number
  /** Short units settled by a backorder or a substitute. */
  shortResolvedQty?: number
  stockUnit: string
}

/**
 * done: everything confirmed; short: closed with units missing that nobody settled yet; resolved:
 * closed short and every missing unit settled; partial: some confirmed; open: nothing yet.
 */
export type LineProgress = 'open' | 'partial' | 'done' | 'short' | 'resolved'

const openShort = (l: ProgressLine) => Math.max(0, l.shortQty - (l.shortResolvedQty ?? 0))

export function lineProgress(l: ProgressLine): LineProgress {
  if (openShort(l) > 0) return 'short'
  if (l.confirmedQty >= l.qty) return 'done'
  if (l.shortQty > 0 && l.confirmedQty + l.shortQty >= l.qty) return 'resolved'
  return l.confirmedQty > 0 ? 'partial' : 'open'
}

export interface UnitProgress {
  unit: string
  qty: number
  confirmed: number
  /** Short and not settled yet. */
  short: number
  /** Short, and settled by a backorder or a substitute. */
  resolved: number
  /** Neither confirmed nor closed short. */
  left: number
}

export interface PickProgress {
  lines: { total: number; done: number; short: number; resolved: number; left: number }
  units: UnitProgress[]
}

export function pickProgress(lines: readonly ProgressLine[]): PickProgress {
  const byUnit = new Map<string, UnitProgress>()
  const counts = { total: lines.length, done: 0, short: 0, resolved: 0, left: 0 }
  for (const l of lines) {
    const state = lineProgress(l)
    if (state === 'done') counts.done++
    else if (state === 'short') counts.short++
    else if (state === 'resolved') counts.resolved++
    else counts.left++
    const u = byUnit.get(l.stockUnit) ?? { unit: l.stockUnit, qty: 0, confirmed: 0, short: 0, resolved: 0, left: 0 }
    u.qty += l.qty
    u.confirmed += l.confirmedQty
    u.short += openShort(l)
    u.resolved += l.shortQty - openShort(l)
    u.left += Math.max(0, l.qty - l.confirmedQty - l.shortQty)
    byUnit.set(l.stockUnit, u)
  }
  return { lines: counts, units: [...byUnit.values()] }
}
