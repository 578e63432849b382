// What an adjustment or a bin move will do, worked out before anyone confirms it: the request parsed
// with the same schema the server parses it with, then the balance rule the stock engine applies
// (balanceAfter). Refusals come back as codes with their figures, for the form to word in the
// person's language beside the field; an accepted change comes back with its before and after.
import type { z } from 'zod'
import { isErrorCode, type ErrorCode } from '../errors/errorCodes.js'
import { adjustmentSchema, binMoveSchema, type AdjustmentInput, type BinMoveInput } from '../schemas/stock.js'
import { balanceAfter, type BalanceFigures } from './balanceAfter.js'

export interface ChangeIssue {
  /** The request's field (delta and qty are the form's quantity). */
  field: string
  code: string
  params?: Record<string, number>
}

export interface BeforeAfter {
  before: number
  after: number
}

export type ChangePreview<T, R> = ({ ok: true; input: T } & R) | { ok: false; issues: ChangeIssue[] }

const ID_FIELDS = new Set(['itemId', 'binId', 'fromBinId', 'toBinId', 'lotId'])

/** The schema's own checks (registered codes, shared/errors/errorCodes.ts) as this form's check words. */
const OWN_CHECKS: Partial<Record<ErrorCode, string>> = {
  not_zero: 'no_change',
  change_too_large: 'too_large',
  found_adds_units: 'found_adds',
  loss_removes_units: 'removal_takes',
}

/** A schema issue as a code: the refinement's own code, else what kind of value was wrong. */
function issueCode(issue: z.core.$ZodIssue): string {
  const field = String(issue.path[0] ?? '')
  const own = isErrorCode(issue.message) ? OWN_CHECKS[issue.message] : undefined
  if (own) return own
  if (ID_FIELDS.has(field)) return 'choose'
  switch (issue.code) {
    case 'invalid_type': return issue.expected === 'int' ? 'whole_units' : field === 'note' ? 'note_invalid' : 'qty_needed'
    case 'too_small': return 'more_than_zero'
    case 'too_big': return field === 'note' ? 'note_too_long' : 'too_large'
    case 'invalid_value': return 'choose_reason'
    default: return 'invalid'
  }
}

function schemaIssues(error: z.ZodError): ChangeIssue[] {
  const seen = new Set<string>()
  const issues: ChangeIssue[] = []
  for (const issue of error.issues) {
    const field = String(issue.path[0] ?? '')
    if (seen.has(field)) continue
    seen.add(field)
    issues.push({ field, code: issueCode(issue) })
  }
  return issues
}

/** An empty quantity box is "no quantity", not the zero the schema's coercion would make of it. */
function withBlank(raw: unknown, field: string): unknown {
  if (!raw || typeof raw !== 'object') return raw
  const value = (raw as Record<string, unknown>)[field]
  return value === null || value === undefined || value === '' ? { ...raw, [field]: Number.NaN } : raw
}

function balanceIssue(field: string, here: BalanceFigures, qty: number): ChangeIssue | null {
  const after = balanceAfter(here, qty)
  if (after.ok) return null
  return { field, code: after.problem, params: { onHand: after.onHand, reserved: after.reserved, available: after.available, wanted: after.wanted } }
}

/** An adjustment of one bin, `here` being the bin's balance of that item and lot as the form shows it. */
export function previewAdjustment(raw: unknown, here: BalanceFigures): ChangePreview<AdjustmentInput, { bin: BeforeAfter }> {
  const parsed = adjustmentSchema.safeParse(withBlank(raw, 'delta'))
  if (!parsed.success) return { ok: false, issues: schemaIssues(parsed.error) }
  const problem = balanceIssue('delta', here, parsed.data.delta)
  if (problem) return { ok: false, issues: [problem] }
  return { ok: true, input: parsed.data, bin: { before: here.onHand, after: here.onHand + parsed.data.delta } }
}

/** A move between two bins of one warehouse, with both bins' balances of that item and lot. */
export function previewBinMove(raw: unknown, from: BalanceFigures, to: BalanceFigures): ChangePreview<BinMoveInput, { from: BeforeAfter; to: BeforeAfter }> {
  const parsed = binMoveSchema.safeParse(withBlank(raw, 'qty'))
  if (!parsed.success) return { ok: false, issues: schemaIssues(parsed.error) }
  const { qty, fromBinId, toBinId } = parsed.data
  if (fromBinId === toBinId) return { ok: false, issues: [{ field: 'toBinId', code: 'same_bin' }] }
  const problem = balanceIssue('qty', from, -qty)
  if (problem) return { ok: false, issues: [problem] }
  return { ok: true, input: parsed.data, from: { before: from.onHand, after: from.onHand - qty }, to: { before: to.onHand, after: to.onHand + qty } }
}
