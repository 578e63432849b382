// Loads the items, bins and lots an operation names, once, and checks they fit together.
import { In, type EntityManager } from 'typeorm'
import type { Bin } from '../../entities/Bin.js'
import { Item } from '../../entities/Item.js'
import type { Lot } from '../../entities/Lot.js'
import { AppError } from '../../errors.js'
import { currentBinsById, currentLotsById } from './currentRows.js'

export interface Lookups {
  item(id: number): Item
  bin(id: number): Bin
  lot(id: number | null): Lot | null
  describe(k: { itemId: number; binId: number; lotId: number | null }): { sku: string; binCode: string; lotCode: string | null }
}

export async function loadLookups(
  em: EntityManager,
  refs: readonly { itemId: number; binId: number; lotId: number | null }[],
): Promise<Lookups> {
  const ids = (pick: (r: (typeof refs)[number]) => number | null) => [...new Set(refs.map(pick).filter((v): v is number => v !== null))]
  // Bins and lots with a current read: a transit bin or lot created by a concurrent request after this
  // transaction's snapshot is invisible to a plain read under REPEATABLE READ (a 404 for a real bin).
  const items = await em.findBy(Item, { id: In(ids((r) => r.itemId)) })
  const bins = await currentBinsById(em, ids((r) => r.binId))
  const lots = await currentLotsById(em, ids((r) => r.lotId))
  const itemMap = new Map(items.map((i) => [i.id, i]))
  const binMap = new Map(bins.map((b) => [b.id, b]))
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
    describe: (k) => ({
      sku: itemMap.get(k.itemId)!.sku,
      binCode: binMap.get(k.binId)!.code,
      lotCode: k.lotId === null ? null : lotMap.get(k.lotId)!.code,
    }),
  }
}
