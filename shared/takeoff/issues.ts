// A takeoff form's validation problems in the clerk's terms: each becomes a stable key with its figures
// (lengths in mm) for the screen to word in the user's language and unit, and an English message in
// that unit ("at most 100 ft", never "<=30480") for the server's answer and logs.
import type { z } from 'zod'
import { isErrorCode, type ErrorCode, type ErrorParams, type Problem } from '../errors/errorCodes.js'
import { formatLength, type LengthUnit } from '../units.js'

export interface TakeoffIssue {
  path: string
  key: string
  params: Record<string, string | number>
  message: string
}

/** Keys that mean "larger than anyone builds": the request is refused as too large. */
export const TOO_LARGE_KEYS = new Set(['wall_too_large', 'takeoff_too_large', 'at_most_length', 'at_most', 'too_many'])

const isLength = (path: PropertyKey[]) => {
  const last = path[path.length - 1]
  return typeof last === 'string' && /Mm$/.test(last)
}

type Issue = z.core.$ZodIssue

function describe(issue: Issue, unit: LengthUnit): Omit<TakeoffIssue, 'path'> {
  const words = (mm: number) => formatLength(mm, unit, { feet: true, style: 'words' })
  const params = (issue as { params?: Record<string, string | number> }).params
  if (issue.code === 'custom' && params?.key) return { key: String(params.key), params, message: issue.message }
  // A check that names its situation with a registered code (shared/errors/errorCodes.ts)
  if (issue.code === 'custom' && isErrorCode(issue.message)) return { key: issue.message, params: params ?? {}, message: issue.message }
  if (issue.code === 'too_big') {
    const max = Number(issue.maximum)
    if (issue.origin === 'array') return { key: 'too_many', params: { max }, message: `At most ${max}` }
    if (isLength(issue.path)) return { key: 'at_most_length', params: { maxMm: max }, message: `At most ${words(max)}` }
    if (issue.origin === 'string') return { key: 'too_long', params: { max }, message: `At most ${max} characters` }
    return { key: 'at_most', params: { max }, message: `At most ${max}` }
  }
  if (issue.code === 'too_small') {
    const min = Number(issue.minimum)
    if (issue.origin === 'string' || issue.origin === 'array') return { key: 'required', params: {}, message: 'Fill this in' }
    if (min === 0 && !issue.inclusive) return { key: 'more_than_zero', params: {}, message: 'Must be more than 0' }
    if (isLength(issue.path)) return { key: 'at_least_length', params: { minMm: min }, message: `At least ${words(min)}` }
    return { key: 'at_least', params: { min }, message: `At least ${min}` }
  }
  if (issue.code === 'not_multiple_of' || (issue.code === 'invalid_type' && issue.expected === 'int')) {
    return { key: 'whole_number', params: {}, message: 'A whole number' }
  }
  if (issue.code === 'invalid_type') {
    if ((issue as { input?: unknown }).input === undefined) return { key: 'required', params: {}, message: 'Fill this in' }
    return { key: 'not_a_number', params: {}, message: 'Not a number Lumenyard can read' }
  }
  return { key: 'invalid', params: {}, message: issue.message }
}

/** Every problem of a takeoff's validation, first per field, in the clerk's unit. */
export function takeoffIssues(error: z.ZodError, unit: LengthUnit): TakeoffIssue[] {
  const seen = new Set<string>()
  const out: TakeoffIssue[] = []
  for (const issue of error.issues) {
    const path = issue.path.join('.') || '_'
    if (seen.has(path)) continue
    seen.add(path)
    out.push({ path, ...describe(issue, unit) })
  }
  return out
}

/** Takeoff keys whose registered code has another name; the rest are registered codes themselves. */
const KEY_CODES: Record<string, ErrorCode> = {
  at_most_length: 'at_most',
  at_least_length: 'at_least',
  not_a_number: 'enter_number',
  too_many: 'too_many_items',
  invalid: 'invalid_value',
  takeoff_too_large: 'takeoff_blocks_over',
}

/** A takeoff problem as the coded problem the server answers (lengths in mm, worded in the reader's unit by the client). */
export function takeoffIssueProblem(issue: TakeoffIssue): Problem {
  const code = KEY_CODES[issue.key] ?? (isErrorCode(issue.key) ? issue.key : 'invalid_value')
  const { maxMm, minMm, key: _key, ...rest } = issue.params
  const params: ErrorParams = { ...rest }
  if (typeof maxMm === 'number') Object.assign(params, { max: maxMm, unit: 'mm' })
  if (typeof minMm === 'number') Object.assign(params, { min: minMm, unit: 'mm' })
  return Object.keys(params).length ? { code, params } : { code }
}
