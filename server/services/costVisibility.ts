// Who may see a cost, in one place. Buyers and admins always; the warehouse crew when the admin
// setting allows it; nobody else. The rule is applied at the edges, never by each route:
// - every JSON answer of the API is serialised through `costReplacer` (app.ts installs it as
//   Express's JSON replacer), which drops the keys named in COST_FIELDS for a caller who may not
//   see costs, however deep they sit and whichever route or idempotent replay wrote them;
// - every spreadsheet and document that can show a cost is told by its route whether its reader may
//   see costs (the xlsx writer drops columns marked `cost: true` unless the sheet says `costs: true`; PO
//   sheets and PDFs print prices only when their paper says so).
// The caller's answer is worked out once per API request (`costAccess`, server/http/costAccess.ts), kept in
// `res.locals.costs` and handed on explicitly; whatever was not told otherwise shows none (deny by default).
// A service answers with every cost it has under one of these names; it never checks the role.
import type { DataSource, EntityManager } from 'typeorm'
import type { Role } from '../../shared/roles.js'
import { recentPurchasingSettings, settledPurchasingSettings } from './appSettings.js'

/**
 * The only names under which a cost (what we pay, and sums of it) leaves the server. Never reuse
 * one of them for something else (a count named `total` would vanish for a viewer), and never
 * send a cost under another name.
 */
export const COST_FIELDS: ReadonlySet<string> = new Set([
  'cost', // an item's standard cost
  'avgCost', // moving-average cost in a warehouse
  'unitCost', // a vendor's price, a PO line's cost, a stock move's cost
  'previousCost', // a price list row's cost before the import
  'lineTotal', // a PO line's cost × quantity
  'orderTotal', // a PO's total
  'moveValue', // a stock move's cost × quantity
  'annualValue', // annual usage × cost (reorder, ABC)
  'annualValueTotal',
  'costPerOrder', // the ordering cost S of a reorder policy
  'valueOff', // a count's variances at cost, gross
  'valueNet', // and net
  'varianceValue', // one count line's variance at cost
  'stockValue', // stock on hand at its moving-average cost (reports)
  'usageValue', // what was issued and picked, at the moving-average cost it went out at (reports)
  'beginValue', // stock value at the start of a report's period
  'endValue', // and at its end
  'averageValue', // their average (the denominator of turns)
  'spendValue', // what the purchase orders sent in a period come to (the buyer's start page)
])

/** The same answer when it needs no database read (a role that decides it, or the setting read recently); else undefined. */
export function costsVisibleNow(ds: DataSource, roles: readonly Role[]): boolean | undefined {
  if (roles.includes('admin') || roles.includes('buyer')) return true
  if (!roles.includes('warehouse')) return false
  return settledPurchasingSettings(ds)?.warehouseSeesCosts
}

export async function costsVisibleTo(db: EntityManager | DataSource, roles: readonly Role[]): Promise<boolean> {
  if (roles.includes('admin') || roles.includes('buyer')) return true
  if (!roles.includes('warehouse')) return false
  return (await recentPurchasingSettings(db)).warehouseSeesCosts
}

/**
 * Whether the answer being serialised right now may carry costs. JSON.stringify runs synchronously, so the
 * answer's access is set just for that call (`serialiseFor`) and nothing else can run in between; any
 * other serialisation through the replacer shows none.
 */
let serialisingWithCosts = false

/** Runs a synchronous serialisation (Express's res.json) for a caller who may (or may not) see costs. */
export function serialiseFor<T>(costs: boolean, work: () => T): T {
  const outer = serialisingWithCosts
  serialisingWithCosts = costs
  try {
    return work()
  } finally {
    serialisingWithCosts = outer
  }
}

/** Express's JSON replacer: a cost field is left out of the answer unless its caller may see costs. */
export function costReplacer(key: string, value: unknown): unknown {
  return COST_FIELDS.has(key) && !serialisingWithCosts ? undefined : value
}

/** The columns (of a sheet or a document table) a reader may see: those marked `cost` only with access. */
export function visibleColumns<C extends { cost?: boolean }>(columns: readonly C[], costs: boolean): C[] {
  return costs ? [...columns] : columns.filter((c) => !c.cost)
}
