// The one mapping from zod issues to error codes (shared/errors/zodProblems.ts), one check per kind of
// issue. The issues are produced by zod itself from real schemas, so a zod upgrade that changes an
// issue's shape fails here. source: zod 4 issue types ($ZodIssueInvalidType, $ZodIssueTooSmall,
// $ZodIssueTooBig, $ZodIssueInvalidStringFormat, $ZodIssueInvalidValue, $ZodIssueNotMultipleOf,
// $ZodIssueUnrecognizedKeys, $ZodIssueCustom) in zod/v4/core/errors.d.ts.
import { describe, expect, it } from 'vitest'
import { z } from 'zod'
import { fieldKey, issueCode, issueOf, unitOfPath, zodFieldProblems, zodIssueProblem } from '../../shared/errors/zodProblems.js'
import { idSchema } from '../../shared/schemas/stock.js'

function problemOf(schema: z.ZodType, value: unknown) {
  const r = schema.safeParse(value)
  if (r.success) throw new Error(`expected ${JSON.stringify(value)} to be refused`)
  return zodIssueProblem(r.error.issues[0])
}

describe('zod issues to codes', () => {
  it('a missing or non-numeric number asks for a number; a fraction asks for whole numbers', () => {
    expect(problemOf(z.number(), undefined)).toEqual({ code: 'enter_number' })
    expect(problemOf(z.coerce.number(), 'abc')).toEqual({ code: 'enter_number' })
    expect(problemOf(z.number().int(), 1.5)).toEqual({ code: 'whole_number' })
  })

  it('a missing text, list or choice is required; an empty text too', () => {
    expect(problemOf(z.string(), undefined)).toEqual({ code: 'required' })
    expect(problemOf(z.string().min(1), '')).toEqual({ code: 'required' })
    expect(problemOf(z.array(z.string()), undefined)).toEqual({ code: 'required' })
  })

  it('number bounds carry min and max, inclusive or not; zero bounds have their own words', () => {
    expect(problemOf(z.number().min(3), 2)).toEqual({ code: 'at_least', params: { min: 3 } })
    expect(problemOf(z.number().gt(3), 3)).toEqual({ code: 'more_than', params: { min: 3 } })
    expect(problemOf(z.number().max(500), 501)).toEqual({ code: 'at_most', params: { max: 500 } })
    expect(problemOf(z.number().lt(10), 10)).toEqual({ code: 'less_than', params: { max: 10 } })
    expect(problemOf(z.number().min(0), -1)).toEqual({ code: 'not_negative' })
    expect(problemOf(z.number().positive(), 0)).toEqual({ code: 'more_than_zero' })
  })

  it('text and list lengths carry min and max', () => {
    expect(problemOf(z.string().min(12), 'short')).toEqual({ code: 'too_short', params: { min: 12 } })
    expect(problemOf(z.string().max(3), 'abcd')).toEqual({ code: 'too_long', params: { max: 3 } })
    expect(problemOf(z.array(z.number()).min(1), [])).toEqual({ code: 'too_few', params: { min: 1 } })
    expect(problemOf(z.array(z.number()).max(2), [1, 2, 3])).toEqual({ code: 'too_many_items', params: { max: 2 } })
  })

  it('formats: e-mail, date, and any other pattern', () => {
    expect(problemOf(z.email(), 'not-an-address')).toEqual({ code: 'invalid_email' })
    expect(problemOf(z.iso.date(), '2026-13-40')).toEqual({ code: 'invalid_date' })
    expect(problemOf(z.string().regex(/^x+$/), 'y')).toEqual({ code: 'invalid_format' })
  })

  it('choices, multiples, unexpected keys and unions', () => {
    expect(problemOf(z.enum(['in', 'mm']), 'ft')).toEqual({ code: 'invalid_choice' })
    // A record picked from a list: nothing picked (a bin select left empty) reads as a choice to make, not as
    // "more than zero" (found on the returns dialog at the counter).
    for (const nothing of [null, undefined, '', 0, 'x', 1.5]) expect(problemOf(idSchema, nothing), String(nothing)).toEqual({ code: 'invalid_choice' })
    expect(problemOf(z.number().multipleOf(5), 7)).toEqual({ code: 'not_multiple', params: { divisor: 5 } })
    expect(problemOf(z.object({ a: z.string() }).strict(), { a: 'x', b: 1 })).toEqual({ code: 'unknown_fields', params: { keys: ['b'] } })
    expect(problemOf(z.union([z.string(), z.number()]), null)).toEqual({ code: 'invalid_value' })
  })

  it('a registered code given as the message names the situation, keeping the bound', () => {
    expect(problemOf(z.string().regex(/^[A-Z]$/, issueCode('aisle_letter')), 'aa')).toEqual({ code: 'aisle_letter' })
    expect(problemOf(z.array(z.number()).max(2, issueCode('bin_range_too_big')), [1, 2, 3])).toEqual({ code: 'bin_range_too_big', params: { max: 2 } })
    // An English message that is not a code is ignored: the kind of issue decides.
    expect(problemOf(z.string().min(1, 'Enter a name'), '')).toEqual({ code: 'required' })
  })

  it('a refinement carries its code and values', () => {
    const schema = z.object({ a: z.number(), b: z.number() }).refine((v) => v.a <= v.b, { path: ['b'], ...issueOf('pallet_whole_cases', { caseQty: 8 }) })
    const r = schema.safeParse({ a: 2, b: 1 })
    expect(r.success).toBe(false)
    expect(zodFieldProblems(r.error!)).toEqual({ b: { code: 'pallet_whole_cases', params: { caseQty: 8 } } })
  })

  it('a field named for its unit adds the unit to bounds, at any depth', () => {
    const walls = z.object({ walls: z.array(z.object({ heightMm: z.number().min(100), leadTimeDays: z.number().max(365), name: z.string().max(5) })) })
    const r = walls.safeParse({ walls: [{ heightMm: 50, leadTimeDays: 400, name: 'toolong' }] })
    expect(zodFieldProblems(r.error!)).toEqual({
      'walls.0.heightMm': { code: 'at_least', params: { min: 100, unit: 'mm' } },
      'walls.0.leadTimeDays': { code: 'at_most', params: { max: 365, unit: 'days' } },
      'walls.0.name': { code: 'too_long', params: { max: 5 } },
    })
    expect(unitOfPath(['arcAngleDeg'])).toBe('deg')
    expect(unitOfPath(['cartridgeMl'])).toBe('ml')
    expect(unitOfPath(['weightKg'])).toBe('kg')
    expect(unitOfPath(['qty'])).toBeUndefined()
  })

  it('keys fields by their dotted path, the whole input by _, first problem per field', () => {
    expect(fieldKey(['lines', 2, 'qty'])).toBe('lines.2.qty')
    expect(fieldKey([])).toBe('_')
    const r = z.object({ qty: z.number().int().min(1) }).safeParse({ qty: 0.5 })
    expect(zodFieldProblems(r.error!)).toEqual({ qty: { code: 'whole_number' } })
  })
})
