// Which demo items each warehouse stocks, in which bins, and the reorder point and order-up-to
// level the simulated yard keeps them at (from the expected daily demand and the lead time).
import type { DemoItem } from './demoItemTypes.js'

export interface PlanWarehouse {
  id: number
  code: string
  /** Storage bins in walking order. */
  storageBins: number[]
  receivingBin: number
  transitBin: number
}

export interface PlanSource {
  vendorId: number
  unitCost: string
  leadDays: number
  packQty: number
  minOrderQty: number
}

export interface PlanItem {
  id: number
  demo: DemoItem
  source: PlanSource | null
}

export interface StockPlan {
  item: PlanItem
  warehouse: PlanWarehouse
  bins: number[]
  /** Mean sale lines per open day for this item here. */
  linesPerDay: number
  reorderPoint: number
  orderUpTo: number
  pack: number
}

/** Mean sale lines per open day, per warehouse (the yard sells most). */
export const LINES_PER_DAY: Record<string, number> = { HRY: 40, MBS: 14, EKD: 14 }
const DEFAULT_LINES_PER_DAY = 8

function stockedAt(code: string, d: DemoItem): boolean {
  const row = d.row
  if (row.madeToOrder) return false
  if (code === 'HRY') return true
  if (row.family === 'wall_section') return false
  const metric = /^\d{3}x\d{2,3}$/.test(row.nominalSize ?? '')
  if (code === 'MBS') return row.family !== 'glass_block' || (!metric && d.popularity >= 0.4)
  if (row.family === 'glass_block') return metric || (row.nominalSize === '8x8' && d.popularity >= 1)
  return d.popularity >= 1
}

const roundUp = (qty: number, pack: number) => Math.max(pack, Math.ceil(qty / pack) * pack)

function levels(d: DemoItem, linesPerDay: number, source: PlanSource | null): { reorderPoint: number; orderUpTo: number; pack: number } {
  const [min, max] = d.lineQty
  // Line quantities are drawn as min + (max − min)·r², whose mean is min + (max − min)/3.
  const perDay = linesPerDay * (min + (max - min) / 3)
  const pack = d.row.caseQty ?? 1
  const leadDays = source?.leadDays ?? 7
  const reorderPoint = roundUp(perDay * (leadDays * (6 / 7) + 6), pack)
  const orderUpTo = roundUp(reorderPoint + perDay * 30, pack)
  return { reorderPoint, orderUpTo, pack }
}

/** Bins per warehouse: in walking order, busy blocks get a second (overflow) bin; bins are shared once used up. */
export function planStock(items: readonly PlanItem[], warehouses: readonly PlanWarehouse[]): StockPlan[] {
  const plans: StockPlan[] = []
  for (const wh of warehouses) {
    const here = items.filter((i) => stockedAt(wh.code, i.demo)).sort((a, b) => b.demo.popularity - a.demo.popularity || a.id - b.id)
    const totalPopularity = here.reduce((sum, i) => sum + i.demo.popularity, 0)
    const lines = LINES_PER_DAY[wh.code] ?? DEFAULT_LINES_PER_DAY
    let next = 0
    const takeBin = () => wh.storageBins[next++ % wh.storageBins.length]
    for (const item of here) {
      const bins = [takeBin()]
      if (item.demo.row.family === 'glass_block' && item.demo.popularity >= 2) bins.push(takeBin())
      const linesPerDay = (lines * item.demo.popularity) / totalPopularity
      plans.push({ item, warehouse: wh, bins, linesPerDay, ...levels(item.demo, linesPerDay, item.source) })
    }
  }
  return plans
}
