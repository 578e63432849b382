// Unit conversions and length text for Lumenyard. Lengths are stored in millimetres; these turn them
// into what a contractor reads and types. Exact factors from NIST SP 811, appendix B.

export const MM_PER_INCH = 25.4 // 1 in = 0.0254 m exactly
export const INCHES_PER_FOOT = 12
export const MM_PER_FOOT = 304.8 // 1 ft = 0.3048 m exactly
export const M2_PER_FT2 = 0.09290304 // 1 ft² = 0.09290304 m² exactly
export const ML_PER_US_FL_OZ = 29.5735295625 // 1 US fl oz = 29.5735295625 mL exactly
export const IN3_PER_US_FL_OZ = 1.8046875 // 1 US fl oz = 231/128 in³ exactly
export const ML_PER_IN3 = 16.387064 // 1 in³ = 16.387064 cm³ exactly
export const KG_PER_POUND = 0.45359237 // 1 lb (avoirdupois) = 0.45359237 kg exactly

export type LengthUnit = 'in' | 'mm'

export const inchesToMm = (inches: number): number => inches * MM_PER_INCH
export const mmToInches = (mm: number): number => mm / MM_PER_INCH
export const feetToMm = (feet: number): number => feet * MM_PER_FOOT
export const ft2ToM2 = (ft2: number): number => ft2 * M2_PER_FT2
export const m2ToFt2 = (m2: number): number => m2 / M2_PER_FT2
export const flOzToMl = (flOz: number): number => flOz * ML_PER_US_FL_OZ
export const mlToFlOz = (ml: number): number => ml / ML_PER_US_FL_OZ
export const flOzToIn3 = (flOz: number): number => flOz * IN3_PER_US_FL_OZ
export const in3ToMl = (in3: number): number => in3 * ML_PER_IN3
export const poundsToKg = (lb: number): number => lb * KG_PER_POUND
export const kgToPounds = (kg: number): number => kg / KG_PER_POUND

export interface InchFormatOptions {
  /** Show feet and inches (5′ 2 1/8″) instead of inches only (62 1/8″). */
  feet?: boolean
  /** Smallest fraction shown; 16 means sixteenths. */
  denominator?: 2 | 4 | 8 | 16 | 32
  /** How to reach the nearest fraction: a minimum radius must round up so the named size works. */
  rounding?: 'nearest' | 'up' | 'down'
  /**
   * `marks` (default) writes 5′ 2 1/8″; `words` writes 5 ft 2 1/8 in, for sentences such as
   * "at most 83 ft 4 in" and for text sent to other systems (order specs, spreadsheets).
   */
  style?: 'marks' | 'words'
}

const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b))

function roundTo(value: number, rounding: InchFormatOptions['rounding']): number {
  // A hair of tolerance so 7.75 in stored as 196.85 mm does not round up to 7 13/16.
  if (rounding === 'up') return Math.ceil(value - 1e-6)
  if (rounding === 'down') return Math.floor(value + 1e-6)
  return Math.round(value)
}

function wholeAndFraction(whole: number, parts: number, denominator: number): string {
  if (parts === 0) return `${whole}`
  const d = gcd(parts, denominator)
  const fraction = `${parts / d}/${denominator / d}`
  return whole === 0 ? fraction : `${whole} ${fraction}`
}

/**
 * Inches with fractions to 1/16 in by default, e.g. `7 3/4″` or, with `feet`, `5′ 2 1/8″`;
 * with `style: 'words'`, `7 3/4 in` and `5 ft 2 1/8 in` (a whole number of feet drops the `0 in`).
 */
export function formatInches(mm: number, options: InchFormatOptions = {}): string {
  const denominator = options.denominator ?? 16
  const words = options.style === 'words'
  const inchMark = words ? ' in' : '″'
  const steps = roundTo((Math.abs(mm) / MM_PER_INCH) * denominator, options.rounding)
  const sign = mm < 0 && steps > 0 ? '-' : ''
  const wholeInches = Math.floor(steps / denominator)
  const parts = steps % denominator
  if (!options.feet || wholeInches < INCHES_PER_FOOT) {
    return `${sign}${wholeAndFraction(wholeInches, parts, denominator)}${inchMark}`
  }
  const feet = Math.floor(wholeInches / INCHES_PER_FOOT)
  const inches = wholeInches % INCHES_PER_FOOT
  if (words) {
    const rest = inches === 0 && parts === 0 ? '' : ` ${wholeAndFraction(inches, parts, denominator)} in`
    return `${sign}${feet} ft${rest}`
  }
  return `${sign}${feet}′ ${wholeAndFraction(inches, parts, denominator)}″`
}

/** Millimetres to one decimal place, dropping a trailing `.0`. */
export function formatMillimetres(mm: number, rounding: InchFormatOptions['rounding'] = 'nearest'): string {
  const tenths = roundTo(mm * 10, rounding)
  return `${(tenths / 10).toFixed(1).replace(/\.0$/, '')} mm`
}

/** A length in the user's preferred unit. */
export function formatLength(mm: number, unit: LengthUnit, options: InchFormatOptions = {}): string {
  return unit === 'in' ? formatInches(mm, options) : formatMillimetres(mm, options.rounding)
}

/** Width × depth (× height) in one unit: `48″ × 36″` (or `48 in × 36 in` in words), `1219.2 × 914.4 mm`. */
export function formatSize(mms: readonly number[], unit: LengthUnit, options: InchFormatOptions = {}): string {
  const parts = mms.map((mm) => formatLength(mm, unit, options))
  return unit === 'in' ? parts.join(' × ') : `${parts.map((p) => p.replace(/ mm$/, '')).join(' × ')} mm`
}

/** Why a typed length was not read, as a stable code a screen can word in the user's language. */
export type LengthParseCode = 'empty' | 'negative' | 'zero_denominator' | 'decimal_comma' | 'unreadable'

const PARSE_DETAIL: Record<LengthParseCode, string> = {
  empty: 'it is empty',
  negative: 'a length cannot be negative',
  zero_denominator: 'a fraction cannot have 0 below the line',
  decimal_comma: 'write decimals with a point (1.5) and no thousands separator',
  unreadable: 'the number or its unit is not one Lumenyard knows',
}

export class LengthParseError extends Error {
  readonly input: string
  readonly code: LengthParseCode
  constructor(input: string, code: LengthParseCode) {
    super(`Can't read "${input}" as a length: ${PARSE_DETAIL[code]}. Try 7 3/4", 7.75 in, 190 mm or 5' 2".`)
    this.name = 'LengthParseError'
    this.input = input
    this.code = code
  }
}

const UNIT_MM: Record<string, number> = {
  mm: 1, millimeter: 1, millimeters: 1, millimetre: 1, millimetres: 1,
  cm: 10, m: 1000,
  '"': MM_PER_INCH, in: MM_PER_INCH, inch: MM_PER_INCH, inches: MM_PER_INCH,
  "'": MM_PER_FOOT, ft: MM_PER_FOOT, foot: MM_PER_FOOT, feet: MM_PER_FOOT,
}
const UNIT_WORDS = Object.keys(UNIT_MM).sort((a, b) => b.length - a.length)
const FOOT_MARKS = ["'", 'ft', 'foot', 'feet']

/** Typographic quotes and primes become ASCII so one grammar reads what people paste. */
function normalise(text: string): string {
  return text
    .trim()
    .toLowerCase()
    .replace(/[″“”]|''/g, '"')
    .replace(/[′‘’]/g, "'")
    .replace(/\s+/g, ' ')
}

/** "7", "7.75", ".5", "3/4", "7 3/4", "7-3/4" as a number; undefined when it is none of those. */
function readQuantity(text: string, input: string): number | undefined {
  const t = text.trim()
  if (/^(\d+(\.\d+)?|\.\d+)$/.test(t)) return Number(t)
  const mixed = /^(?:(\d+)[ -])?(\d+)\/(\d+)$/.exec(t)
  if (!mixed) return undefined
  const denominator = Number(mixed[3])
  if (denominator === 0) throw new LengthParseError(input, 'zero_denominator')
  return Number(mixed[1] ?? 0) + Number(mixed[2]) / denominator
}

/** Splits "7 3/4 in" into quantity text and unit word (unit '' when none is written). */
function splitUnit(text: string): { quantity: string; unit: string } {
  for (const word of UNIT_WORDS) {
    if (text.endsWith(word)) {
      const quantity = text.slice(0, text.length - word.length)
      const needsBreak = /[a-z]$/.test(word) && /[a-z]$/.test(quantity)
      if (!needsBreak) return { quantity: quantity.trim(), unit: word }
    }
  }
  return { quantity: text, unit: '' }
}

/** "5' 2 1/2"" and "5 ft 2 in": feet followed by inches. */
function readFeetAndInches(text: string, input: string): number | undefined {
  for (const mark of FOOT_MARKS) {
    const at = text.indexOf(mark)
    if (at <= 0) continue
    const rest = text.slice(at + mark.length).trim().replace(/^-\s*/, '')
    if (rest === '') continue
    const feet = readQuantity(text.slice(0, at), input)
    const { quantity, unit } = splitUnit(rest)
    if (unit !== '' && UNIT_MM[unit] !== MM_PER_INCH) return undefined
    const inches = readQuantity(quantity, input)
    if (feet === undefined || inches === undefined) return undefined
    return feet * MM_PER_FOOT + inches * MM_PER_INCH
  }
  return undefined
}

/** A measure as the catalog stores it: fixed decimals, a point, no grouping (101.60); never shown as is. */
export function storedDecimal(value: number, places: number): string {
  return value.toFixed(places)
}

/**
 * Reads what a person types into millimetres: `7 3/4"`, `7.75 in`, `190 mm`, `5' 2"`, `5 ft 2 1/8 in`.
 * A bare number takes `defaultUnit`. Throws LengthParseError with a message fit to show beside the field.
 */
export function parseLength(text: string, defaultUnit: LengthUnit = 'mm'): number {
  const s = normalise(text)
  if (s === '') throw new LengthParseError(text, 'empty')
  if (s.startsWith('-')) throw new LengthParseError(text, 'negative')
  // "1,5" is a decimal comma and "1,500" a thousands separator: guessing either could be wrong by 1000×.
  if (/\d,\d/.test(s)) throw new LengthParseError(text, 'decimal_comma')
  const feetInches = readFeetAndInches(s, text)
  if (feetInches !== undefined) return feetInches
  const { quantity, unit } = splitUnit(s)
  const value = readQuantity(quantity, text)
  if (value === undefined) throw new LengthParseError(text, 'unreadable')
  return value * (unit === '' ? (defaultUnit === 'in' ? MM_PER_INCH : 1) : UNIT_MM[unit])
}

export type LengthParseResult = { ok: true; mm: number } | { ok: false; message: string; code: LengthParseCode }

/** parseLength without the throw, for form fields that validate as the user types. */
export function tryParseLength(text: string, defaultUnit: LengthUnit = 'mm'): LengthParseResult {
  try {
    return { ok: true, mm: parseLength(text, defaultUnit) }
  } catch (error) {
    if (error instanceof LengthParseError) return { ok: false, message: error.message, code: error.code }
    throw error
  }
}
