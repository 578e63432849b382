// The engine under every stock operation: lock the balances, apply signed moves, refuse anything
// that would make on hand or available negative, write balances and ledger rows together.
// Callers pass their transaction's EntityManager, so a document and its stock change commit as one.
import { randomUUID } from 'node:crypto'
import type { EntityManager } from 'typeorm'
import type { MoveType } from '../../../shared/catalog.js'
import { balanceAfter } from '../../../shared/inventory/balanceAfter.js'
import type { StockBalance } from '../../entities/StockBalance.js'
import { StockMove } from '../../entities/StockMove.js'
import { sqlOn } from '../../db/onConnection.js'
import { blendAverages, COSTED_IN, lockCostRows } from './averageCost.js'
import { balanceKey, groupKey, lockBalances, type WarehouseGroup } from './balanceLocks.js'
import { notEnoughAvailable, notEnoughOnHand } from './stockErrors.js'
import { loadLookups, type Lookups } from './stockLookups.js'

export interface DocRef {
  docType: string
  docId: number
  docLineId?: number | null
}

export interface StockActor {
  userId: number | null
}

export interface MoveSpec {
  moveType: MoveType
  itemId: number
  binId: number
  lotId: number | null
  /** Signed quantity in stock units. */
  qty: number
  unitCost?: string | null
  doc?: DocRef | null
  reason?: string | null
  note?: string | null
  /** Units of this outgoing move that were reserved for it (a pick consuming its reservation). */
  fromReserved?: number
}

export interface AppliedMoves {
  batchId: string
  moves: StockMove[]
  balances: Map<string, StockBalance>
  lookups: Lookups
}

function checkQuantities(specs: readonly MoveSpec[]): void {
  for (const s of specs) {
    if (!Number.isSafeInteger(s.qty) || s.qty === 0) throw new RangeError(`move quantity must be a non-zero integer, got ${s.qty}`)
    const fromReserved = s.fromReserved ?? 0
    if (fromReserved < 0 || fromReserved > Math.abs(s.qty) || (fromReserved > 0 && s.qty > 0)) {
      throw new RangeError('fromReserved must be within an outgoing move')
    }
  }
}

const MOVE_COLUMNS = ['at', 'move_type', 'item_id', 'warehouse_id', 'bin_id', 'lot_id', 'qty', 'unit_cost', 'doc_type', 'doc_id', 'doc_line_id', 'reason', 'note', 'batch_id', 'user_id']
const MOVE_ROW = `(${MOVE_COLUMNS.map(() => '?').join(', ')})`
const INSERT_MOVES = `INSERT INTO stock_moves (${MOVE_COLUMNS.join(', ')}) VALUES `

/** `preloaded`: the lookups the caller already loaded for exactly these moves (one read per operation). */
export async function applyMoves(em: EntityManager, actor: StockActor, specs: readonly MoveSpec[], preloaded?: Lookups): Promise<AppliedMoves> {
  checkQuantities(specs)
  const lookups = preloaded ?? (await loadLookups(em, specs))
  const keys = specs.map((s) => ({ ...s, warehouseId: lookups.bin(s.binId).warehouseId }))
  // Stock coming in at a cost blends into its warehouse's moving average: the cost rows first, then the
  // item's whole balance group there, all in the one lock order (balanceLocks.ts).
  const costed = keys.filter((k) => COSTED_IN.has(k.moveType))
  const groups = new Map<string, WarehouseGroup>(costed.map((k) => [groupKey(k), { itemId: k.itemId, warehouseId: k.warehouseId }]))
  const averages = await lockCostRows(em, [...groups.values()])
  const locked = await lockBalances(em, keys, { create: specs.some((s) => s.qty > 0), wholeGroups: [...groups.values()] })
  if (costed.length) {
    await blendAverages(em, averages, locked.groupOnHand, costed.map((k) => {
      if (k.unitCost == null) throw new RangeError(`a ${k.moveType} needs a unit cost`)
      return { itemId: k.itemId, warehouseId: k.warehouseId, qty: k.qty, unitCost: k.unitCost }
    }))
  }
  const balances = locked.rows
  for (const s of specs) {
    const key = balanceKey(s)
    const bal = balances.get(key)
    const described = lookups.describe(s)
    if (!bal) throw notEnoughOnHand(described, 0, -s.qty)
    const fromReserved = s.fromReserved ?? 0
    if (bal.reserved - fromReserved < 0) throw new RangeError(`reservation of ${described.sku} larger than the reserved quantity`)
    const after = balanceAfter(bal, s.qty, fromReserved)
    if (!after.ok) {
      throw after.problem === 'not_enough_on_hand' ? notEnoughOnHand(described, bal.onHand, -s.qty) : notEnoughAvailable(described, bal.onHand, bal.reserved, -s.qty)
    }
    bal.onHand = after.onHand
    bal.reserved = after.reserved
  }
  // Plain SQL for the two writes every stock move makes: the ORM's update and insert build their statement
  // through its query builder on each call, a measurable share of a stock issue's CPU (npm run bench --cpu-prof).
  for (const bal of balances.values()) {
    await sqlOn(em, 'UPDATE stock_balances SET on_hand = ?, reserved = ?, updated_at = CURRENT_TIMESTAMP WHERE id = ?', [bal.onHand, bal.reserved, bal.id])
  }
  const batchId = randomUUID()
  const at = new Date()
  const moves = specs.map((s) =>
    Object.assign(new StockMove(), {
      at,
      moveType: s.moveType,
      itemId: s.itemId,
      warehouseId: lookups.bin(s.binId).warehouseId,
      binId: s.binId,
      lotId: s.lotId,
      qty: s.qty,
      unitCost: s.unitCost ?? null,
      docType: s.doc?.docType ?? null,
      docId: s.doc?.docId ?? null,
      docLineId: s.doc?.docLineId ?? null,
      reason: s.reason ?? null,
      note: s.note ?? null,
      batchId,
      userId: actor.userId,
    }),
  )
  const inserted = await sqlOn<{ insertId: number | string }>(
    em,
    INSERT_MOVES + moves.map(() => MOVE_ROW).join(', '),
    moves.flatMap((m) => [m.at, m.moveType, m.itemId, m.warehouseId, m.binId, m.lotId, m.qty, m.unitCost, m.docType, m.docId, m.docLineId, m.reason, m.note, m.batchId, m.userId]),
  )
  // One multi-row INSERT of a known row count gets consecutive ids from the first in every InnoDB
  // auto-increment lock mode (source: MySQL Reference Manual, "AUTO_INCREMENT Handling in InnoDB", simple
  // inserts). The ORM's own multi-row insert numbers its rows the same way.
  moves.forEach((m, i) => {
    m.id = String(BigInt(inserted.insertId) + BigInt(i))
  })
  return { batchId, moves, balances, lookups }
}
