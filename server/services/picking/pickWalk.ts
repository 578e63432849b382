// A warehouse's walking path as walkOrder reads it (the warehouse's settings edit it).
import { In, type EntityManager } from 'typeorm'
import { parseBinCode, walkOrder, type WalkConfig } from '../../../shared/inventory/walkOrder.js'
import { OPEN_PICK_STATUSES, type WalkWarehouse } from '../../../shared/schemas/picking.js'
import { Bin } from '../../entities/Bin.js'
import { Warehouse } from '../../entities/Warehouse.js'

export const aisleList = (text: string) => text.split(',').map((a) => a.trim()).filter(Boolean)

export function walkConfigOf(wh: Warehouse): WalkConfig {
  let binPattern: string | undefined = wh.binPattern
  try {
    new RegExp(binPattern, 'i')
  } catch {
    binPattern = undefined // a broken stored pattern falls back to aisle-bay-level
  }
  const aisles = aisleList(wh.aisleOrder)
  return { binPattern, aisleOrder: aisles.length ? aisles : undefined, direction: wh.walkDirection === 'oneWay' ? 'oneWay' : 'serpentine' }
}

export async function listWalkWarehouses(em: EntityManager): Promise<WalkWarehouse[]> {
  const warehouses = await em.find(Warehouse, { where: { active: true }, order: { code: 'ASC' } })
  if (!warehouses.length) return []
  const bins = await em.find(Bin, { where: { warehouseId: In(warehouses.map((w) => w.id)), active: true, kind: 'storage' }, order: { code: 'ASC' } })
  const open = (await em.query(
    'SELECT warehouse_id, COUNT(*) AS n FROM pick_lists WHERE status IN (?) GROUP BY warehouse_id',
    [OPEN_PICK_STATUSES],
  )) as { warehouse_id: number; n: string }[]
  return warehouses.map((wh) => {
    const config = walkConfigOf(wh)
    const codes = bins.filter((b) => b.warehouseId === wh.id).map((b) => b.code)
    const aisles = [...new Set(codes.flatMap((c) => parseBinCode(c, config)?.aisle ?? []))].sort()
    // A sample spread over the aisles, in walking order, for the preview on the setup screen.
    const sample = walkOrder(codes.filter((_, i) => i % Math.max(1, Math.ceil(codes.length / 60)) === 0).map((binCode) => ({ binCode })), config)
    return {
      id: wh.id, code: wh.code, name: wh.name, binPattern: wh.binPattern, aisleOrder: aisleList(wh.aisleOrder),
      walkDirection: config.direction, aisles, sampleBins: sample.map((s) => s.binCode),
      openPickLists: Number(open.find((o) => Number(o.warehouse_id) === wh.id)?.n ?? 0),
    }
  })
}
