// The stock levels page's server filters, from its address: the page starts with them and the router
// asks for the same rows while the page's code is still loading (meta.prefetch).
import type { LocationQuery } from 'vue-router'

export interface LevelFilters {
  warehouseId: number | null
  family: string
  q: string
  lowOnly: boolean
  includeEmpty: boolean
}

export function levelFiltersFrom(query: LocationQuery): LevelFilters {
  return {
    warehouseId: query.warehouseId ? Number(query.warehouseId) : null,
    family: '',
    q: '',
    lowOnly: query.lowOnly === 'true',
    includeEmpty: false,
  }
}
