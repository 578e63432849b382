// The client's one error-to-words function (src/i18n/errorText.ts): codes in the user's language and
// length unit, numbers written the US way in both languages, and a sensible sentence for a code this
// version does not know. Inch figures to 1/16 in as shared/units.ts writes them; 1 in = 25.4 mm
// exactly (NIST SP 811, appendix B).
import { afterEach, beforeAll, describe, expect, it } from 'vitest'
import { errorText, fieldErrorsFromZod, fieldTexts, problemText, setErrorLengthUnit } from '@/i18n/errorText'
import { i18n, loadMessages } from '@/i18n'
import esErrors from '@/i18n/es/errors'
import { binRangeSchema } from '@shared/schemas/warehouses'

const speak = (locale: 'en' | 'es') => {
  i18n.global.locale.value = locale
}

beforeAll(async () => {
  // Every message of both languages, loaded before the first check: a key asked for before its chunk has
  // arrived would start a load that outlives the test file.
  await Promise.all([loadMessages('all', 'en'), loadMessages('all', 'es')])
  setErrorLengthUnit('mm')
})
afterEach(() => speak('en'))

describe('error words', () => {
  it('words a code with its values in Spanish', () => {
    speak('es')
    expect(problemText({ code: 'at_most', params: { max: 1_000_000 } })).toBe('Como máximo 1,000,000')
    expect(problemText({ code: 'too_many_signins_device', params: { minutes: 15 } })).toBe(
      'Demasiados intentos fallidos desde este dispositivo. Inténtelo de nuevo en 15 minutos.',
    )
  })

  it('writes lengths in the user unit: inches with fractions, or millimetres', () => {
    // 98.425 mm = 3 7/8 in exactly (IRC 2021 R607.3's least standard thickness)
    const p = { code: 'standard_block_too_thin', params: { min: 98.425, unit: 'mm' } }
    expect(problemText(p, 'in')).toBe('A standard unit is at least 3 7/8″ thick (IRC R607.3); a thinner one is a thin unit')
    expect(problemText(p, 'mm')).toBe('A standard unit is at least 98.4 mm thick (IRC R607.3); a thinner one is a thin unit')
    speak('es')
    expect(problemText({ code: 'at_least', params: { min: 196.85, unit: 'mm' } }, 'in')).toBe('Como mínimo 7 3/4″')
  })

  it('counts days in words, singular and plural', () => {
    expect(problemText({ code: 'at_least', params: { min: 1, unit: 'days' } })).toBe('At least 1 day')
    speak('es')
    expect(problemText({ code: 'at_most', params: { max: 365, unit: 'days' } })).toBe('Como máximo 365 días')
  })

  it('writes a literal $ kept from the message syntax', () => {
    expect(problemText({ code: 'bin_pattern_anchors' })).toBe('Start with ^ and end with $ so the whole code must match')
  })

  it('joins lists in the language', () => {
    speak('es')
    expect(problemText({ code: 'bin_pattern_groups', params: { missing: ['bay', 'level'] } })).toBe('Nombre los grupos aisle, bay y level (falta: bay y level)')
  })

  it('falls back sensibly for a code it does not know', () => {
    const unknown = { status: 409, code: 'brand_new_situation', message: 'The crate is already sealed.' }
    expect(errorText(unknown)).toBe('The crate is already sealed.')
    speak('es')
    expect(errorText(unknown)).toBe(esErrors.fallback.conflict)
    expect(errorText({ status: 503, code: 'x', message: 'Down.' })).toBe(esErrors.fallback.server)
    expect(errorText({ status: 0, code: 'network' })).toBe(esErrors.network)
    expect(fieldTexts({ qty: { code: 'not-a-code' } })).toEqual({ qty: esErrors.fallback.field })
  })

  it('words a form check exactly as the server would, in the user unit', () => {
    speak('es')
    const r = binRangeSchema.safeParse({ aisleFrom: 'B', aisleTo: 'A', bayFrom: 1, bayTo: 3, levelFrom: 1, levelTo: 1 })
    expect(r.success).toBe(false)
    expect(fieldErrorsFromZod(r.error!)).toEqual({ aisleTo: 'No puede ir antes del primero' })
  })
})
