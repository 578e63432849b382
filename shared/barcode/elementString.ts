// GS1 element strings for the Application Identifiers Lumenyard prints and reads.
// Formats and pairing rules follow the GS1 General Specifications and the GS1 Barcode Syntax Dictionary
// (as embedded in bwip-js 4.11.4's barcode.ps, "Extracted from the GS1 Syntax Dictionary").

import { problem, type Problem } from '../errors/errorCodes.js'
import { isValidGtin, isValidSscc } from './checkDigit.js'

export type AiCode = '00' | '01' | '02' | '10' | '11' | '17' | '21' | '37' | '400'

export interface AiDefinition {
  ai: AiCode
  /** Our words for the field, used in error messages. */
  title: string
  /** N: digits only; X: GS1 AI encodable character set 82. */
  charset: 'N' | 'X'
  minLength: number
  maxLength: number
  /** Predefined length (GS1 Gen Specs figure 5.10.1-2): never followed by FNC1. */
  predefinedLength: boolean
  /** The field is a GS1 key with a mod-10 check digit. */
  key?: 'gtin' | 'sscc'
  /** YYMMDD, where DD 00 means "end of the month". */
  date?: boolean
}

const def = (ai: AiCode, title: string, charset: 'N' | 'X', min: number, max: number,
  extra: Partial<AiDefinition> = {}): AiDefinition =>
  ({ ai, title, charset, minLength: min, maxLength: max, predefinedLength: false, ...extra })

export const AI_TABLE: Readonly<Record<AiCode, AiDefinition>> = {
  '00': def('00', 'SSCC', 'N', 18, 18, { predefinedLength: true, key: 'sscc' }),
  '01': def('01', 'GTIN', 'N', 14, 14, { predefinedLength: true, key: 'gtin' }),
  '02': def('02', 'contained GTIN', 'N', 14, 14, { predefinedLength: true, key: 'gtin' }),
  '10': def('10', 'lot', 'X', 1, 20),
  '11': def('11', 'production date', 'N', 6, 6, { predefinedLength: true, date: true }),
  '17': def('17', 'expiry date', 'N', 6, 6, { predefinedLength: true, date: true }),
  '21': def('21', 'serial number', 'X', 1, 20),
  '37': def('37', 'count', 'N', 1, 8),
  '400': def('400', 'customer PO number', 'X', 1, 30),
}

/** Output order: predefined-length fields first, so only variable-length fields between others need FNC1. */
export const AI_ORDER: readonly AiCode[] = ['00', '01', '02', '11', '17', '37', '10', '21', '400']

/** FNC1 as scanners transmit it: ASCII 29, group separator. */
export const GS = '\u001d'

export type Gs1Fields = Partial<Record<AiCode, string>>

export interface Gs1Issue {
  ai: AiCode | null
  /** English, for logs and for whoever reads the API. */
  message: string
  /** Set on pairing breaches: the code a screen words in the reader's language. */
  problem?: Problem
}

export interface ElementString {
  /** Human-readable interpretation: (01)09506000134352(10)ABC */
  hri: string
  /** The data a scanner delivers, without symbology identifier: AIs and values, GS after non-final variable fields. */
  raw: string
  /** bwip-js `gs1-128` text: the HRI with "(" and ")" inside values written ^040 / ^041; render with `parse: true`. */
  bwipText: string
  order: AiCode[]
}

export type BuildResult = ({ ok: true } & ElementString) | { ok: false; errors: Gs1Issue[] }
/** A failure gives the English reason (logs) and the coded problem (screens). */
export type ElementParse = { ok: true; fields: Gs1Fields; order: AiCode[] } | { ok: false; reason: string; problem: Problem }

// GS1 AI encodable character set 82 (GS1 Gen Specs figure 7.11-1).
const CSET82 = /^[!"%&'()*+,\-./0-9:;<=>?A-Z_a-z]*$/
const DIGITS = /^[0-9]*$/
const DAYS_IN_MONTH = [31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31]

export function isAiCode(value: string): value is AiCode {
  return Object.hasOwn(AI_TABLE, value)
}

export function label(ai: AiCode): string {
  return `(${ai}) ${AI_TABLE[ai].title}`
}

/**
 * YYMMDD with DD 00 allowed. "YY divisible by 4 is a leap year" is exact while GS1's century window (49 years back,
 * 50 ahead) excludes 1900 and 2100, i.e. for every year from 1951 to 2049.
 */
function checkDate(value: string): string | null {
  const month = Number(value.slice(2, 4))
  const day = Number(value.slice(4, 6))
  if (month < 1 || month > 12) return `month must be 01 to 12, not ${value.slice(2, 4)}`
  const leap = Number(value.slice(0, 2)) % 4 === 0
  const last = month === 2 && !leap ? 28 : DAYS_IN_MONTH[month - 1]
  if (day > last) return `day ${value.slice(4, 6)} does not exist in month ${value.slice(2, 4)} (use 00 for the end of the month)`
  return null
}

/** The reason a value cannot go into this AI, or null when it can. */
export function checkFieldValue(ai: AiCode, value: string): string | null {
  const d = AI_TABLE[ai]
  const what = label(ai)
  if (value.length === 0) return `${what} is empty`
  if (d.charset === 'N' && !DIGITS.test(value)) return `${what} must be digits only`
  if (d.charset === 'X' && !CSET82.test(value)) {
    return `${what} may only hold letters, digits and ! " % & ' ( ) * + , - . / : ; < = > ? _ (no spaces)`
  }
  if (value.length < d.minLength || value.length > d.maxLength) {
    const size = d.minLength === d.maxLength ? `${d.maxLength}` : `1 to ${d.maxLength}`
    return `${what} must be ${size} ${d.charset === 'N' ? 'digits' : 'characters'} (got ${value.length})`
  }
  if (d.key) {
    const check = d.key === 'sscc' ? isValidSscc(value) : isValidGtin(value)
    if (!check.ok) return `${what} ${value}: ${check.reason}`
  }
  if (d.date) {
    const problem = checkDate(value)
    if (problem) return `${what} ${value}: ${problem}`
  }
  return null
}

// Mutual exclusions and requirements among our AIs (GS1 Syntax Dictionary "ex" and "req" attributes). Each rule has
// its code, so a screen words the breach in the reader's language; the English `why` is for logs and tests.
const EXCLUSIONS: readonly { a: AiCode; b: AiCode; why: string; problem: Problem }[] = [
  { a: '01', b: '02', why: '(01) is a trade item\'s own GTIN, (02) the GTIN of the items inside a logistic unit', problem: problem('scan_pair_gtin_and_contained') },
  { a: '01', b: '37', why: 'a count belongs with (02) on a logistic unit, not with a trade item\'s (01)', problem: problem('scan_pair_count_with_gtin') },
]
const REQUIREMENTS: readonly { ai: AiCode; anyOf: AiCode[]; why: string; problem: Problem }[] = [
  { ai: '02', anyOf: ['37'], why: 'how many of the contained item the unit holds', problem: problem('scan_pair_contained_needs_count') },
  { ai: '37', anyOf: ['02'], why: 'which item is counted', problem: problem('scan_pair_count_needs_contained') },
  { ai: '37', anyOf: ['00'], why: 'GS1 allows a count only on a logistic unit with its own SSCC', problem: problem('scan_pair_count_needs_sscc') },
  { ai: '10', anyOf: ['01', '02'], why: 'a lot means nothing without the item', problem: problem('scan_pair_needs_item', { ai: '10' }) },
  { ai: '11', anyOf: ['01', '02'], why: 'a date means nothing without the item', problem: problem('scan_pair_needs_item', { ai: '11' }) },
  { ai: '17', anyOf: ['01', '02'], why: 'a date means nothing without the item', problem: problem('scan_pair_needs_item', { ai: '17' }) },
  { ai: '21', anyOf: ['01'], why: 'a serial number identifies one instance of a trade item', problem: problem('scan_pair_serial_needs_gtin') },
]

/** Breaches of GS1's pairing rules among the fields present: the English reason and the coded problem. */
export function checkPairings(fields: Gs1Fields): (Gs1Issue & { problem: Problem })[] {
  const has = (ai: AiCode) => fields[ai] !== undefined
  const issues: (Gs1Issue & { problem: Problem })[] = []
  for (const { a, b, why, problem: coded } of EXCLUSIONS) {
    if (has(a) && has(b)) issues.push({ ai: b, message: `${label(a)} and ${label(b)} cannot be in one barcode: ${why}`, problem: coded })
  }
  for (const { ai, anyOf, why, problem: coded } of REQUIREMENTS) {
    if (has(ai) && !anyOf.some(has)) {
      issues.push({ ai, message: `${label(ai)} needs ${anyOf.map(label).join(' or ')}: ${why}`, problem: coded })
    }
  }
  return issues
}

/** Every problem with a set of fields: unknown keys, bad values (in AI_ORDER), then pairing rules. */
export function validateFields(fields: Gs1Fields): Gs1Issue[] {
  const issues: Gs1Issue[] = Object.keys(fields)
    .filter((key) => !isAiCode(key) && fields[key as AiCode] !== undefined)
    .map((key) => ({ ai: null, message: `AI (${key}) is not one Lumenyard uses` }))
  for (const ai of AI_ORDER) {
    const value = fields[ai]
    const problem = value === undefined ? null : checkFieldValue(ai, value)
    if (problem) issues.push({ ai, message: problem })
  }
  if (AI_ORDER.every((ai) => fields[ai] === undefined) && issues.length === 0) {
    issues.push({ ai: null, message: 'a GS1 barcode needs at least one field' })
  }
  return issues.length > 0 ? issues : checkPairings(fields)
}

/** The HRI, scanner data and bwip-js text for a valid set of fields, or every reason it is not valid. */
export function buildElementString(fields: Gs1Fields): BuildResult {
  const errors = validateFields(fields)
  if (errors.length > 0) return { ok: false, errors }
  const order = AI_ORDER.filter((ai) => fields[ai] !== undefined)
  let hri = ''
  let raw = ''
  let bwipText = ''
  order.forEach((ai, i) => {
    const value = fields[ai] as string
    hri += `(${ai})${value}`
    bwipText += `(${ai})${value.replaceAll('(', '^040').replaceAll(')', '^041')}`
    raw += ai + value
    if (!AI_TABLE[ai].predefinedLength && i < order.length - 1) raw += GS
  })
  return { ok: true, hri, raw, bwipText, order }
}

/** Adds one parsed field, refusing a bad value or a repeat with a different value. */
const unreadable = (reason: string): ElementParse => ({ ok: false, reason, problem: problem('scan_gs1_unreadable') })
const badField = (ai: AiCode, reason: string): ElementParse => ({ ok: false, reason, problem: problem('scan_gs1_field_invalid', { ai }) })

function addField(acc: { fields: Gs1Fields; order: AiCode[] }, ai: AiCode, value: string): string | null {
  const problem = checkFieldValue(ai, value)
  if (problem) return problem
  const seen = acc.fields[ai]
  if (seen !== undefined) return seen === value ? null : `${label(ai)} appears twice with different values`
  acc.fields[ai] = value
  acc.order.push(ai)
  return null
}

function aiAt(data: string, pos: number): AiCode | undefined {
  return AI_ORDER.find((ai) => data.startsWith(ai, pos))
}

/** Scanner data (AIs and values, GS after variable-length fields) back into fields; each value is checked. */
export function parseElementData(data: string): ElementParse {
  const acc = { fields: {} as Gs1Fields, order: [] as AiCode[] }
  let pos = data.startsWith(GS) ? 1 : 0
  if (pos >= data.length) return unreadable('the barcode holds no GS1 data')
  while (pos < data.length) {
    const ai = aiAt(data, pos)
    if (!ai) {
      return unreadable(`unknown or unsupported GS1 AI at "${data.slice(pos, pos + 4)}…" (Lumenyard reads ${AI_ORDER.map((a) => `(${a})`).join(' ')})`)
    }
    const d = AI_TABLE[ai]
    const start = pos + ai.length
    let end: number
    if (d.predefinedLength) {
      end = start + d.maxLength
      if (end > data.length) return badField(ai, `${label(ai)} is cut short: ${d.maxLength} digits needed, ${data.length - start} found`)
    } else {
      const gs = data.indexOf(GS, start)
      end = gs === -1 ? data.length : gs
    }
    const wrong = addField(acc, ai, data.slice(start, end))
    if (wrong) return badField(ai, wrong)
    pos = data[end] === GS ? end + 1 : end
  }
  return { ok: true, ...acc }
}

const HRI_AI = /\((\d{2,4})\)/g

/**
 * Hand-typed or printed HRI, `(01)09506000134352 (10)ABC`, back into fields. Spaces are dropped (no GS1 value holds one).
 * A value that itself contains "(" + 2–4 digits + ")" cannot be told apart from the next AI; such a value is read as two fields.
 */
export function parseHri(text: string): ElementParse {
  const compact = text.replace(/ /g, '')
  const marks = [...compact.matchAll(HRI_AI)]
  if (marks.length === 0 || marks[0].index !== 0) return unreadable('GS1 text must start with an AI in brackets, like (01)')
  const acc = { fields: {} as Gs1Fields, order: [] as AiCode[] }
  for (let i = 0; i < marks.length; i++) {
    const code = marks[i][1]
    if (!isAiCode(code)) return unreadable(`AI (${code}) is not one Lumenyard reads`)
    const start = (marks[i].index as number) + marks[i][0].length
    const end = i + 1 < marks.length ? (marks[i + 1].index as number) : compact.length
    const wrong = addField(acc, code, compact.slice(start, end))
    if (wrong) return badField(code, wrong)
  }
  return { ok: true, ...acc }
}

/**
 * A YYMMDD value as an ISO date; DD 00 gives the last day of the month. The century follows GS1's sliding window
 * (GS1 Gen Specs §7.12, from memory; the same rule bwip-js applies): up to 50 years ahead, otherwise the past 49.
 */
export function gs1DateToIso(yymmdd: string, referenceYear: number): string {
  if (!/^\d{6}$/.test(yymmdd) || checkDate(yymmdd)) throw new RangeError(`"${yymmdd}" is not a GS1 YYMMDD date`)
  const yy = Number(yymmdd.slice(0, 2))
  const diff = yy - (referenceYear % 100)
  const century = Math.floor(referenceYear / 100) * 100 + (diff >= 51 ? -100 : diff <= -50 ? 100 : 0)
  const year = century + yy
  const month = Number(yymmdd.slice(2, 4))
  let day = Number(yymmdd.slice(4, 6))
  if (day === 0) day = new Date(Date.UTC(year, month, 0)).getUTCDate()
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0
  if (month === 2 && day === 29 && !leap) throw new RangeError(`${year} has no 29 February`)
  return `${String(year).padStart(4, '0')}-${yymmdd.slice(2, 4)}-${String(day).padStart(2, '0')}`
}
