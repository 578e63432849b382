// The audit trail's kinds: every action the server records belongs to one, so the admin can filter by
// what happened (sign-ins, roles, passwords, stock, documents, settings, other records). Stock moves come
// from the stock ledger itself (append-only, one row per move), the rest from audit_entries.

export const AUDIT_KINDS = ['sign_in', 'roles', 'password', 'stock_move', 'document', 'settings', 'records'] as const
export type AuditKind = (typeof AUDIT_KINDS)[number]

/** Every action written to audit_entries, with its kind. A new audit(…) action is added here (a unit test checks). */
export const AUDIT_ACTIONS = {
  'session.sign_in': 'sign_in',
  'session.sign_in_failed': 'sign_in',
  'session.sign_in_refused': 'sign_in',
  'session.sign_out': 'sign_in',
  'user.create': 'roles',
  'user.roles': 'roles',
  'user.update': 'roles',
  'user.reset-password': 'password',
  'user.change-password': 'password',
  'po.create': 'document',
  'po.update': 'document',
  'po.line_add': 'document',
  'po.line_remove': 'document',
  'po.lines_joined': 'document',
  'po.approved': 'document',
  'po.sent': 'document',
  'po.send_failed': 'document',
  'po.cancelled': 'document',
  'po.closed': 'document',
  'po.receipt': 'document',
  'po.received': 'document',
  'pick_list.create': 'document',
  'pick_list.release': 'document',
  'pick_list.start': 'document',
  'pick_list.picked': 'document',
  'pick_list.cancel': 'document',
  'pick_confirmation.discard': 'document',
  'pick_line.short_resolve': 'document',
  'count.open': 'document',
  'count.bin_take_over': 'document',
  'count.review': 'document',
  'count.close': 'document',
  'count.cancel': 'document',
  'transfer.ship': 'document',
  'transfer.receive': 'document',
  'job.create': 'document',
  'job.update': 'document',
  'takeoff.create': 'document',
  'takeoff.import': 'document',
  'takeoff.update': 'document',
  'takeoff.delete': 'document',
  'bom.save': 'document',
  'reorder.accept': 'document',
  'quote.create': 'document',
  'quote.update': 'document',
  'quote.revise': 'document',
  'quote.offered': 'document',
  'quote.offer_failed': 'document',
  'quote.lost': 'document',
  'suggestion.update': 'document',
  'suggestion.dismiss': 'document',
  'settings.update': 'settings',
  'settings.company_profile': 'settings',
  'settings.company_logo': 'settings',
  'settings.units': 'settings',
  'settings.gs1_prefix': 'settings',
  'settings.setup_dismissed': 'settings',
  'takeoff.rule.save': 'settings',
  'takeoff.rule.reset': 'settings',
  'takeoff.waste.update': 'settings',
  'takeoff.figures.update': 'settings',
  'takeoff.role-item.create': 'settings',
  'takeoff.role-item.update': 'settings',
  'takeoff.role-item.delete': 'settings',
  'reorder.policy.create': 'settings',
  'reorder.policy.update': 'settings',
  'reorder.policy.delete': 'settings',
  'stock.minimum.set': 'settings',
  'price_level.create': 'settings',
  'price_level.update': 'settings',
  'price_level.delete': 'settings',
  'price_rule.create': 'settings',
  'price_rule.delete': 'settings',
  'sales_tax.set': 'settings',
  'item.create': 'records',
  'item.update': 'records',
  'item.deactivate': 'records',
  'item.import': 'records',
  'data_import.commit': 'records',
  'data_import.reverse': 'records',
  'lot.update': 'records',
  'customer.create': 'records',
  'customer.update': 'records',
  'customer.delete': 'records',
  'customer.terms': 'records',
  'vendor.create': 'records',
  'vendor.update': 'records',
  'vendor_item.create': 'records',
  'vendor_item.update': 'records',
  'vendor_item.delete': 'records',
  'vendor_item.import': 'records',
  'warehouse.create': 'records',
  'warehouse.update': 'records',
  'bin.create': 'records',
  'bin.create-range': 'records',
  'bin.update': 'records',
  'bin.delete': 'records',
} as const satisfies Record<string, Exclude<AuditKind, 'stock_move'>>

export type AuditAction = keyof typeof AUDIT_ACTIONS

export function auditKindOf(action: string): AuditKind {
  return (AUDIT_ACTIONS as Record<string, AuditKind>)[action] ?? 'records'
}

/** The actions of a kind (for filtering in SQL). */
export function actionsOfKind(kind: AuditKind): string[] {
  return Object.entries(AUDIT_ACTIONS).filter(([, k]) => k === kind).map(([a]) => a)
}

/** The message key of an action ('po.send_failed' → 'po_send_failed'): vue-i18n keys hold no dots. */
export const actionKey = (action: string) => action.replace(/[.-]/g, '_')
