// Loads the items, bins and lots an operation names, once, in one statement, and checks they fit together.
// Outgoing moves (an issue, an adjustment) also read the item's moving-average cost in the bin's warehouse
// here, so one read serves the whole operation instead of a bin, an item and a cost row per line.
import type { EntityManager } from 'typeorm'
import { Bin } from '../../entities/Bin.js'
import type { Lot } from '../../entities/Lot.js'
import { sqlOn } from '../../db/onConnection.js'
import { AppError } from '../../errors.js'
import { groupKey } from './balanceLocks.js'
import { currentLotsById } from './currentRows.js'

/** What a stock operation needs of an item. */
export interface LookupItem {
  id: number
  sku: string
  matchLot: boolean
}

export interface Lookups {
  item(id: number): LookupItem
  bin(id: number): Bin
  lot(id: number | null): Lot | null
  /** The moving-average cost of an item in a warehouse ('0.0000' without a cost row); only when loaded with costs. */
  averageCost(itemId: number, warehouseId: number): string
  describe(k: { itemId: number; binId: number; lotId: number | null }): { sku: string; binCode: string; lotCode: string | null }
}

interface LookupRow {
  item_id: number | null
  sku: string | null
  match_lot: number | null
  bin_id: number | null
  warehouse_id: number | null
  bin_code: string | null
  kind: Bin['kind'] | null
  active: number | null
  avg_cost?: string | null
}

export async function loadLookups(
  em: EntityManager,
  refs: readonly { itemId: number; binId: number; lotId: number | null }[],
  opts: { costs?: boolean } = {},
): Promise<Lookups> {
  const pairs = new Map<string, { itemId: number; binId: number }>()
  for (const r of refs) pairs.set(`${r.itemId}:${r.binId}`, { itemId: r.itemId, binId: r.binId })
  const lotIds = [...new Set(refs.map((r) => r.lotId).filter((v): v is number => v !== null))]
  // A share-locked (current) read: a bin or lot created by a concurrent request after this transaction's
  // snapshot is invisible to a plain read under REPEATABLE READ (a 404 for a real bin), and a cost row read
  // this way holds the latest committed average until the operation commits (a receipt blending into it
  // waits; see the lock order in balanceLocks.ts). The named pairs come in as a derived table of literals.
  const named = [...pairs.values()]
  const rows: LookupRow[] = named.length
    ? await sqlOn<LookupRow[]>(
        em,
        `SELECT r.item_id AS ref_item, r.bin_id AS ref_bin, i.id AS item_id, i.sku, i.match_lot, b.id AS bin_id, b.warehouse_id, b.code AS bin_code, b.kind, b.active${
          opts.costs ? ', iw.avg_cost' : ''
        }
         FROM (${named.map(() => 'SELECT CAST(? AS UNSIGNED) AS item_id, CAST(? AS UNSIGNED) AS bin_id').join(' UNION ALL ')}) r
         LEFT JOIN items i ON i.id = r.item_id
         LEFT JOIN bins b ON b.id = r.bin_id${opts.costs ? '\n         LEFT JOIN item_warehouses iw ON iw.item_id = i.id AND iw.warehouse_id = b.warehouse_id' : ''}
         LOCK IN SHARE MODE`,
        named.flatMap((p) => [p.itemId, p.binId]),
      )
    : []
  const lots = await currentLotsById(em, lotIds)
  const itemMap = new Map<number, LookupItem>()
  const binMap = new Map<number, Bin>()
  const costMap = new Map<string, string>()
  for (const r of rows) {
    if (r.item_id !== null) itemMap.set(Number(r.item_id), { id: Number(r.item_id), sku: r.sku!, matchLot: Boolean(Number(r.match_lot)) })
    if (r.bin_id !== null) {
      binMap.set(Number(r.bin_id), Object.assign(new Bin(), {
        id: Number(r.bin_id), warehouseId: Number(r.warehouse_id), code: r.bin_code!, kind: r.kind!, active: Boolean(Number(r.active)),
      }))
    }
    if (r.item_id !== null && r.bin_id !== null && r.avg_cost != null) {
      costMap.set(groupKey({ itemId: Number(r.item_id), warehouseId: Number(r.warehouse_id) }), r.avg_cost)
    }
  }
  const lotMap = new Map(lots.map((l) => [l.id, l]))
  for (const r of refs) {
    if (!itemMap.has(r.itemId)) throw AppError.notFound('item_not_found', `Item ${r.itemId} was not found.`)
    if (!binMap.has(r.binId)) throw AppError.notFound('bin_not_found', `Bin ${r.binId} was not found.`)
    const lot = r.lotId === null ? null : lotMap.get(r.lotId)
    if (r.lotId !== null && !lot) throw AppError.notFound('lot_not_found', `Lot ${r.lotId} was not found.`)
    if (lot && lot.itemId !== r.itemId) {
      const sku = itemMap.get(r.itemId)!.sku
      throw AppError.badRequest('lot_other_item', `Lot ${lot.code} belongs to another item than ${sku}.`, { params: { lot: lot.code, sku } })
    }
  }
  return {
    item: (id) => itemMap.get(id)!,
    bin: (id) => binMap.get(id)!,
    lot: (id) => (id === null ? null : lotMap.get(id)!),
    averageCost: (itemId, warehouseId) => {
      if (!opts.costs) throw new Error('averageCost needs lookups loaded with costs')
      return costMap.get(groupKey({ itemId, warehouseId })) ?? '0.0000'
    },
    describe: (k) => ({
      sku: itemMap.get(k.itemId)!.sku,
      binCode: binMap.get(k.binId)!.code,
      lotCode: k.lotId === null ? null : lotMap.get(k.lotId)!.code,
    }),
  }
}
