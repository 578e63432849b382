// What a keyboard-wedge or camera scanner delivers, read back into what it means to Lumenyard,
// plus the payloads our own labels carry, so printing and scanning share one definition.

import { problem, type Problem } from '../errors/errorCodes.js'
import { GTIN_LENGTHS, normalizeGtin } from './checkDigit.js'
import {
  buildElementString, checkFieldValue, checkPairings, GS, parseElementData, parseHri,
  type AiCode, type Gs1Fields,
} from './elementString.js'

/** Our bin labels: Code 128 of this prefix + the bin code, e.g. "B:A-03-2". */
export const BIN_PREFIX = 'B:'
/** Our lot labels for items without a GTIN: Code 128 of this prefix + SKU + LOT_SEPARATOR + lot code, e.g. "L:GB-8812|R2405". */
export const LOT_PREFIX = 'L:'
/** Not in GS1 character set 82, so it never occurs in a lot code, and never in a SKU either. */
export const LOT_SEPARATOR = '|'

/** A SKU: letters, digits, - . _ /, up to 40, starting with a letter or digit (all-digit GTIN lengths are read as GTINs). */
export const SKU_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._/-]{0,39}$/
/** A bin code such as aisle-bay-level: same characters as a SKU, up to 32. */
export const BIN_CODE_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._/-]{0,31}$/

// Symbology identifiers (ISO/IEC 15424). ]C0, ]C1, ]E0, ]d2, ]Q3 as the GS1 General Specifications list them; ]E4, ]d1, ]Q1, ]e0 from memory.
const SYMBOLOGIES: Readonly<Record<string, { name: string; gs1: boolean }>> = {
  ']C0': { name: 'Code 128', gs1: false },
  ']C1': { name: 'GS1-128', gs1: true },
  ']E0': { name: 'EAN-13 / UPC-A', gs1: false },
  ']E4': { name: 'EAN-8', gs1: false },
  ']d1': { name: 'Data Matrix', gs1: false },
  ']d2': { name: 'GS1 DataMatrix', gs1: true },
  ']Q1': { name: 'QR Code', gs1: false },
  ']Q3': { name: 'GS1 QR Code', gs1: true },
  ']e0': { name: 'GS1 DataBar', gs1: true },
}
const SYMBOLOGY_ID = /^\][A-Za-z][0-9A-Za-z]/

export type ParsedScan =
  | { kind: 'gs1'; symbology: string | null; fields: Gs1Fields; order: AiCode[] }
  | { kind: 'text'; symbology: string | null; text: string }
  | { kind: 'invalid'; symbology: string | null; reason: string; problem: Problem }

export type ScanClass =
  | {
      kind: 'gs1'
      fields: Gs1Fields
      /** The trade item's GTIN-14: (01), or (02) on a logistic unit, where `count` says how many. */
      gtin?: string
      lot?: string
      count?: number
      sscc?: string
      serial?: string
      /** Breaches of GS1 pairing rules, coded: the data is still readable, the screen decides whether to accept it. */
      warnings: Problem[]
    }
  | { kind: 'gtin'; gtin: string; scanned: string }
  | { kind: 'bin'; code: string }
  | { kind: 'lot'; itemSku: string; lotCode: string }
  | { kind: 'sku'; sku: string }
  /** Why it is none of these: `reason` in English for logs, `problem` for the screen (worded in the user's language). */
  | { kind: 'invalid'; reason: string; problem: Problem }

export interface ScanOptions {
  binPrefix?: string
  lotPrefix?: string
}

const isDigits = (s: string) => /^[0-9]+$/.test(s)
const looksLikeGtin = (s: string) => isDigits(s) && GTIN_LENGTHS.includes(s.length)

function fromElements(symbology: string | null, data: string, parse: (d: string) => ReturnType<typeof parseElementData>): ParsedScan {
  const result = parse(data)
  return result.ok
    ? { kind: 'gs1', symbology, fields: result.fields, order: result.order }
    : { kind: 'invalid', symbology, reason: result.reason, problem: result.problem }
}

/**
 * Splits off the symbology identifier and reads GS1 content. GS1 content is recognised by a GS1 identifier
 * (]C1 ]d2 ]Q3 ]e0), a GS in the data, a leading "(NN)" typed by hand, or, for scanners set to send no identifier,
 * data of 16+ characters starting 00/01/02 that parses completely.
 */
export function parseScan(raw: string): ParsedScan {
  // Scanners end with Enter (CR/LF) or Tab; JavaScript's trim leaves GS alone.
  let data = raw.trim()
  let symbology: string | null = null
  if (SYMBOLOGY_ID.test(data)) {
    symbology = data.slice(0, 3)
    data = data.slice(3)
  }
  if (data.length === 0) return { kind: 'invalid', symbology, reason: symbology ? `nothing after the ${symbology} prefix` : 'nothing was scanned', problem: problem('scan_empty') }
  if (symbology && SYMBOLOGIES[symbology]?.gs1) return fromElements(symbology, data, parseElementData)
  if (symbology) return { kind: 'text', symbology, text: data }
  if (data.includes(GS)) return fromElements(null, data, parseElementData)
  if (/^\(\d{2,4}\)/.test(data)) return fromElements(null, data, parseHri)
  if (data.length >= 16 && /^0[012]\d/.test(data)) {
    const guess = parseElementData(data)
    if (guess.ok) return { kind: 'gs1', symbology: null, fields: guess.fields, order: guess.order }
  }
  return { kind: 'text', symbology, text: data }
}

function classifyGs1(fields: Gs1Fields): ScanClass {
  const gtin = fields['01'] ?? fields['02']
  const count = fields['37']
  return {
    kind: 'gs1',
    fields,
    ...(gtin !== undefined && { gtin }),
    ...(fields['10'] !== undefined && { lot: fields['10'] }),
    ...(count !== undefined && { count: Number(count) }),
    ...(fields['00'] !== undefined && { sscc: fields['00'] }),
    ...(fields['21'] !== undefined && { serial: fields['21'] }),
    warnings: checkPairings(fields).map((issue) => issue.problem),
  }
}

const startsWithPrefix = (text: string, prefix: string) => text.slice(0, prefix.length).toUpperCase() === prefix.toUpperCase()

/** Our bin and lot labels; prefixes match in either case, since a keyboard wedge under Caps Lock flips letters. */
function classifyOwnLabel(text: string, binPrefix: string, lotPrefix: string): ScanClass | null {
  if (startsWithPrefix(text, binPrefix)) {
    const code = text.slice(binPrefix.length)
    const wrong = binCodeProblem(code)
    return wrong ? { kind: 'invalid', reason: `bin label ${text}: ${wrong}`, problem: problem('scan_bin_label_invalid', { text }) } : { kind: 'bin', code }
  }
  if (startsWithPrefix(text, lotPrefix)) {
    const body = text.slice(lotPrefix.length)
    const cut = body.indexOf(LOT_SEPARATOR)
    if (cut === -1) return { kind: 'invalid', reason: `lot label ${text}: no "${LOT_SEPARATOR}" between SKU and lot code`, problem: problem('scan_lot_label_invalid', { text }) }
    const itemSku = body.slice(0, cut)
    const lotCode = body.slice(cut + 1)
    const wrong = skuProblem(itemSku) ?? lotCodeProblem(lotCode)
    return wrong ? { kind: 'invalid', reason: `lot label ${text}: ${wrong}`, problem: problem('scan_lot_label_invalid', { text }) } : { kind: 'lot', itemSku, lotCode }
  }
  return null
}

/** The address of an item's page, which the QR Code of item and lot labels held before it held the bars' data. */
const OLD_ITEM_PAGE_LINK = /^https?:\/\/[^/\s]+\/stock\/items\/\d+\/?$/i

function classifyText(text: string, symbology: string | null, options: ScanOptions): ScanClass {
  const own = classifyOwnLabel(text, options.binPrefix || BIN_PREFIX, options.lotPrefix || LOT_PREFIX)
  if (own) return own
  if (OLD_ITEM_PAGE_LINK.test(text)) {
    return { kind: 'invalid', reason: 'This QR Code is from an older label and only opens the item\'s page: scan the bars on the same label, and print a new label when you can.', problem: problem('scan_old_qr') }
  }
  const isEanUpc = symbology === ']E0' || symbology === ']E4'
  if (looksLikeGtin(text)) {
    const gtin = normalizeGtin(text)
    return gtin.ok ? { kind: 'gtin', gtin: gtin.gtin14, scanned: text } : { kind: 'invalid', reason: `${text}: ${gtin.reason}`, problem: gtin.problem }
  }
  if (isEanUpc) return { kind: 'invalid', reason: `${text} is not a GTIN: an EAN/UPC barcode holds 8, 12 or 13 digits`, problem: problem('scan_not_gtin', { text }) }
  if (SKU_PATTERN.test(text)) return { kind: 'sku', sku: text }
  return { kind: 'invalid', reason: `"${text}" is not a Lumenyard code: a SKU holds only letters, digits and - . _ / (at most 40)`, problem: problem('scan_not_ours', { text }) }
}

/** What a scan means: GS1 data, a bare GTIN, one of our bin or lot labels, a SKU, or why it is none of these. */
export function classifyScan(raw: string, options: ScanOptions = {}): ScanClass {
  const parsed = parseScan(raw)
  if (parsed.kind === 'invalid') return { kind: 'invalid', reason: parsed.reason, problem: parsed.problem }
  if (parsed.kind === 'gs1') return classifyGs1(parsed.fields)
  return classifyText(parsed.text, parsed.symbology, options)
}

/** One scan read once, where it enters (the handheld's scan box): the text as scanned and what it means. */
export interface ReadScan {
  raw: string
  scan: ScanClass
}

export const readScan = (raw: string): ReadScan => ({ raw, scan: classifyScan(raw) })

/** A scan as the checks take it: already read (the handheld), or the text as stored (the server reads it here). */
export type ScanInput = string | ReadScan

export const asRead = (input: ScanInput): ReadScan => (typeof input === 'string' ? readScan(input) : input)

// ---- label payloads ----

/** What to render and what a scanner will give back. Pass `bwip` straight to bwip-js, adding scale and the like. */
export interface LabelPayload {
  bwip: { bcid: 'code128' | 'gs1-128'; text: string; parse?: true }
  /** The line printed under the bars. */
  hri: string
  /** What a scanner sends without symbology identifier (GS1: AI data with GS separators). */
  data: string
}

/** What is wrong with a SKU, as a code for screens; skuProblem gives the same in English. */
export function skuIssue(sku: string): 'sku_chars' | 'sku_like_gtin' | null {
  if (!SKU_PATTERN.test(sku)) return 'sku_chars'
  return looksLikeGtin(sku) ? 'sku_like_gtin' : null
}

export function skuProblem(sku: string): string | null {
  const issue = skuIssue(sku)
  if (issue === 'sku_chars') return `SKU "${sku}" must be 1 to 40 letters, digits or - . _ /, starting with a letter or digit`
  if (issue === 'sku_like_gtin') return `SKU "${sku}" would read as a GTIN: a SKU cannot be all digits of length 8, 12, 13 or 14`
  return null
}

export function binCodeProblem(code: string): string | null {
  return BIN_CODE_PATTERN.test(code) ? null : `bin code "${code}" must be 1 to 32 letters, digits or - . _ /, starting with a letter or digit`
}

/** Lot codes follow GS1 (10) rules even without a GTIN, so a lot keeps its code if the item later gets one. */
export function lotCodeProblem(lotCode: string): string | null {
  return checkFieldValue('10', lotCode)
}

function fail(problem: string | null): void {
  if (problem) throw new RangeError(problem)
}

function code128(text: string): LabelPayload {
  return { bwip: { bcid: 'code128', text }, hri: text, data: text }
}

function gs1Label(fields: Gs1Fields): LabelPayload {
  const built = buildElementString(fields)
  if (!built.ok) throw new RangeError(built.errors.map((e) => e.message).join('; '))
  return { bwip: { bcid: 'gs1-128', text: built.bwipText, parse: true }, hri: built.hri, data: built.raw }
}

function gtin14For(gtin: string): string {
  const normal = normalizeGtin(gtin)
  if (!normal.ok) throw new RangeError(normal.reason)
  return normal.gtin14
}

/** A bin label: Code 128 of "B:" + code. Throws RangeError with the reason when the code is not a valid bin code. */
export function binLabelPayload(code: string, options: Pick<ScanOptions, 'binPrefix'> = {}): LabelPayload {
  fail(binCodeProblem(code))
  return code128((options.binPrefix || BIN_PREFIX) + code)
}

/** A lot label: GS1-128 (01)+(10) when the item has a GTIN, else Code 128 "L:" + SKU + "|" + lot. Throws RangeError. */
export function lotLabelPayload(lot: { sku: string; lotCode: string; gtin?: string | null }, options: Pick<ScanOptions, 'lotPrefix'> = {}): LabelPayload {
  fail(lotCodeProblem(lot.lotCode))
  if (lot.gtin) return gs1Label({ '01': gtin14For(lot.gtin), '10': lot.lotCode })
  fail(skuProblem(lot.sku))
  return code128(`${options.lotPrefix || LOT_PREFIX}${lot.sku}${LOT_SEPARATOR}${lot.lotCode}`)
}

/** An item label: GS1-128 (01) when the item has a GTIN (any length, padded to 14), else Code 128 of the SKU. Throws RangeError. */
export function itemLabelPayload(item: { sku: string; gtin?: string | null }): LabelPayload {
  if (item.gtin) return gs1Label({ '01': gtin14For(item.gtin) })
  fail(skuProblem(item.sku))
  return code128(item.sku)
}
