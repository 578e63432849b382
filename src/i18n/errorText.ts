// The one place an error code becomes words: the server's answers (through the API client) and the
// forms' own checks (through fieldErrorsFromZod) are both written here, in the user's language and
// length unit. A code this version does not know still gets a sentence: in English the server's own
// message, otherwise a general one by status.
import type { ZodError } from 'zod'
import type { ErrorParams, MeasureUnit, ParamValue, Problem } from '@shared/errors/errorCodes'
import { fieldKey, zodIssueProblem } from '@shared/errors/zodProblems'
import { formatLength, type LengthUnit } from '@shared/units'
import { i18n } from '@/i18n'

const MEASURED = new Set(['min', 'max', 'value'])
/** List values that offer a choice ("xlsx or csv"); other lists are joined with "and". */
const ALTERNATIVES = new Set(['options', 'allowed', 'families', 'statuses'])

// The signed-in user's length unit, kept here by App.vue (the session store imports the API client,
// which imports this file, so this file does not import the store).
let lengthUnit: LengthUnit = 'in'
export function setErrorLengthUnit(unit: LengthUnit): void {
  lengthUnit = unit
}
const userLengthUnit = (): LengthUnit => lengthUnit

function measure(value: number, unit: MeasureUnit, lengthUnit: LengthUnit): string {
  const { n, t } = i18n.global
  switch (unit) {
    case 'mm':
      return formatLength(value, lengthUnit)
    case 'days':
      return t('errors.units.days', { n: n(value, 'integer') }, value)
    case 'deg':
      return `${n(value, 'decimal')}°`
    case 'ml':
      return `${n(value, 'decimal')} mL`
    case 'kg':
      return `${n(value, 'decimal')} kg`
  }
}

/** Enumerations named in values, worded with the words their own screens use. */
const VALUE_WORDS: Record<string, string> = {
  family: 'catalog.families',
  families: 'catalog.families',
  poStatus: 'purchasing.statuses',
  statuses: 'purchasing.statuses',
}

function valueWord(name: string, value: string): string {
  const { t, te } = i18n.global
  const key = `${VALUE_WORDS[name] ?? `errors.values.${name}`}.${value}`
  return te(key) ? t(key) : value
}

function word(name: string, value: ParamValue, unit: MeasureUnit | undefined, lengthUnit: LengthUnit): string {
  const { n } = i18n.global
  if (typeof value === 'number') {
    if (unit && MEASURED.has(name)) return measure(value, unit, lengthUnit)
    return n(value, Number.isInteger(value) ? 'integer' : 'decimal')
  }
  if (Array.isArray(value)) {
    if (!value.length) return '—'
    const words = value.map((v) => valueWord(name, v))
    return new Intl.ListFormat(i18n.global.locale.value, { type: ALTERNATIVES.has(name) ? 'disjunction' : 'conjunction' }).format(words)
  }
  if (typeof value === 'string') return valueWord(name, value)
  return value === null || value === undefined ? '' : String(value)
}

function worded(params: ErrorParams | undefined, lengthUnit: LengthUnit): Record<string, string> {
  const unit = params?.unit as MeasureUnit | undefined
  return Object.fromEntries(Object.entries(params ?? {}).map(([name, value]) => [name, word(name, value, unit, lengthUnit)]))
}

/** A problem (a field's, or a whole error's) in the user's words; undefined when the code has no message. */
export function problemText(p: Problem | { code: string; params?: ErrorParams }, lengthUnit = userLengthUnit()): string | undefined {
  const key = `errors.${p.code}`
  if (!/^[a-z][a-z0-9_]*$/.test(p.code) || !i18n.global.te(key)) return undefined
  return i18n.global.t(key, worded(p.params, lengthUnit))
}

function fallbackKey(status: number): string {
  if (status === 400 || status === 413 || status === 422) return 'badInput'
  if (status === 401 || status === 403) return 'forbidden'
  if (status === 404) return 'notFound'
  if (status === 409) return 'conflict'
  if (status >= 500) return 'server'
  return 'other'
}

/** A whole error in the user's words. */
export function errorText(e: { status: number; code: string; params?: ErrorParams; message?: string }): string {
  const known = problemText(e)
  if (known !== undefined) return known
  if (i18n.global.locale.value === 'en' && e.message) return e.message
  return i18n.global.t(`errors.fallback.${fallbackKey(e.status)}`)
}

/** Field problems in the user's words, by field. */
export function fieldTexts(fields: Record<string, Problem | { code: string; params?: ErrorParams }> | undefined): Record<string, string> {
  const lengthUnit = userLengthUnit()
  return Object.fromEntries(
    Object.entries(fields ?? {}).map(([key, p]) => [key, problemText(p, lengthUnit) ?? i18n.global.t('errors.fallback.field')]),
  )
}

/**
 * A form's own check (the shared zod schema) as field messages, worded exactly as the server's: the
 * first problem per field, keyed by its dotted path (or by `keyOf`, when the form names it otherwise).
 */
export function fieldErrorsFromZod(error: Pick<ZodError, 'issues'>, keyOf: (path: PropertyKey[]) => string = fieldKey): Record<string, string> {
  const problems: Record<string, Problem> = {}
  for (const issue of error.issues) problems[keyOf(issue.path)] ??= zodIssueProblem(issue)
  return fieldTexts(problems)
}
