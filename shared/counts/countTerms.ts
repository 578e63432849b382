// The words of a cycle count, shared by the server, its schemas and the screens.

/** What a count covers: a whole warehouse, one aisle, a list of bins, the items due by ABC class, or the bins short picks found wrong. */
export const COUNT_SCOPES = ['warehouse', 'aisle', 'bins', 'abc_due', 'short_pick'] as const
export type CountScope = (typeof COUNT_SCOPES)[number]

export const COUNT_STATUSES = ['open', 'closed', 'cancelled'] as const
export type CountStatus = (typeof COUNT_STATUSES)[number]

/** A bin of a count: not yet visited, being counted (snapshot taken), or finished. */
export const COUNT_BIN_STATUSES = ['waiting', 'counting', 'done'] as const
export type CountBinStatus = (typeof COUNT_BIN_STATUSES)[number]

/**
 * One bin × item × lot, one attempt: waiting to be counted; counted with a difference (to review); matched
 * (no difference, settled); approved (the difference became a stock adjustment); recounted (replaced by the
 * next attempt); cancelled with its count.
 */
export const COUNT_LINE_STATUSES = ['waiting', 'counted', 'matched', 'approved', 'recounted', 'cancelled'] as const
export type CountLineStatus = (typeof COUNT_LINE_STATUSES)[number]

/** Why the line exists: planned when the count was opened or the bin started, found by the counter, or asked for by a short pick. */
export const COUNT_LINE_SOURCES = ['planned', 'found', 'short_pick'] as const
export type CountLineSource = (typeof COUNT_LINE_SOURCES)[number]
