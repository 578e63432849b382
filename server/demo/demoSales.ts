// Demand in the demo history: counter sales and job picks per warehouse and day (Poisson counts
// scaled by weekday and season, items by popularity), and the odd damaged, found or counted unit.
import type { AdjustmentReason } from '../../shared/catalog.js'
import { atHour, tradeFactor } from './demoCalendar.js'
import type { DemoLedger } from './demoLedger.js'
import type { HistoryUsers } from './demoHistory.js'
import type { PlanWarehouse, StockPlan } from './demoStockPlan.js'
import { LINES_PER_DAY } from './demoStockPlan.js'
import type { SeededRandom } from './seededRandom.js'

export interface Piece {
  binId: number
  lotId: number | null
  qty: number
}

const storageSets = new WeakMap<PlanWarehouse, Set<number>>()
function storageOf(wh: PlanWarehouse): Set<number> {
  let set = storageSets.get(wh)
  if (!set) storageSets.set(wh, (set = new Set(wh.storageBins)))
  return set
}

/**
 * Up to qty from the warehouse's storage bins, oldest lot first. Lot-matched items come from one
 * lot when one lot holds enough (the tint then matches across the wall).
 */
export function allocate(ledger: DemoLedger, plan: StockPlan, qty: number, matchLot: boolean): Piece[] {
  let stock = ledger.stocked(plan.item.id, plan.warehouse.id, storageOf(plan.warehouse))
  if (matchLot) {
    const perLot = new Map<number, number>()
    for (const b of stock) perLot.set(b.lotId ?? 0, (perLot.get(b.lotId ?? 0) ?? 0) + b.onHand)
    const whole = [...perLot.entries()].find(([, total]) => total >= qty)
    if (whole) stock = [...stock.filter((b) => (b.lotId ?? 0) === whole[0]), ...stock.filter((b) => (b.lotId ?? 0) !== whole[0])]
  }
  const pieces: Piece[] = []
  let left = qty
  for (const b of stock) {
    if (left === 0) break
    const take = Math.min(left, b.onHand)
    pieces.push({ binId: b.binId, lotId: b.lotId, qty: take })
    left -= take
  }
  return pieces
}

const ADJUSTMENT_NOTES: Record<AdjustmentReason, string[]> = {
  damaged: ['Cracked when the pallet was moved', 'Chipped face found at pick', 'Broken in the rack'],
  counted: ['Cycle count', 'Count after a busy week'],
  found: ['Found behind a pallet', 'Returned to the wrong bin, found at count'],
  written_off: ['Past shelf life', 'Water-damaged packaging'],
}

interface TimedEvent {
  at: Date
  run: () => void
}

export class DemoSales {
  private readonly byWarehouse = new Map<string, StockPlan[]>()

  constructor(
    private readonly rng: SeededRandom,
    private readonly ledger: DemoLedger,
    plans: readonly StockPlan[],
    private readonly users: HistoryUsers,
  ) {
    for (const p of plans) this.byWarehouse.set(p.warehouse.code, [...(this.byWarehouse.get(p.warehouse.code) ?? []), p])
  }

  eventsFor(date: Date): TimedEvent[] {
    const events: TimedEvent[] = []
    for (const [code, plans] of this.byWarehouse) {
      const selling = plans.filter((p) => p.linesPerDay > 0)
      const lines = this.rng.poisson((LINES_PER_DAY[code] ?? 8) * tradeFactor(date))
      for (let i = 0; i < lines; i++) {
        const plan = this.rng.weighted(selling, (p) => p.linesPerDay)
        const [min, max] = plan.item.demo.lineQty
        const qty = Math.min(max, min + Math.floor((max - min + 1) * this.rng.next() ** 2))
        const at = atHour(date, 7.5 + this.rng.next() * 9)
        events.push({ at, run: () => this.sell(plan, qty, at) })
      }
    }
    return events
  }

  private sell(plan: StockPlan, qty: number, at: Date): void {
    const item = plan.item.demo.row
    const pieces = allocate(this.ledger, plan, qty, item.matchLot ?? false)
    if (!pieces.length) return
    const job = qty >= 40 && (item.family === 'glass_block' || item.family === 'spacer')
    const unitCost = this.ledger.average(plan.item.id, plan.warehouse.id)
    this.ledger.post(at, job ? this.users.warehouse : this.users.counter, pieces.map((piece) => ({
      moveType: job ? ('pick' as const) : ('issue' as const),
      itemId: plan.item.id, warehouseId: plan.warehouse.id, binId: piece.binId, lotId: piece.lotId, qty: -piece.qty,
      unitCost, note: job ? 'Job delivery' : 'Counter sale',
    })))
  }

  adjustmentsFor(date: Date): TimedEvent[] {
    const events: TimedEvent[] = []
    for (const plans of this.byWarehouse.values()) {
      if (!this.rng.chance(0.3)) continue
      const plan = this.rng.pick(plans)
      const at = atHour(date, 15 + this.rng.next() * 2)
      const roll = this.rng.next()
      const reason: AdjustmentReason = roll < 0.45 ? 'damaged' : roll < 0.8 ? 'counted' : roll < 0.92 ? 'found' : 'written_off'
      const size = this.rng.int(1, 3)
      const up = reason === 'found' || (reason === 'counted' && this.rng.chance(0.4))
      events.push({ at, run: () => this.adjust(plan, reason, up ? size : -size, at) })
    }
    return events
  }

  private adjust(plan: StockPlan, reason: AdjustmentReason, delta: number, at: Date): void {
    const stock = this.ledger.stocked(plan.item.id, plan.warehouse.id, storageOf(plan.warehouse))
    if (!stock.length) return
    const bal = this.rng.pick(stock)
    const qty = delta < 0 ? -Math.min(bal.onHand, -delta) : delta
    this.ledger.post(at, this.users.warehouse, [{
      moveType: reason === 'counted' ? 'count' : 'adjustment',
      itemId: plan.item.id, warehouseId: plan.warehouse.id, binId: bal.binId, lotId: bal.lotId, qty,
      unitCost: this.ledger.average(plan.item.id, plan.warehouse.id), reason, note: this.rng.pick(ADJUSTMENT_NOTES[reason]),
    }])
  }
}
