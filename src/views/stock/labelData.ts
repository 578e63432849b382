// What each label says, for bins, items or lots, built from the payload definitions in
// shared/barcode/scan.ts so printing and scanning agree.
import { binLabelPayload, itemLabelPayload, lotLabelPayload, type LabelPayload } from '@shared/barcode/scan'
import { catalogApi } from '@/api/catalog'
import { warehousesApi } from '@/api/warehouses'
import type { LabelSpec } from '@/components/labels/labelSpec'

export type LabelKind = 'bin' | 'item' | 'lot'

export interface LabelQuery {
  kind: LabelKind
  warehouseId?: number
  itemId?: number
  ids: number[]
}

function build(key: string, make: () => LabelPayload, title: string, lines: string[], qr: boolean): LabelSpec {
  try {
    return { key, payload: make(), problem: null, title, lines, qr }
  } catch (err) {
    return { key, payload: null, problem: err instanceof Error ? err.message : String(err), title, lines, qr }
  }
}

async function binLabels(q: LabelQuery): Promise<LabelSpec[]> {
  if (!q.warehouseId) return []
  const detail = await warehousesApi.detail(q.warehouseId)
  const wanted = new Set(q.ids)
  return detail.bins
    .filter((b) => (wanted.size ? wanted.has(b.id) : b.kind !== 'transit'))
    .map((b) => build(`bin-${b.id}`, () => binLabelPayload(b.code), b.code, [detail.warehouse.code], false))
}

async function itemLabels(q: LabelQuery): Promise<LabelSpec[]> {
  const details = await Promise.all(q.ids.slice(0, 200).map((id) => catalogApi.item(id)))
  return details.map(({ item }) =>
    build(`item-${item.id}`, () => itemLabelPayload({ sku: item.sku, gtin: item.gtin }), item.sku, [item.name], true))
}

async function lotLabels(q: LabelQuery): Promise<LabelSpec[]> {
  if (!q.itemId) return []
  const [{ item }, lots] = await Promise.all([catalogApi.item(q.itemId), catalogApi.lots(q.itemId)])
  const wanted = new Set(q.ids)
  return lots
    .filter((l) => (wanted.size ? wanted.has(l.id) : l.onHand > 0))
    .map((l) => build(
      `lot-${l.id}`,
      () => lotLabelPayload({ sku: item.sku, lotCode: l.code, gtin: item.gtin }),
      `${item.sku} · ${l.code}`,
      [item.name, [l.receivedAt, l.tintNote].filter(Boolean).join(' · ')],
      true,
    ))
}

export function loadLabels(q: LabelQuery): Promise<LabelSpec[]> {
  if (q.kind === 'bin') return binLabels(q)
  if (q.kind === 'item') return itemLabels(q)
  return lotLabels(q)
}
