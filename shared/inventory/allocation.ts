// Allocating one item's requested quantity to bins and lots.
// Glass blocks (matchLot) vary in tint between production runs, so a job should come from one lot:
//   1. if any lot covers the whole quantity, use one: the oldest such lot; among lots received at the same
//      time, the one whose bins this pick empties most, then by lot code;
//   2. otherwise the fewest lots that cover it (or all lots when stock is short), preferring older lots;
//      the older lots are taken whole and the youngest chosen lot gives the remainder.
// Other items: strict FIFO, oldest lot first.
// Within a lot, bins are taken smallest available first (then by bin code): leftovers are cleared so bins free
// up, and the one bin left part-used is the fullest one. Rows with nothing available are skipped.

export type Id = string | number

export interface StockRow {
  binCode: string
  binId: Id
  lotId: Id | null
  lotCode: string | null
  /** When the lot was received (ISO text or Date); the lot's age is its earliest row. */
  receivedAt: string | Date
  /** On hand less reserved: what may be allocated. */
  available: number
  onHand: number
}

export interface AllocationLine {
  binId: Id
  binCode: string
  lotId: Id | null
  lotCode: string | null
  qty: number
}

export interface AllocationResult {
  lines: AllocationLine[]
  allocated: number
  shortage: number
  lotsUsed: number
  explanation: string[]
}

export interface AllocationOptions {
  matchLot: boolean
}

interface Lot {
  key: string
  lotId: Id | null
  lotCode: string | null
  receivedMs: number
  total: number
  /** Rows in bin order (smallest available first). */
  rows: StockRow[]
}

function usable(row: StockRow): number {
  return Math.max(0, row.available)
}

function lotLabel(lot: Lot): string {
  return lot.lotCode ?? (lot.lotId === null ? 'no lot' : String(lot.lotId))
}

function timeOf(value: string | Date): number {
  const ms = value instanceof Date ? value.getTime() : Date.parse(value)
  if (Number.isNaN(ms)) throw new RangeError(`receivedAt is not a date: ${String(value)}`)
  return ms
}

function compareText(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0
}

function byAge(a: Lot, b: Lot): number {
  return a.receivedMs - b.receivedMs || compareText(a.lotCode ?? '', b.lotCode ?? '') || compareText(a.key, b.key)
}

function groupLots(rows: readonly StockRow[]): Lot[] {
  const lots = new Map<string, Lot>()
  for (const row of rows) {
    if (!Number.isSafeInteger(row.available) || !Number.isSafeInteger(row.onHand)) throw new RangeError(`bin ${row.binCode}: quantities must be integers`)
    const received = timeOf(row.receivedAt)
    if (usable(row) === 0) continue
    const key = row.lotId === null ? '∅' : `${typeof row.lotId}:${row.lotId}`
    const lot = lots.get(key) ?? { key, lotId: row.lotId, lotCode: row.lotCode, receivedMs: received, total: 0, rows: [] }
    lot.receivedMs = Math.min(lot.receivedMs, received)
    lot.total += usable(row)
    lot.rows.push(row)
    lots.set(key, lot)
  }
  for (const lot of lots.values()) {
    lot.rows.sort((a, b) => usable(a) - usable(b) || compareText(a.binCode, b.binCode) || compareText(String(a.binId), String(b.binId)))
  }
  return [...lots.values()].sort(byAge)
}

function takeFromLot(lot: Lot, qty: number): AllocationLine[] {
  const lines: AllocationLine[] = []
  let rest = qty
  for (const row of lot.rows) {
    if (rest === 0) break
    const take = Math.min(rest, usable(row))
    lines.push({ binId: row.binId, binCode: row.binCode, lotId: row.lotId, lotCode: row.lotCode, qty: take })
    rest -= take
  }
  return lines
}

/** How many bins this pick leaves physically empty. */
function binsEmptied(lot: Lot, qty: number): number {
  const rowsByBin = new Map(lot.rows.map((r) => [r.binId, r]))
  return takeFromLot(lot, qty).filter((l) => rowsByBin.get(l.binId)?.onHand === l.qty).length
}

/** Oldest single lot covering qty, or null. */
function singleCoveringLot(lots: readonly Lot[], qty: number): Lot | null {
  const covering = lots.filter((l) => l.total >= qty)
  if (covering.length === 0) return null
  return [...covering].sort((a, b) => a.receivedMs - b.receivedMs || binsEmptied(b, qty) - binsEmptied(a, qty) || byAge(a, b))[0]
}

/**
 * Fewest lots covering qty, oldest first. k = how many of the largest lots are needed; then walk the lots by age
 * and keep a lot whenever the rest can still be covered by the largest remaining lots in the slots left
 * (a skipped lot is never needed: some cover from the later lots still exists). Short stock: every lot.
 */
function fewestCoveringLots(lots: readonly Lot[], qty: number): Lot[] {
  if (lots.reduce((a, l) => a + l.total, 0) < qty) return [...lots]
  const totalsDesc = lots.map((l) => l.total).sort((a, b) => b - a)
  let k = 0
  for (let sum = 0; sum < qty && k < totalsDesc.length; k++) sum += totalsDesc[k]
  const chosen: Lot[] = []
  let need = qty
  for (let i = 0; i < lots.length && chosen.length < k && need > 0; i++) {
    const slotsAfter = k - chosen.length - 1
    const bestRest = lots.slice(i + 1).map((l) => l.total).sort((a, b) => b - a).slice(0, slotsAfter).reduce((a, b) => a + b, 0)
    if (lots[i].total + bestRest >= need) {
      chosen.push(lots[i])
      need -= lots[i].total
    }
  }
  return chosen
}

function allocateFromLots(lots: readonly Lot[], qty: number): AllocationLine[] {
  const lines: AllocationLine[] = []
  let rest = qty
  for (const lot of lots) {
    if (rest === 0) break
    const take = Math.min(rest, lot.total)
    lines.push(...takeFromLot(lot, take))
    rest -= take
  }
  return lines
}

/** Allocates `requested` units of one item from its stock rows; never more than any row has available. */
export function allocateStock(requested: number, rows: readonly StockRow[], options: AllocationOptions): AllocationResult {
  if (!Number.isSafeInteger(requested) || requested < 0) throw new RangeError(`requested must be a non-negative integer, got ${requested}`)
  const lots = groupLots(rows)
  const available = lots.reduce((a, l) => a + l.total, 0)
  const explanation = [`requested ${requested}; ${available} available in ${lots.length} lot(s)`]
  let chosen: Lot[]
  if (requested === 0) chosen = []
  else if (!options.matchLot) {
    chosen = lots
    explanation.push('oldest lot first (FIFO)')
  } else {
    const single = singleCoveringLot(lots, requested)
    if (single) explanation.push(`lot ${lotLabel(single)} covers all ${requested}: one lot, so one tint; oldest such lot`)
    else explanation.push(available >= requested
      ? `no single lot covers ${requested}: fewest lots that do, oldest first`
      : `short: all lots used, oldest first`)
    chosen = single ? [single] : fewestCoveringLots(lots, requested)
  }
  const lines = allocateFromLots(chosen, requested)
  const allocated = lines.reduce((a, l) => a + l.qty, 0)
  const lotsUsed = new Set(lines.map((l) => (l.lotId === null ? '∅' : `${typeof l.lotId}:${l.lotId}`))).size
  if (allocated < requested) explanation.push(`short by ${requested - allocated}`)
  explanation.push('within a lot: smallest available bin first, so part-used bins are emptied')
  return { lines, allocated, shortage: requested - allocated, lotsUsed, explanation }
}
