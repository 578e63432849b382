// A takeoff form's validation problems in the clerk's terms: each becomes a stable key with its figures
// (lengths in mm) for the screen to word in the user's language and unit, and an English message in
// that unit ("at most 100 ft", never "<=30480") for the server's answer and logs.
import type { z } from 'zod'
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
