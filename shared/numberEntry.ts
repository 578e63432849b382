// A number a person typed into a form, read as they wrote it and checked against the field's rules. The
// form keeps the text; this says what it means or what is wrong with it, as a problem the client words in
// the person's language. Nothing is rounded, clamped or guessed: 0 where the least is 1, 1e9 where the most
// is a million, 1,5 where only whole units are sold and 7 3/4 in a count are each refused with a reason, and
// text that reads two ways is asked about rather than read one of them.
import { problem, type Problem } from './errors/errorCodes.js'

/**
 * How a language's people write a decimal. Both languages' screens write numbers the United States way
 * (src/i18n/formats.ts: en-US, and es-US, whose CLDR symbols are the same: 1,234.5), and that writing always reads
 * back as written.
 * - 'point' (English): a point before the decimals, a comma only between groups of three: 1.5, 1,500, 1,234.5.
 * - 'comma' (Spanish): the screens' writing as above, and the decimal comma of Spanish elsewhere where it can only
 *   be one (1,5; 0,125; 1.234,5). A lone comma before exactly three digits (1,500) fits both (one thousand five
 *   hundred as the screens write it, one and a half with the decimal comma), and so does a lone point before
 *   exactly three digits where the field takes fewer decimals (1.500: one and a half as the screens write it, one
 *   thousand five hundred with Spanish groups): such text is asked about, never guessed.
 */
export type DecimalMark = 'point' | 'comma'

export interface NumberRules {
  min?: number
  max?: number
  /** Decimal places allowed; 0 (the default) takes whole numbers only. */
  places?: number
  /** An empty field is allowed (the value is then undefined); else it is required. */
  optional?: boolean
}

export type NumberEntry = { ok: true; value: number | undefined } | { ok: false; problem: Problem }

/** The mark each of Lumenyard's languages writes a decimal with. */
export function decimalMarkOf(locale: string): DecimalMark {
  return locale.toLowerCase().startsWith('es') ? 'comma' : 'point'
}

const GROUPED = /^[1-9]\d{0,2}(,\d{3})+(\.\d+)?$/
const PLAIN_POINT = /^(\d+(\.\d*)?|\.\d+)$/
const GROUPED_POINTS = /^[1-9]\d{0,2}(\.\d{3})+,\d+$/
const PLAIN_COMMA = /^(\d+(,\d*)?|,\d+)$/
const FRACTION = /^(?:(\d+)\s+)?(\d+)\s*\/\s*(\d+)$/
/** One to three digits (not starting with 0), one mark, exactly three digits: a group of thousands or three decimals. */
const LONE_GROUP = /^([1-9]\d{0,2})([.,])(\d{3})$/

/** Both readings of text that fits two, as digits with no group mark and as a decimal with a point. */
interface TwoReadings {
  thousands: string
  decimal: string
}

/** Text a Spanish reader may have written either way (see DecimalMark), or null when it reads one way only. */
function twoWays(text: string, rules: NumberRules): TwoReadings | null {
  const lone = LONE_GROUP.exec(text)
  if (!lone) return null
  const [, whole, mark, three] = lone
  if (mark === '.' && (rules.places ?? 0) >= 3) return null
  return { thousands: `${whole}${three}`, decimal: `${whole}.${three}`.replace(/\.?0+$/, '') }
}

/** The value of unsigned text, or null when it is not a number written in one of the ways above. */
function unsignedValue(text: string, mark: DecimalMark): number | null {
  const fraction = FRACTION.exec(text)
  if (fraction) {
    const [, whole, num, den] = fraction
    if (Number(den) === 0) return null
    return Number(whole ?? 0) + Number(num) / Number(den)
  }
  if (PLAIN_POINT.test(text)) return Number(text)
  if (GROUPED.test(text)) return Number(text.replace(/,/g, ''))
  if (mark === 'comma') {
    if (PLAIN_COMMA.test(text)) return Number(text.replace(',', '.'))
    if (GROUPED_POINTS.test(text)) return Number(text.replace(/\./g, '').replace(',', '.'))
  }
  return null
}

function decimalsIn(value: number): number {
  const [, decimals = ''] = String(value).split('.')
  return decimals.length
}

/** Reads what was typed; refuses, with the problem to show beside the field, what the rules do not allow. */
export function readNumber(typed: string, rules: NumberRules = {}, mark: DecimalMark = 'point'): NumberEntry {
  const text = typed.replace(/[\s\u00a0\u202f]+/g, ' ').trim()
  if (text === '') return rules.optional ? { ok: true, value: undefined } : { ok: false, problem: problem('required') }
  const signed = /^([-+\u2212])\s*(.*)$/.exec(text)
  const negative = signed ? signed[1] !== '+' : false
  const unsigned = signed ? signed[2] : text
  const asked = mark === 'comma' ? twoWays(unsigned, rules) : null
  if (asked) {
    const sign = negative ? '-' : ''
    return { ok: false, problem: problem('number_two_ways', { input: typed.trim(), thousands: sign + asked.thousands, decimal: sign + asked.decimal }) }
  }
  const magnitude = unsignedValue(unsigned, mark)
  if (magnitude === null || !Number.isFinite(magnitude)) return { ok: false, problem: problem('number_unreadable', { input: typed.trim() }) }
  const value = negative ? -magnitude : magnitude
  const places = rules.places ?? 0
  if (places === 0 && !Number.isInteger(value)) return { ok: false, problem: problem('whole_number') }
  if (places > 0 && !FRACTION.test(text) && decimalsIn(value) > places) return { ok: false, problem: problem('decimal_places', { places }) }
  if (rules.min !== undefined && value < rules.min) return { ok: false, problem: problem('at_least', { min: rules.min }) }
  if (rules.max !== undefined && value > rules.max) return { ok: false, problem: problem('at_most', { max: rules.max }) }
  return { ok: true, value: Object.is(value, -0) ? 0 : value }
}
