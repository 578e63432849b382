// Pick lists: requests (parsed by the server, validated by the client's forms) and answers.
import { z } from 'zod'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import type { HandlingCaution } from '../picking/handling.js'

export const PICK_LIST_STATUSES = ['draft', 'released', 'picking', 'picked', 'cancelled'] as const
export type PickListStatus = (typeof PICK_LIST_STATUSES)[number]
/** Lists the warehouse still works on. */
export const OPEN_PICK_STATUSES: readonly PickListStatus[] = ['draft', 'released', 'picking']

/** Why a line came up short. 'not_picked' is set by a partial completion for lines nobody closed. */
export const SHORT_REASONS = ['not_found', 'damaged', 'short_in_bin', 'wrong_lot_in_bin', 'not_picked'] as const
export type ShortReason = (typeof SHORT_REASONS)[number]

/** What to do about stock a warehouse lacks. */
export const SHORTAGE_ACTIONS = ['leave', 'backorder', 'transfer', 'substitute'] as const
export type ShortageAction = (typeof SHORTAGE_ACTIONS)[number]

export const PICK_MODES = ['single', 'split'] as const
export type PickMode = (typeof PICK_MODES)[number]

const id = z.coerce.number().int().positive()
const note = z.string().trim().max(200).optional().nullable()
const scan = z.string().max(200)

export const pickPlanSchema = z.object({
  bomId: id,
  warehouseId: id,
  /** single: one warehouse, shortages resolved by choice; split: the rest from the other warehouses. */
  mode: z.enum(PICK_MODES).default('single'),
})
export type PickPlanInput = z.infer<typeof pickPlanSchema>

export const shortageChoiceSchema = z
  .object({
    bomLineId: id,
    action: z.enum(SHORTAGE_ACTIONS),
    fromWarehouseId: id.optional().nullable(),
    substituteItemId: id.optional().nullable(),
  })
  .refine((c) => c.action !== 'transfer' || !!c.fromWarehouseId, { path: ['fromWarehouseId'], ...issueOf('transfer_source_needed') })
  .refine((c) => c.action !== 'substitute' || !!c.substituteItemId, { path: ['substituteItemId'], ...issueOf('substitute_needed') })

export const pickCreateSchema = pickPlanSchema.extend({
  release: z.boolean().default(false),
  note,
  shortages: z
    .array(shortageChoiceSchema)
    .max(500)
    .default([])
    .refine((list) => new Set(list.map((c) => c.bomLineId)).size === list.length, issueCode('one_choice_per_line')),
})
export type PickCreateInput = z.infer<typeof pickCreateSchema>

export const pickConfirmSchema = z
  .object({
    lineId: id,
    binScan: scan.trim().min(1),
    itemScan: scan.optional().nullable(),
    lotScan: scan.optional().nullable(),
    qty: z.coerce.number().int().min(0).max(1_000_000),
    /** Closes the line short: what was not there and why. */
    shortReason: z.enum(SHORT_REASONS).optional().nullable(),
    /** When the picker confirmed on the device (it may reach the server much later). */
    scannedAt: z.iso.datetime({ offset: true, error: issueCode('invalid_date') }).optional().nullable(),
  })
  .refine((c) => c.qty > 0 || !!c.shortReason, { path: ['qty'], ...issueOf('qty_or_short') })
  .refine((c) => c.qty === 0 || !!c.itemScan?.trim(), { path: ['itemScan'], ...issueOf('scan_item') })
export type PickConfirmInput = z.infer<typeof pickConfirmSchema>

/** Why a confirmation waiting on a device was dropped instead of sent (recorded on the audit trail). */
export const PICK_DISCARD_REASONS = ['refusal_seen', 'entered_by_mistake', 'recorded_elsewhere', 'other'] as const
export type PickDiscardReason = (typeof PICK_DISCARD_REASONS)[number]

export const pickDiscardSchema = z
  .object({
    /** The Idempotency-Key the confirmation was made with. */
    clientKey: z.string().trim().min(8, issueCode('confirmation_key_invalid')).max(100, issueCode('confirmation_key_invalid')).regex(/^[A-Za-z0-9._:-]+$/, issueCode('confirmation_key_invalid')),
    lineId: id,
    qty: z.coerce.number().int().min(0).max(1_000_000),
    shortReason: z.enum(SHORT_REASONS).optional().nullable(),
    /** The code the server refused it with, when it was refused. */
    refusedCode: z.string().trim().max(40).optional().nullable(),
    reason: z.enum(PICK_DISCARD_REASONS),
    note,
  })
  .refine((d) => d.reason !== 'other' || !!d.note?.trim(), { path: ['note'], ...issueOf('discard_note_needed') })
export type PickDiscardInput = z.infer<typeof pickDiscardSchema>

/**
 * How a line closed short is settled: the units were found after all (a recount of the bin), so
 * they go back on the line to pick; the buyer orders them (a backorder); or another item is picked
 * in their place (a substitute, allocated and held at once).
 */
export const SHORT_RESOLUTIONS = ['recount', 'backorder', 'substitute'] as const
export type ShortResolution = (typeof SHORT_RESOLUTIONS)[number]

export const pickShortResolveSchema = z
  .object({
    lineId: id,
    action: z.enum(SHORT_RESOLUTIONS),
    qty: z.coerce.number().int().min(1).max(1_000_000),
    substituteItemId: id.optional().nullable(),
  })
  .refine((r) => r.action !== 'substitute' || !!r.substituteItemId, { path: ['substituteItemId'], ...issueOf('substitute_needed') })
export type PickShortResolveInput = z.infer<typeof pickShortResolveSchema>

export const pickCompleteSchema = z.object({
  /** Lines not fully confirmed are closed short ('not_picked'); without this they stop the completion. */
  acceptShort: z.boolean().default(false),
})

export const pickCancelSchema = z.object({ reason: note })

export const pickShipSchema = z.object({ fromWarehouseId: id })

export const pickListQuerySchema = z.object({
  warehouseId: id.optional(),
  bomId: id.optional(),
  jobId: id.optional(),
  status: z.enum(['open', 'all', ...PICK_LIST_STATUSES]).default('open'),
})

// ---- answers ----

export interface Person {
  id: number
  name: string
}

export interface StatusStep {
  status: PickListStatus
  by: Person | null
  at: string
}

export interface PickLineView {
  id: number
  bomLineId: number
  itemId: number
  sku: string
  itemName: string
  gtin: string | null
  family: string
  stockUnit: string
  weightKg: string
  caseQty: number | null
  palletQty: number | null
  binId: number
  binCode: string
  lotId: number | null
  lotCode: string | null
  qty: number
  confirmedQty: number
  shortQty: number
  shortReasons: ShortReason[]
  /** Short units already settled by a backorder or a substitute (a recount puts them back on the line instead). */
  shortResolvedQty: number
  shortResolutions: { action: 'backorder' | 'substitute'; qty: number; sku: string | null }[]
  remaining: number
  issuedQty: number
  /** Set when this line substitutes another item of the bill of materials. */
  substituteFor: { sku: string; name: string } | null
  cautions: HandlingCaution[]
}

export interface ShortageView {
  id: number
  bomLineId: number | null
  sku: string
  description: string
  qty: number
  action: ShortageAction
  detail: string | null
}

export interface TransferProposalView {
  id: number
  fromWarehouse: { id: number; code: string; name: string }
  sku: string
  binCode: string
  lotCode: string | null
  qty: number
  status: 'proposed' | 'shipped' | 'cancelled'
  transferId: number | null
}

export interface ConfirmationView {
  id: number
  lineId: number
  qty: number
  shortQty: number
  shortReason: ShortReason | null
  by: Person | null
  at: string
  issued: boolean
}

export interface PickListSummary {
  id: number
  number: string
  status: PickListStatus
  /** Null when the list picks a sales order (salesOrderId) rather than a bill of materials. */
  bomId: number | null
  bomRevision: number | null
  jobId: number | null
  /** The job's name, or the sales order's number when it has no job. */
  jobName: string
  salesOrderId: number | null
  salesOrderNumber: string | null
  customerName: string
  warehouse: { id: number; code: string; name: string }
  lineCount: number
  /** Lines done, short (not settled), settled and left: the same rule as the handheld's progress. */
  lineStates: { total: number; done: number; short: number; resolved: number; left: number }
  qty: number
  confirmedQty: number
  shortQty: number
  issuedQty: number
  /** Stock other warehouses hold for this list, not shipped yet. */
  transfersWaiting: { fromWarehouseId: number; qty: number }[]
  createdAt: string
  updatedAt: string
}

export interface PickListDetail extends PickListSummary {
  note: string | null
  /** Lines in walking order along the warehouse's path. */
  lines: PickLineView[]
  history: StatusStep[]
  shortages: ShortageView[]
  transfers: TransferProposalView[]
  confirmations: ConfirmationView[]
  walk: { direction: 'serpentine' | 'oneWay'; aisleOrder: string[] }
}

/** The answer to one scan confirmation; `replayed` when the same Idempotency-Key was seen before. */
export interface PickConfirmAnswer {
  confirmationId: number
  lineId: number
  confirmedQty: number
  shortQty: number
  remaining: number
  listStatus: string
  replayed: boolean
}

/** A short line settled: its figures now, and the substitute lines added to the list (if any). */
export interface PickShortResolveAnswer {
  lineId: number
  action: ShortResolution
  qty: number
  shortQty: number
  shortResolvedQty: number
  remaining: number
  addedLineIds: number[]
}

/** A discard is recorded, unless the server had the confirmation already: then it answers with it. */
export type PickDiscardAnswer = { discarded: true } | { discarded: false; recorded: PickConfirmAnswer }

export interface PlannedLine {
  bomLineId: number
  itemId: number
  sku: string
  itemName: string
  binCode: string
  lotCode: string | null
  qty: number
}

export interface PlannedList {
  warehouse: { id: number; code: string; name: string }
  lines: PlannedLine[]
}

export interface PlannedShortage {
  bomLineId: number
  itemId: number
  sku: string
  description: string
  requested: number
  shortage: number
  /** Available in the other warehouses, for a transfer. */
  elsewhere: { warehouseId: number; code: string; name: string; available: number }[]
  /** Items of the same family with stock in this warehouse, for a substitute. */
  substitutes: { itemId: number; sku: string; name: string; available: number }[]
  /** Already backordered for this line by earlier pick lists. */
  backordered: number
}

export interface PickPlan {
  bom: { id: number; revision: number; jobId: number; jobName: string; customerName: string }
  mode: PickMode
  lists: PlannedList[]
  shortages: PlannedShortage[]
  notPicked: { bomLineId: number; description: string; qty: number; reason: 'made_to_order' | 'no_item' | 'done' }[]
  explanation: { bomLineId: number; lines: string[] }[]
}

export interface WalkWarehouse {
  id: number
  code: string
  name: string
  binPattern: string
  aisleOrder: string[]
  walkDirection: 'serpentine' | 'oneWay'
  /** Aisles found in the warehouse's bin codes. */
  aisles: string[]
  /** Some of the warehouse's storage bin codes, for a preview of the walk. */
  sampleBins: string[]
  openPickLists: number
}

export interface BomForPicking {
  bomId: number
  revision: number
  jobId: number
  jobName: string
  customerName: string
  createdAt: string
  lines: number
  qty: number
  pickedQty: number
  openQty: number
}
