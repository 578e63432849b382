// An in-memory stand-in for the stock service, used only to generate the demo history fast:
// the same rules (signed moves, no balance below zero, moving-average cost per item and warehouse
// blended on receipts and transfers in), written out afterwards with bulk inserts.
import type { MoveType } from '../../shared/catalog.js'
import { applyReceipt, EMPTY_COST_STATE } from '../../shared/inventory/movingAverage.js'

export interface DemoMove {
  at: Date
  moveType: MoveType
  itemId: number
  warehouseId: number
  binId: number
  lotId: number | null
  qty: number
  unitCost: string | null
  docType: string | null
  docId: number | null
  docLineId: number | null
  reason: string | null
  note: string | null
  batchId: string
  userId: number | null
}

export interface DemoBalance {
  itemId: number
  warehouseId: number
  binId: number
  lotId: number | null
  onHand: number
}

export interface MoveInput {
  moveType: MoveType
  itemId: number
  warehouseId: number
  binId: number
  lotId: number | null
  qty: number
  unitCost?: string | null
  doc?: { docType: string; docId: number; docLineId: number | null }
  reason?: string | null
  note?: string | null
}

const pairKey = (itemId: number, warehouseId: number) => `${itemId}|${warehouseId}`

export class DemoLedger {
  readonly moves: DemoMove[] = []
  readonly balances = new Map<string, DemoBalance>()
  private readonly byPair = new Map<string, DemoBalance[]>()
  private readonly averages = new Map<string, string>()

  constructor(private readonly newBatchId: () => string) {}

  onHand(itemId: number, warehouseId: number): number {
    return (this.byPair.get(pairKey(itemId, warehouseId)) ?? []).reduce((sum, b) => sum + b.onHand, 0)
  }

  /** Balances of an item in a warehouse that hold stock, oldest lot first. */
  stocked(itemId: number, warehouseId: number, binIds?: ReadonlySet<number>): DemoBalance[] {
    return (this.byPair.get(pairKey(itemId, warehouseId)) ?? [])
      .filter((b) => b.onHand > 0 && (!binIds || binIds.has(b.binId)))
      .sort((a, b) => (a.lotId ?? 0) - (b.lotId ?? 0) || a.binId - b.binId)
  }

  average(itemId: number, warehouseId: number): string {
    return this.averages.get(pairKey(itemId, warehouseId)) ?? EMPTY_COST_STATE.averageCost
  }

  averagesByPair(): Map<string, string> {
    return this.averages
  }

  /** Blends a receipt (or transfer in) into the warehouse's moving average before the stock lands. */
  blendIn(itemId: number, warehouseId: number, qty: number, unitCost: string): void {
    const state = { onHand: this.onHand(itemId, warehouseId), averageCost: this.average(itemId, warehouseId) }
    this.averages.set(pairKey(itemId, warehouseId), applyReceipt(state, qty, unitCost).after.averageCost)
  }

  private balance(m: MoveInput): DemoBalance {
    const key = `${m.itemId}:${m.binId}:${m.lotId ?? 0}`
    let bal = this.balances.get(key)
    if (!bal) {
      bal = { itemId: m.itemId, warehouseId: m.warehouseId, binId: m.binId, lotId: m.lotId, onHand: 0 }
      this.balances.set(key, bal)
      const pair = pairKey(m.itemId, m.warehouseId)
      this.byPair.set(pair, [...(this.byPair.get(pair) ?? []), bal])
    }
    return bal
  }

  /** Applies one operation's moves together (one batch); refuses anything that would go below zero. */
  post(at: Date, userId: number | null, inputs: readonly MoveInput[], batchId = this.newBatchId()): string {
    for (const m of inputs) {
      if (!Number.isSafeInteger(m.qty) || m.qty === 0) throw new RangeError(`demo move of ${m.qty}`)
      const bal = this.balance(m)
      if (bal.onHand + m.qty < 0) throw new RangeError(`demo history would take item ${m.itemId} below zero in bin ${m.binId}`)
      bal.onHand += m.qty
      this.moves.push({
        at, moveType: m.moveType, itemId: m.itemId, warehouseId: m.warehouseId, binId: m.binId, lotId: m.lotId, qty: m.qty,
        unitCost: m.unitCost ?? null, docType: m.doc?.docType ?? null, docId: m.doc?.docId ?? null, docLineId: m.doc?.docLineId ?? null,
        reason: m.reason ?? null, note: m.note ?? null, batchId, userId,
      })
    }
    return batchId
  }
}
