// Transfers in the demo history: the yard ships to the showroom or the depot (into its transit bin,
// moving-average cost carried at the yard's average), and the stock is put away a day or two later.
import type { DemoLedger } from './demoLedger.js'
import { allocate } from './demoSales.js'
import type { StockPlan } from './demoStockPlan.js'

export interface DemoTransferRow {
  id: number
  fromWarehouseId: number
  toWarehouseId: number
  status: 'in_transit' | 'received'
  note: string
  shippedBy: number | null
  shippedAt: Date
  receivedBy: number | null
  receivedAt: Date | null
}

export interface DemoTransferLineRow {
  id: number
  transferId: number
  itemId: number
  lotId: number | null
  fromBinId: number
  qty: number
  receivedQty: number
}

export interface TransferRequest {
  plan: StockPlan
  source: StockPlan
  qty: number
}

interface Shipped {
  transfer: DemoTransferRow
  lines: { row: DemoTransferLineRow; plan: StockPlan }[]
}

export class DemoTransfers {
  readonly rows: DemoTransferRow[] = []
  readonly lines: DemoTransferLineRow[] = []

  constructor(
    private readonly ledger: DemoLedger,
    private nextId: number,
    private nextLineId: number,
    private readonly userId: number | null,
  ) {}

  /** Ships what the yard can spare; null when nothing could be picked. */
  ship(requests: readonly TransferRequest[], at: Date): Shipped | null {
    const transferId = this.nextId
    const shipped: Shipped['lines'] = []
    let batchId: string | undefined
    for (const r of requests) {
      for (const piece of allocate(this.ledger, r.source, r.qty, r.plan.item.demo.row.matchLot ?? false)) {
        const row = { id: this.nextLineId++, transferId, itemId: r.plan.item.id, lotId: piece.lotId, fromBinId: piece.binId, qty: piece.qty, receivedQty: 0 }
        const unitCost = this.ledger.average(r.source.item.id, r.source.warehouse.id)
        // Blend line by line, so a second lot of the same item weighs in the first one's units.
        this.ledger.blendIn(r.plan.item.id, r.plan.warehouse.id, piece.qty, unitCost)
        const doc = { docType: 'transfer', docId: transferId, docLineId: row.id }
        const common = { itemId: row.itemId, lotId: row.lotId, qty: piece.qty, unitCost, doc }
        batchId = this.ledger.post(at, this.userId, [
          { ...common, moveType: 'transfer_out', warehouseId: r.source.warehouse.id, binId: piece.binId, qty: -piece.qty },
          { ...common, moveType: 'transfer_in', warehouseId: r.plan.warehouse.id, binId: r.plan.warehouse.transitBin },
        ], batchId)
        shipped.push({ row, plan: r.plan })
      }
    }
    if (!shipped.length) return null
    this.nextId++
    const transfer: DemoTransferRow = {
      id: transferId, fromWarehouseId: requests[0].source.warehouse.id, toWarehouseId: requests[0].plan.warehouse.id,
      status: 'in_transit', note: 'Weekly top-up from the yard', shippedBy: this.userId, shippedAt: at, receivedBy: null, receivedAt: null,
    }
    this.rows.push(transfer)
    this.lines.push(...shipped.map((s) => s.row))
    return { transfer, lines: shipped }
  }

  /** Puts the whole transfer away from the transit bin into each item's first storage bin. */
  receive(shipped: Shipped, at: Date): void {
    this.ledger.post(at, this.userId, shipped.lines.flatMap(({ row, plan }) => {
      const common = { moveType: 'bin_move' as const, itemId: row.itemId, warehouseId: plan.warehouse.id, lotId: row.lotId,
        doc: { docType: 'transfer', docId: row.transferId, docLineId: row.id } }
      return [{ ...common, binId: plan.warehouse.transitBin, qty: -row.qty }, { ...common, binId: plan.bins[0], qty: row.qty }]
    }))
    for (const { row } of shipped.lines) row.receivedQty = row.qty
    Object.assign(shipped.transfer, { status: 'received', receivedBy: this.userId, receivedAt: at })
  }
}
