import type { ItemFamily, StockUnit } from '../../shared/catalog.js'
import type { Item } from '../entities/Item.js'

/** One demo catalog item: its table row plus what the history simulation needs to sell it. */
export interface DemoItem {
  row: Partial<Item> & { sku: string; name: string; family: ItemFamily; stockUnit: StockUnit; cost: string; listPrice: string }
  /** Relative share of demand (any scale). */
  popularity: number
  /** Typical quantity on one sale line, in stock units. */
  lineQty: [number, number]
}
