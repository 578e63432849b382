// The designed access of every API route: who may call it. The role-matrix test checks that the
// server's route table matches this list exactly and that each role gets the designed answer.
// A new route adds its row here (see DEVELOPERS.md, "Adding a route").
import type { Role } from '../../shared/roles.js'

export const EVERYONE: Role[] = ['admin', 'counter', 'warehouse', 'buyer', 'viewer']

export interface MatrixRow {
  /** 'public' or the roles that may call it; every other role gets 403, signed-out 401. */
  access: 'public' | Role[]
  /** The call ends or changes the caller's session: use a fresh sign-in for it. */
  freshSession?: boolean
  /** A query string that keeps a heavy read small (the matrix checks access, not the data). */
  query?: string
  /**
   * The route can answer with a cost: a real request for it (placeholders filled from the cost
   * fixture: {item}, {sku}, {warehouse}, {vendor}, {po}, {poNumber}). The cost test calls it as every
   * role allowed and asserts costs reach exactly the roles the cost rule allows.
   */
  costs?: string
}

// The cost rule as DEVELOPERS.md states it ("Who sees costs"): buyers and admins always, the warehouse
// crew only while the admin setting allows it (off unless a test turns it on), counter and viewer never. The
// names below are the API's documented cost fields, written out here rather than taken from the server.
export const COST_ROLES: readonly Role[] = ['admin', 'buyer']
export const COST_KEYS: readonly string[] = [
  'cost', 'avgCost', 'unitCost', 'previousCost', 'lineTotal', 'orderTotal', 'moveValue', 'annualValue', 'annualValueTotal', 'costPerOrder',
  'valueOff', 'valueNet', 'varianceValue', 'stockValue', 'usageValue', 'beginValue', 'endValue', 'averageValue', 'spendValue',
]

/** The cost fields an answer carries, however deep they sit. */
export function costKeysIn(body: unknown, found: string[] = []): string[] {
  if (Array.isArray(body)) for (const v of body) costKeysIn(v, found)
  else if (body && typeof body === 'object' && !Buffer.isBuffer(body)) {
    for (const [k, v] of Object.entries(body)) {
      if (COST_KEYS.includes(k)) found.push(k)
      costKeysIn(v, found)
    }
  }
  return found
}

export const designedAccess: Record<string, MatrixRow> = {
  'GET /api/health': { access: 'public' },
  'POST /api/session': { access: 'public' },
  'GET /api/session': { access: 'public' },
  'DELETE /api/session': { access: EVERYONE, freshSession: true },
  'GET /api/profile': { access: EVERYONE },
  'PATCH /api/profile': { access: EVERYONE },
  'POST /api/profile/password': { access: EVERYONE, freshSession: true },
  'GET /api/users': { access: ['admin'] },
  'POST /api/users': { access: ['admin'] },
  'PATCH /api/users/:id': { access: ['admin'] },
  'POST /api/users/:id/password': { access: ['admin'] },
  // Catalog (items, lots, import/export) and warehouses with bins: everyone signed in reads; the admin
  // keeps the catalog and sets up warehouses; the warehouse crew may note a lot's tint.
  'GET /api/items': { access: EVERYONE, costs: '/api/items?q={sku}' },
  'GET /api/items/export.xlsx': { access: EVERYONE, costs: '/api/items/export.xlsx?q={sku}' },
  'GET /api/items/import/template.xlsx': { access: ['admin'] },
  'POST /api/items/import/preview': { access: ['admin'] },
  'POST /api/items/import/commit': { access: ['admin'] },
  // Bringing a business's own data in (opening stock, …): administrators only.
  'GET /api/imports': { access: ['admin'] },
  'GET /api/imports/runs/current': { access: ['admin'] },
  'GET /api/imports/runs/:id/problems': { access: ['admin'] },
  'POST /api/imports/runs/:id/commit': { access: ['admin'] },
  'GET /api/imports/:kind/template.xlsx': { access: ['admin'] },
  'POST /api/imports/:kind/preview': { access: ['admin'] },
  'POST /api/imports/:kind/commit': { access: ['admin'] },
  'POST /api/imports/:id/reverse': { access: ['admin'] },
  'GET /api/business-export': { access: ['admin'] },
  'POST /api/business-export/jobs': { access: ['admin'] },
  'GET /api/business-export/jobs/current': { access: ['admin'] },
  'GET /api/business-export/jobs/:id/file': { access: ['admin'] },
  'GET /api/setup/printed-logo': { access: ['admin', 'counter', 'warehouse', 'buyer', 'viewer'] },
  // The first-run checklist and the settings it asks for: administrators only.
  'GET /api/setup': { access: ['admin'] },
  'PUT /api/setup/units': { access: ['admin'] },
  'PUT /api/setup/gs1-prefix': { access: ['admin'] },
  'POST /api/setup/dismiss': { access: ['admin'] },
  'PUT /api/setup/logo': { access: ['admin'] },
  'GET /api/setup/logo': { access: ['admin'] },
  'GET /api/items/:id': { access: EVERYONE, costs: '/api/items/{item}' },
  'POST /api/items': { access: ['admin'] },
  'PATCH /api/items/:id': { access: ['admin'] },
  'POST /api/items/:id/deactivate': { access: ['admin'] },
  'GET /api/items/:id/lots': { access: EVERYONE },
  'PATCH /api/items/:id/lots/:lotId': { access: ['admin', 'warehouse'] },
  'GET /api/warehouses': { access: EVERYONE },
  'GET /api/warehouses/:id': { access: EVERYONE },
  'POST /api/warehouses': { access: ['admin'] },
  'PATCH /api/warehouses/:id': { access: ['admin'] },
  'POST /api/warehouses/:id/bins': { access: ['admin'] },
  'POST /api/warehouses/:id/bins/range': { access: ['admin'] },
  'PATCH /api/warehouses/:id/bins/:binId': { access: ['admin'] },
  'DELETE /api/warehouses/:id/bins/:binId': { access: ['admin'] },
  // Stock operations: warehouse crew and admin move stock.
  'POST /api/stock/adjustments': { access: ['admin', 'warehouse'] },
  'POST /api/stock/bin-moves': { access: ['admin', 'warehouse'] },
  'POST /api/stock/issues': { access: ['admin', 'warehouse'] },
  'POST /api/stock/receipts': { access: ['admin', 'warehouse'] },
  'POST /api/stock/transfers': { access: ['admin', 'warehouse'] },
  'POST /api/stock/transfers/:id/receive': { access: ['admin', 'warehouse'] },
  // Stock views: everyone signed in reads levels, bins, lots, the ledger and transfers; admin, warehouse
  // and buyer set the manual minimum per item and warehouse.
  'GET /api/stock/levels': { access: EVERYONE },
  'GET /api/stock/bin-contents': { access: EVERYONE },
  'GET /api/stock/lot-levels': { access: EVERYONE },
  'GET /api/stock/ledger': { access: EVERYONE, query: 'itemId=999999999', costs: '/api/stock/ledger?itemId={item}' },
  'GET /api/stock/ledger/export': { access: EVERYONE, query: 'itemId=999999999', costs: '/api/stock/ledger/export?itemId={item}' },
  'GET /api/stock/transfers': { access: EVERYONE },
  'GET /api/stock/minimums': { access: EVERYONE },
  'PUT /api/stock/minimums/:itemId/:warehouseId': { access: ['admin', 'warehouse', 'buyer'] },
  'GET /api/stock/places': { access: EVERYONE },
  'GET /api/stock/item-options': { access: EVERYONE },
  'GET /api/stock/lookup': { access: EVERYONE },
  // Selling prices: the admin sets levels, price rules, tax per warehouse location and accounts' terms;
  // the counter reads them and prices a list of items ("how much?").
  'GET /api/pricing/levels': { access: ['admin', 'counter'] },
  'POST /api/pricing/levels': { access: ['admin'] },
  'PUT /api/pricing/levels/:id': { access: ['admin'] },
  'DELETE /api/pricing/levels/:id': { access: ['admin'] },
  'GET /api/pricing/rules': { access: ['admin', 'counter'] },
  'POST /api/pricing/rules': { access: ['admin'] },
  'DELETE /api/pricing/rules/:id': { access: ['admin'] },
  'GET /api/pricing/tax-rates': { access: ['admin', 'counter'] },
  'PUT /api/pricing/tax-rates/:warehouseId': { access: ['admin'] },
  'GET /api/pricing/accounts': { access: ['admin', 'counter'] },
  'GET /api/pricing/accounts/:customerId': { access: ['admin', 'counter'] },
  'PUT /api/pricing/accounts/:customerId': { access: ['admin'] },
  'POST /api/pricing/estimate': { access: ['admin', 'counter'] },
  // Quotes: the counter writes, offers, revises and loses them; viewers read them (and their PDF).
  'GET /api/quotes': { access: ['admin', 'counter', 'viewer'] },
  'POST /api/quotes': { access: ['admin', 'counter'] },
  'GET /api/quotes/:id': { access: ['admin', 'counter', 'viewer'] },
  'PUT /api/quotes/:id': { access: ['admin', 'counter'] },
  'POST /api/quotes/:id/revisions': { access: ['admin', 'counter'] },
  'POST /api/quotes/:id/offer': { access: ['admin', 'counter'] },
  'POST /api/quotes/:id/lose': { access: ['admin', 'counter'] },
  'GET /api/quotes/:id/pdf': { access: ['admin', 'counter', 'viewer'] },
  // Sales orders: the counter takes quotes into orders, cancels them and records cash and cheque; the
  // warehouse, the buyer (special orders) and viewers read them. The deposit on made-to-order lines is the admin's.
  'GET /api/sales-orders': { access: EVERYONE },
  'POST /api/sales-orders': { access: ['admin', 'counter'] },
  'GET /api/sales-orders/:id': { access: EVERYONE },
  'POST /api/sales-orders/:id/cancel': { access: ['admin', 'counter'] },
  'GET /api/sales-orders/:id/payments': { access: EVERYONE },
  'POST /api/sales-orders/:id/payments': { access: ['admin', 'counter'] },
  'GET /api/sales-orders/:id/fulfilment': { access: EVERYONE },
  'POST /api/sales-orders/:id/pick-lists': { access: ['admin', 'counter'] },
  'POST /api/sales-orders/:id/lines/:lineId/cancel-rest': { access: ['admin', 'counter'] },
  'POST /api/sales-orders/:id/ready-mail': { access: ['admin', 'counter'] },
  'POST /api/sales-orders/:id/tickets': { access: ['admin', 'counter'] },
  'GET /api/handover-tickets': { access: ['admin', 'counter', 'warehouse', 'viewer'] },
  'GET /api/handover-tickets/:id': { access: ['admin', 'counter', 'warehouse', 'viewer'] },
  'GET /api/handover-tickets/:id/pdf': { access: ['admin', 'counter', 'warehouse', 'viewer'] },
  'GET /api/handover-tickets/:id/signature': { access: ['admin', 'counter', 'warehouse', 'viewer'] },
  'POST /api/handover-tickets/:id/sign': { access: ['admin', 'counter', 'warehouse'] },
  'POST /api/handover-tickets/:id/void': { access: ['admin', 'counter'] },
  'GET /api/sales-settings': { access: ['admin', 'counter'] },
  'PATCH /api/sales-settings': { access: ['admin'] },
  // Counter: contractor accounts, jobs, takeoffs, bills (counter staff and admin; see DEVELOPERS.md).
  'GET /api/customers': { access: ['admin', 'counter'] },
  'POST /api/customers': { access: ['admin', 'counter'] },
  'GET /api/customers/:id': { access: ['admin', 'counter'] },
  'PATCH /api/customers/:id': { access: ['admin', 'counter'] },
  'DELETE /api/customers/:id': { access: ['admin', 'counter'] },
  'GET /api/jobs': { access: ['admin', 'counter'] },
  'POST /api/jobs': { access: ['admin', 'counter'] },
  'GET /api/jobs/:id': { access: ['admin', 'counter'] },
  'PATCH /api/jobs/:id': { access: ['admin', 'counter'] },
  'POST /api/jobs/:id/takeoffs': { access: ['admin', 'counter'] },
  'POST /api/jobs/:id/takeoffs/import': { access: ['admin', 'counter'] },
  'POST /api/jobs/:id/boms': { access: ['admin', 'counter'] },
  'GET /api/takeoffs/catalog': { access: ['admin', 'counter'] },
  'GET /api/takeoffs/import-template': { access: ['admin', 'counter'] },
  'POST /api/takeoffs/compute': { access: ['admin', 'counter'] },
  'GET /api/takeoffs/:id': { access: ['admin', 'counter'] },
  'PUT /api/takeoffs/:id': { access: ['admin', 'counter'] },
  'DELETE /api/takeoffs/:id': { access: ['admin', 'counter'] },
  'GET /api/boms/:id': { access: ['admin', 'counter'] },
  'GET /api/boms/:id/export': { access: ['admin', 'counter'] },
  // Takeoff settings: the counter reads them, an admin changes them.
  'GET /api/takeoff-settings/rules': { access: ['admin', 'counter'] },
  'PUT /api/takeoff-settings/rules/:key': { access: ['admin'] },
  'DELETE /api/takeoff-settings/rules/:key': { access: ['admin'] },
  'GET /api/takeoff-settings/waste': { access: ['admin', 'counter'] },
  'PATCH /api/takeoff-settings/waste': { access: ['admin'] },
  'GET /api/takeoff-settings/figures': { access: ['admin', 'counter'] },
  'PATCH /api/takeoff-settings/figures': { access: ['admin'] },
  'GET /api/takeoff-settings/role-items': { access: ['admin', 'counter'] },
  'POST /api/takeoff-settings/role-items': { access: ['admin'] },
  'PUT /api/takeoff-settings/role-items/:id': { access: ['admin'] },
  'DELETE /api/takeoff-settings/role-items/:id': { access: ['admin'] },
  // Reorder suggestions and policies: buyer and admin (the lines show costs and usage values).
  'GET /api/reorder/suggestions': { access: ['admin', 'buyer'] },
  'GET /api/reorder/choices': { access: ['admin', 'buyer'] },
  'GET /api/reorder/lines/:itemId/:warehouseId': { access: ['admin', 'buyer'], costs: '/api/reorder/lines/{item}/{warehouse}' },
  'GET /api/reorder/abc': { access: ['admin', 'buyer'] },
  'POST /api/reorder/accept': { access: ['admin', 'buyer'] },
  'GET /api/reorder/policies': { access: ['admin', 'buyer'] },
  'POST /api/reorder/policies': { access: ['admin', 'buyer'] },
  'DELETE /api/reorder/policies/:id': { access: ['admin', 'buyer'] },
  // Pick lists: the counter makes, releases and cancels them; the warehouse confirms, completes and ships transfers.
  'GET /api/pick-lists': { access: ['admin', 'counter', 'warehouse'] },
  'GET /api/pick-lists/boms': { access: ['admin', 'counter'] },
  'POST /api/pick-lists/plan': { access: ['admin', 'counter'] },
  'POST /api/pick-lists': { access: ['admin', 'counter'] },
  'GET /api/pick-lists/:id': { access: ['admin', 'counter', 'warehouse'] },
  'POST /api/pick-lists/:id/release': { access: ['admin', 'counter'] },
  'POST /api/pick-lists/:id/cancel': { access: ['admin', 'counter'] },
  'POST /api/pick-lists/:id/confirmations': { access: ['admin', 'warehouse'] },
  'POST /api/pick-lists/:id/discards': { access: ['admin', 'warehouse'] },
  'POST /api/pick-lists/:id/short-resolutions': { access: ['admin', 'counter', 'warehouse'] },
  'POST /api/pick-lists/:id/complete': { access: ['admin', 'warehouse'] },
  'POST /api/pick-lists/:id/transfers/ship': { access: ['admin', 'warehouse'] },
  'GET /api/picking/warehouses': { access: ['admin', 'counter', 'warehouse'] },
  // Purchasing: buyer and admin keep vendors and create, approve, send and close POs; the warehouse reads
  // POs (costs hidden unless the admin allows them) and receives; the counter reads a job's purchase lines.
  'GET /api/vendors': { access: ['admin', 'buyer'] },
  'POST /api/vendors': { access: ['admin', 'buyer'] },
  'GET /api/vendors/:id': { access: ['admin', 'buyer'] },
  'PATCH /api/vendors/:id': { access: ['admin', 'buyer'] },
  'GET /api/vendors/:id/items': { access: ['admin', 'buyer'], costs: '/api/vendors/{vendor}/items' },
  'POST /api/vendors/:id/items': { access: ['admin', 'buyer'] },
  'PATCH /api/vendors/:id/items/:itemId': { access: ['admin', 'buyer'] },
  'DELETE /api/vendors/:id/items/:itemId': { access: ['admin', 'buyer'] },
  'GET /api/vendors/price-list/template': { access: ['admin', 'buyer'] },
  'POST /api/vendors/:id/price-list/preview': { access: ['admin', 'buyer'] },
  'POST /api/vendors/:id/price-list/commit': { access: ['admin', 'buyer'] },
  'GET /api/purchase-orders': { access: ['admin', 'buyer', 'warehouse'], costs: '/api/purchase-orders?q={poNumber}' },
  'GET /api/purchase-orders/suggestions': { access: ['admin', 'buyer'], costs: '/api/purchase-orders/suggestions' },
  'PATCH /api/purchase-orders/suggestions/:suggestionId': { access: ['admin', 'buyer'] },
  'POST /api/purchase-orders/suggestions/:suggestionId/dismiss': { access: ['admin', 'buyer'] },
  'GET /api/purchase-orders/special-orders': { access: ['admin', 'buyer'] },
  'GET /api/purchase-orders/export': { access: ['admin', 'buyer'], costs: '/api/purchase-orders/export?ids={po}' },
  'POST /api/purchase-orders': { access: ['admin', 'buyer'] },
  'POST /api/purchase-orders/from-suggestions': { access: ['admin', 'buyer'] },
  'POST /api/purchase-orders/from-job': { access: ['admin', 'buyer'] },
  'GET /api/purchase-orders/:id': { access: ['admin', 'buyer', 'warehouse'], costs: '/api/purchase-orders/{po}' },
  'GET /api/purchase-orders/:id/export': { access: ['admin', 'buyer'], costs: '/api/purchase-orders/{po}/export' },
  // the printable PO goes to the vendor: buyers and admins only, priced (every other role is refused above)
  'GET /api/purchase-orders/:id/pdf': { access: ['admin', 'buyer'], costs: '/api/purchase-orders/{po}/pdf' },
  'PATCH /api/purchase-orders/:id': { access: ['admin', 'buyer'] },
  'POST /api/purchase-orders/:id/lines': { access: ['admin', 'buyer'] },
  'DELETE /api/purchase-orders/:id/lines/:lineId': { access: ['admin', 'buyer'] },
  'POST /api/purchase-orders/:id/approve': { access: ['admin', 'buyer'] },
  'POST /api/purchase-orders/:id/mark-sent': { access: ['admin', 'buyer'] },
  'POST /api/purchase-orders/:id/cancel': { access: ['admin', 'buyer'] },
  'POST /api/purchase-orders/:id/close': { access: ['admin', 'buyer'] },
  'POST /api/purchase-orders/:id/send': { access: ['admin', 'buyer'] },
  'GET /api/purchase-orders/:id/receiving': { access: ['admin', 'warehouse'], costs: '/api/purchase-orders/{po}/receiving' },
  'GET /api/purchase-orders/:id/receipts': { access: ['admin', 'buyer', 'warehouse'] },
  'POST /api/purchase-orders/:id/receipts': { access: ['admin', 'warehouse'] },
  'GET /api/purchasing/items': { access: ['admin', 'buyer'] },
  'GET /api/purchasing/warehouses': { access: ['admin', 'buyer'] },
  'GET /api/purchasing/settings': { access: ['admin'] },
  'PATCH /api/purchasing/settings': { access: ['admin'] },
  'GET /api/purchasing/company': { access: ['admin', 'buyer'] },
  'PUT /api/purchasing/company': { access: ['admin'] },
  'GET /api/purchasing/outbox': { access: ['admin'] },
  'GET /api/purchasing/outbox/:id/attachments/:attachmentId': { access: ['admin'] },
  'POST /api/purchasing/outbox/:id/send-again': { access: ['admin'] },
  'GET /api/jobs/:id/purchase-lines': { access: ['admin', 'counter', 'buyer'] },
  // Handheld outbox reports (counts and reports): devices report, the warehouse start page reads.
  'GET /api/devices/outbox': { access: ['admin', 'warehouse'] },
  'PUT /api/devices/:deviceId/outbox': { access: ['admin', 'warehouse'] },
  // Cycle counts: the warehouse crew opens and counts; reviewers (admin, or the roles the admin chose among
  // warehouse and buyer; the service checks) decide; the admin cancels and sets who reviews.
  'GET /api/counts': { access: ['admin', 'warehouse', 'buyer'] },
  'POST /api/counts': { access: ['admin', 'warehouse'] },
  'GET /api/counts/due': { access: ['admin', 'warehouse'], query: 'warehouseId=999999999' },
  'GET /api/counts/settings': { access: ['admin', 'warehouse', 'buyer'] },
  'PUT /api/counts/settings': { access: ['admin'] },
  'GET /api/counts/history': { access: ['admin', 'warehouse', 'buyer'], query: 'itemId=999999999' },
  'GET /api/counts/accuracy': { access: ['admin', 'warehouse', 'buyer'], query: 'from=2026-01-01&to=2026-01-31' },
  'GET /api/counts/:id': { access: ['admin', 'warehouse', 'buyer'] },
  'GET /api/counts/:id/handheld': { access: ['admin', 'warehouse'] },
  'POST /api/counts/:id/bins/start': { access: ['admin', 'warehouse'] },
  'POST /api/counts/:id/entries': { access: ['admin', 'warehouse'] },
  'POST /api/counts/:id/bins/:binId/finish': { access: ['admin', 'warehouse'] },
  'POST /api/counts/:id/review': { access: ['admin', 'warehouse', 'buyer'] },
  'POST /api/counts/:id/cancel': { access: ['admin'] },
  // Reports: the owner (admin) and the buyer; values under the cost rule.
  // The audit trail: admins only; read and export, never changed through the app.
  'GET /api/audit': { access: ['admin'], query: 'limit=1' },
  'GET /api/audit/export': { access: ['admin'], query: 'from=2020-01-01&to=2020-01-01' },
  // The start page's day at a glance: everyone signed in, a panel per role of theirs (tests/api/todayFigures.test.ts).
  'GET /api/today': { access: EVERYONE },
  'GET /api/reports/stock-valuation': { access: ['admin', 'buyer'], costs: '/api/reports/stock-valuation?warehouseId={warehouse}' },
  'GET /api/reports/turns': { access: ['admin', 'buyer'], costs: '/api/reports/turns?warehouseId={warehouse}' },
  'GET /api/reports/dead-stock': { access: ['admin', 'buyer'], costs: '/api/reports/dead-stock?warehouseId={warehouse}&deadDays=30&slowDays=30&windowDays=30' },
  'GET /api/reports/usage': { access: ['admin', 'buyer'], costs: '/api/reports/usage' },
  'GET /api/reports/vendors': { access: ['admin', 'buyer'], query: 'from=2026-01-01&to=2026-01-31' },
  'GET /api/reports/turns/export': { access: ['admin', 'buyer'], costs: '/api/reports/turns/export?warehouseId={warehouse}' },
  'GET /api/reports/usage/export': { access: ['admin', 'buyer'], query: 'from=2026-01-01&to=2026-01-31' },
  'GET /api/reports/dead-stock/export': { access: ['admin', 'buyer'], query: 'warehouseId=999999999' },
  'GET /api/reports/vendors/export': { access: ['admin', 'buyer'], query: 'from=2026-01-01&to=2026-01-31' },
  // Card payments: the provider's webhook has no session; it is public and proves itself by its signature.
  'POST /api/payments/webhook': { access: 'public' },
  'POST /api/sales-orders/:id/card-deposits': { access: ['admin', 'counter'] },
  'GET /api/sales-orders/:id/card-deposits/:paymentId': { access: ['admin', 'counter'] },
  'POST /api/sales-orders/:id/card-deposits/:paymentId/cancel': { access: ['admin', 'counter'] },
  'POST /api/sales-orders/:id/card-deposits/:paymentId/confirm': { access: ['admin', 'counter'] },
  'GET /api/sales-orders/:id/returns': { access: EVERYONE },
  'POST /api/sales-orders/:id/returns': { access: ['admin', 'counter'] },
}
