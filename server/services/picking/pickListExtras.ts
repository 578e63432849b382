// The parts of a pick list's detail beside its lines: shortages and what was chosen for them,
// and the transfers proposed or shipped from other warehouses.
import { In, type EntityManager } from 'typeorm'
import type { ShortageView, TransferProposalView } from '../../../shared/schemas/picking.js'
import { Item } from '../../entities/Item.js'
import type { PickShortage } from '../../entities/PickList.js'
import { Warehouse } from '../../entities/Warehouse.js'

export async function shortageViews(em: EntityManager, shortages: PickShortage[]): Promise<ShortageView[]> {
  if (!shortages.length) return []
  const itemIds = [...new Set(shortages.flatMap((s) => [s.itemId, ...(s.substituteItemId ? [s.substituteItemId] : [])]))]
  const items = new Map((await em.findBy(Item, { id: In(itemIds) })).map((i) => [i.id, i]))
  const whIds = [...new Set(shortages.flatMap((s) => (s.fromWarehouseId ? [s.fromWarehouseId] : [])))]
  const warehouses = new Map((whIds.length ? await em.findBy(Warehouse, { id: In(whIds) }) : []).map((w) => [w.id, w]))
  const lines = (await em.query('SELECT id, description FROM bom_lines WHERE id IN (?)', [shortages.map((s) => s.bomLineId ?? 0)])) as { id: number; description: string }[]
  return shortages.map((s) => {
    const detail = s.action === 'substitute' ? items.get(s.substituteItemId ?? 0)?.sku ?? null
      : s.action === 'transfer' ? warehouses.get(s.fromWarehouseId ?? 0)?.code ?? null
        : s.action === 'backorder' && s.suggestionId ? `#${s.suggestionId}` : null
    return {
      id: s.id, bomLineId: s.bomLineId, sku: items.get(s.itemId)?.sku ?? '', description: lines.find((l) => Number(l.id) === s.bomLineId)?.description ?? '',
      qty: s.qty, action: s.action, detail,
    }
  })
}

export async function pickTransferViews(em: EntityManager, pickListId: number): Promise<TransferProposalView[]> {
  const rows = (await em.query(
    `SELECT p.id, p.qty, p.status, p.transfer_id, w.id AS wh_id, w.code AS wh_code, w.name AS wh_name, i.sku, b.code AS bin_code, l.code AS lot_code
       FROM pick_transfer_proposals p
       JOIN warehouses w ON w.id = p.from_warehouse_id
       JOIN items i ON i.id = p.item_id
       JOIN bins b ON b.id = p.from_bin_id
       LEFT JOIN lots l ON l.id = p.lot_id
      WHERE p.pick_list_id = ?
      ORDER BY p.id`,
    [pickListId],
  )) as { id: number; qty: number; status: TransferProposalView['status']; transfer_id: number | null; wh_id: number; wh_code: string; wh_name: string; sku: string; bin_code: string; lot_code: string | null }[]
  return rows.map((r) => ({
    id: Number(r.id), fromWarehouse: { id: Number(r.wh_id), code: r.wh_code, name: r.wh_name }, sku: r.sku, binCode: r.bin_code,
    lotCode: r.lot_code, qty: Number(r.qty), status: r.status, transferId: r.transfer_id === null ? null : Number(r.transfer_id),
  }))
}
