// One mapping from zod issues to error codes with parameters, used by the server (AppError.fromZod)
// and by the client's forms (fieldErrorsFromZod), so a field says the same thing whichever side
// checked it. A schema names a specific situation by giving a registered code as the check's message
// (`issueCode('bin_code_chars')`, or `issueOf('ends_before_start')` in a refine); every other check
// maps by kind: a too-small number becomes `at_least` with `min`, a too-long text `too_long` with
// `max`, and so on. A field named …Mm, …Ml, …Kg, …Days or …Deg adds its unit.
import type { z } from 'zod'
import { isErrorCode, type ErrorCode, type ErrorParams, type MeasureUnit, type ParamArgs, type Problem } from './errorCodes.js'

type Issue = z.core.$ZodIssue

const UNIT_SUFFIXES: [RegExp, MeasureUnit][] = [
  [/Mm$/, 'mm'],
  [/Ml$/, 'ml'],
  [/Kg$/, 'kg'],
  [/Days$/, 'days'],
  [/Deg$/, 'deg'],
]

/** The unit of a field, from its name (lengths are stored in millimetres, and so on). */
export function unitOfPath(path: readonly PropertyKey[]): MeasureUnit | undefined {
  const last = [...path].reverse().find((p): p is string => typeof p === 'string')
  return last === undefined ? undefined : UNIT_SUFFIXES.find(([re]) => re.test(last))?.[1]
}

const NUMERIC = new Set(['number', 'int', 'bigint'])

function generic(issue: Issue): { code: ErrorCode; params: ErrorParams } {
  switch (issue.code) {
    case 'invalid_type':
      if (issue.expected === 'int') return { code: 'whole_number', params: {} }
      if (issue.expected === 'number' || issue.expected === 'bigint') return { code: 'enter_number', params: {} }
      if (issue.expected === 'date') return { code: 'invalid_date', params: {} }
      return { code: 'required', params: {} }
    case 'too_small': {
      const min = Number(issue.minimum)
      if (NUMERIC.has(issue.origin) && min === 0) return { code: issue.inclusive === false ? 'more_than_zero' : 'not_negative', params: {} }
      if (NUMERIC.has(issue.origin)) return { code: issue.inclusive === false ? 'more_than' : 'at_least', params: { min } }
      if (issue.origin === 'string') return min <= 1 ? { code: 'required', params: {} } : { code: 'too_short', params: { min } }
      if (issue.origin === 'array' || issue.origin === 'set') return { code: 'too_few', params: { min } }
      return { code: 'at_least', params: { min } }
    }
    case 'too_big': {
      const max = Number(issue.maximum)
      if (NUMERIC.has(issue.origin)) return { code: issue.inclusive === false ? 'less_than' : 'at_most', params: { max } }
      if (issue.origin === 'string') return { code: 'too_long', params: { max } }
      if (issue.origin === 'array' || issue.origin === 'set') return { code: 'too_many_items', params: { max } }
      return { code: 'at_most', params: { max } }
    }
    case 'invalid_format':
      if (issue.format === 'email') return { code: 'invalid_email', params: {} }
      if (issue.format === 'date' || issue.format === 'datetime' || issue.format === 'time') return { code: 'invalid_date', params: {} }
      return { code: 'invalid_format', params: {} }
    case 'invalid_value':
      return { code: 'invalid_choice', params: {} }
    case 'not_multiple_of':
      return { code: 'not_multiple', params: { divisor: Number(issue.divisor) } }
    case 'unrecognized_keys':
      return { code: 'unknown_fields', params: { keys: issue.keys } }
    default:
      return { code: 'invalid_value', params: {} }
  }
}

function plainParams(raw: unknown): ErrorParams {
  const out: ErrorParams = {}
  if (!raw || typeof raw !== 'object') return out
  for (const [key, value] of Object.entries(raw)) {
    if (value === null || ['string', 'number', 'boolean'].includes(typeof value)) out[key] = value as string | number | boolean | null
    else if (Array.isArray(value) && value.every((v) => typeof v === 'string')) out[key] = value
  }
  return out
}

/** The code and parameters of one zod issue. */
export function zodIssueProblem(issue: Issue): Problem {
  const base = generic(issue)
  const code = isErrorCode(issue.message) ? issue.message : base.code
  const params: ErrorParams = { ...base.params, ...(issue.code === 'custom' ? plainParams(issue.params) : {}) }
  const unit = unitOfPath(issue.path)
  if (unit && ('min' in params || 'max' in params || 'value' in params)) params.unit = unit
  return Object.keys(params).length ? { code, params } : { code }
}

/** The field a problem belongs to: its path joined with dots, `_` for the whole input. */
export const fieldKey = (path: readonly PropertyKey[]): string => path.map(String).join('.') || '_'

/** One problem per field (the first found), keyed by fieldKey. */
export function zodFieldProblems(error: { issues: readonly Issue[] }): Record<string, Problem> {
  const out: Record<string, Problem> = {}
  for (const issue of error.issues) out[fieldKey(issue.path)] ??= zodIssueProblem(issue)
  return out
}

/** A registered code as a zod check's message: `.regex(re, issueCode('bin_code_chars'))`. */
export const issueCode = (code: ErrorCode): string => code

/** A code and its values for a refine or ctx.addIssue: `.refine(ok, { path: ['to'], ...issueOf('ends_before_start') })`. */
export function issueOf<C extends ErrorCode>(code: C, ...[params]: ParamArgs<C>): { message: string; params?: ErrorParams } {
  return params && Object.keys(params).length ? { message: code, params: params as ErrorParams } : { message: code }
}
