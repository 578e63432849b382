// The data a page asks for the moment it opens, from the page's address. Both sides read this one list: the
// client's router starts these requests beside the page's code (src/router/index.ts), and the server names them
// in the page's HTML as <link rel="preload" as="fetch"> (server/http/pagePreloads.ts), so they are on their way
// before any script has arrived. A preloaded answer is used only by a request for the identical URL, hence
// one definition of the addresses and their query strings.

/** Query values of a page's address as the router or Express reads them (a repeated key gives a list). */
export type PageQuery = Record<string, unknown>

export type QueryValues = Record<string, string | number | boolean | readonly string[] | null | undefined>

/** A query string from filters, leaving out empty ones; lists become comma-separated. */
export function toQuery(values: QueryValues): string {
  const params = new URLSearchParams()
  for (const [k, v] of Object.entries(values)) {
    if (v === undefined || v === null || v === '' || (Array.isArray(v) && !v.length)) continue
    params.set(k, Array.isArray(v) ? v.join(',') : String(v))
  }
  const text = params.toString()
  return text ? `?${text}` : ''
}

/** The stock API's read paths that a page opens with (under /api). */
export const stockPaths = {
  levels: (q: QueryValues) => `/stock/levels${toQuery(q)}`,
  places: '/stock/places',
}

/** The stock levels page's server filters. */
export interface LevelFilters {
  warehouseId: number | null
  family: string
  q: string
  lowOnly: boolean
  includeEmpty: boolean
}

const first = (v: unknown): string | undefined => (typeof v === 'string' ? v : Array.isArray(v) && typeof v[0] === 'string' ? v[0] : undefined)

/** The stock levels page's filters from its address: the page starts with them, and its opening data asks for the same rows. */
export function levelFiltersFrom(query: PageQuery): LevelFilters {
  const warehouseId = Number(first(query.warehouseId))
  return {
    warehouseId: Number.isInteger(warehouseId) && warehouseId > 0 ? warehouseId : null,
    family: '',
    q: '',
    lowOnly: first(query.lowOnly) === 'true',
    includeEmpty: false,
  }
}

/** Each page's opening requests (GET paths under /api) by the page's path. */
const OPENING_DATA: Record<string, (query: PageQuery) => string[]> = {
  '/stock/overview': (query) => [stockPaths.levels({ ...levelFiltersFrom(query) }), stockPaths.places],
}

/** The GET paths (under /api) the page at this address asks for as it opens; none for a page not listed. */
export function openingData(path: string, query: PageQuery): string[] {
  const page = OPENING_DATA[path.length > 1 ? path.replace(/\/+$/, '') : path]
  return page ? page(query) : []
}
