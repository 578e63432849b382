// Words the computation writes that reach a screen: a scanned label's GS1 pairing warnings (receiving) and a
// reorder line's working (the buyer's drawer). Both arrive coded with their figures; this words them as the
// screens do, in English and in Spanish, and fails when a Spanish reader would get the English text.
import { afterEach, beforeAll, describe, expect, it } from 'vitest'
import { i18n } from '@/i18n'
import { problemText } from '@/i18n/errorText'
import enErrors from '@/i18n/en/errors'
import esErrors from '@/i18n/es/errors'
import enReceiving from '@/i18n/en/receiving'
import esReceiving from '@/i18n/es/receiving'
import enReorder from '@/i18n/en/reorder'
import esReorder from '@/i18n/es/reorder'
import { AI_ORDER, checkPairings, type Gs1Fields } from '@shared/barcode/elementString'
import { classifyScan } from '@shared/barcode/scan'
import { reorderSuggestion, type ReorderInput } from '@shared/inventory/reorder'
import type { ReorderStep } from '@shared/inventory/reorderWords'
import { readReceivingScan } from '@shared/purchasing/receiveScan'

const speak = (locale: 'en' | 'es') => {
  i18n.global.locale.value = locale
}
beforeAll(() => {
  i18n.global.mergeLocaleMessage('en', { errors: enErrors, receiving: enReceiving, reorder: enReorder })
  i18n.global.mergeLocaleMessage('es', { errors: esErrors, receiving: esReceiving, reorder: esReorder })
})
afterEach(() => speak('en'))

// A valid GTIN-14 and SSCC (mod-10 check digits as GS1 General Specifications 7.9.1 computes them, worked by hand).
const GTIN = '09506000134352'
const SSCC = '095287654321012346'
const SAMPLE: Record<string, string> = { '00': SSCC, '01': GTIN, '02': GTIN, '10': 'R1', '11': '240101', '17': '281231', '21': 'S1', '37': '12', '400': 'PO1' }

function everyCombination(): Gs1Fields[] {
  const out: Gs1Fields[] = []
  for (let mask = 1; mask < 1 << AI_ORDER.length; mask++) {
    const fields: Gs1Fields = {}
    AI_ORDER.forEach((ai, i) => { if (mask & (1 << i)) fields[ai] = SAMPLE[ai] })
    out.push(fields)
  }
  return out
}

describe('GS1 pairing warnings in the reader’s language', () => {
  const breaches = everyCombination().flatMap((fields) => checkPairings(fields))

  it('every breach of every combination of our AIs carries a code with words in both languages', () => {
    // source: GS1 Barcode Syntax Dictionary "ex"/"req" attributes (01 ex 02, 01 ex 37, 02 req 37, 37 req 02 and 00,
    // 10/11/17 req 01 or 02, 21 req 01): 511 combinations give breaches of all seven rules
    expect(new Set(breaches.map((b) => b.problem.code)).size).toBe(7)
    const english = new Map<string, string>()
    for (const b of breaches) english.set(JSON.stringify(b.problem), problemText(b.problem) ?? '')
    speak('es')
    for (const b of breaches) {
      const text = problemText(b.problem)
      expect(text, b.message).toBeTruthy()
      // common practice: a translation differs from the English it replaces, and never carries the log's English
      expect(text, b.message).not.toBe(english.get(JSON.stringify(b.problem)))
      expect(text, b.message).not.toContain(b.message.split(':')[1].trim())
    }
  })

  it('a (37) count beside a trade item’s (01) reads as a Spanish note at the receiving dock, never as the English rule', () => {
    // source: GS1 Barcode Syntax Dictionary, 01 ex 37 and 37 req 02, 00
    const scan = readReceivingScan(`(01)${GTIN}(37)6`, [{ poLineId: 1, sku: 'GB-1', gtin: GTIN, vendorSku: null, open: 10 }])
    expect(scan.kind).toBe('line')
    if (scan.kind !== 'line') return
    speak('es')
    const notes = scan.warnings.map((w) => i18n.global.t('receiving.warning', { text: problemText(w) ?? '' }))
    expect(notes).toHaveLength(3)
    // common practice: the English words of the rule (scan.ts logs them) never reach a Spanish reader
    for (const note of notes) {
      expect(note).toMatch(/^Nota: Esta etiqueta lleva/)
      expect(note).not.toMatch(/cannot be in one barcode|needs|count|logistic unit|trade item/)
    }
    const gs1 = classifyScan(`(01)${GTIN}(37)6`)
    expect(gs1.kind === 'gs1' && gs1.warnings.every((w) => typeof w === 'object' && 'code' in w)).toBe(true)
  })
})

describe('a reorder line’s working in the reader’s language', () => {
  // A line with every kind of step: pending units in the position, a lead time that varies, an override with its
  // reason, a vendor's pack and minimum, order-up-to, and a status decided by a comparison.
  const input: ReorderInput = {
    demand: { meanDaily: 4, sdDaily: 2, daysSinceLastUse: 1 },
    stock: { onHand: 20, onOrder: 10, reserved: 5, pending: 3 },
    unitCost: '2.50',
    policy: {
      serviceLevel: 0.95, leadTimeDays: 9, leadTimeSdDays: 2, method: 'orderUpTo', reviewPeriodDays: 7,
      costPerOrder: '40.00', holdingRatePerYear: 0.25, soonDays: 7, overstockMarginDays: 30, deadStockDays: 180,
      overrides: { orderQuantity: { value: 120, reason: 'truckload price break' } },
    },
    vendor: { packSize: 24, minimumOrder: 48 },
  }
  const word = (s: ReorderStep) => i18n.global.t(`reorder.step.${s.k}`, s.p ?? {})

  it('the English wording of each keyed step is the working the computation logs (one wording)', () => {
    const { explanation } = reorderSuggestion(input)
    expect(explanation.words.length).toBe(explanation.steps.length)
    expect(explanation.words.map(word)).toEqual(explanation.steps)
    // source: Silver, Pyke & Thomas, "Inventory and Production Management in Supply Chains", 4th ed., ch. 6:
    // safety stock with variable lead time z·√(L·σd² + d̄²·σL²); position = on hand + on order − backorders
    expect(explanation.steps).toContain('position = on hand + on order + pending − reserved = 20 + 10 + 3 − 5 = 28')
    expect(explanation.steps.some((s) => s.startsWith('SS = z·√(L·σd² + d̄²·σL²) = 1.6449 × √(9 × 2² + 4² × 2²)'))).toBe(true)
  })

  it('a Spanish reader gets every step in Spanish, the override’s own reason kept as typed', () => {
    const { explanation } = reorderSuggestion(input)
    speak('es')
    const spanish = explanation.words.map(word)
    expect(spanish).toHaveLength(explanation.steps.length)
    expect(spanish.filter((s, i) => s === explanation.steps[i]).length).toBeLessThan(spanish.length)
    // common practice: the English words of the working (position, pending, override, lot size, whole packs,
    // order, status names) never reach a Spanish reader; the symbols of the formulas (SS, ROP, EOQ, d̄) are shared
    const joined = spanish.join('\n')
    expect(joined).not.toMatch(/\b(position|on hand|on order|pending|reserved|override|lot size|whole packs|minimum|order now|order soon|overstocked|dead stock|no use|days|undefined)\b/)
    expect(joined).toContain('posición = existencias + pedido + pendiente − reservado = 20 + 10 + 3 − 5 = 28')
    expect(joined).toContain('(ajuste manual: truckload price break)')
  })

  it('every status comparison and the dead-stock steps are worded in Spanish too', () => {
    const lines: ReorderInput[] = [
      { ...input, demand: { meanDaily: 0, sdDaily: 0, daysSinceLastUse: null } },
      { ...input, demand: { meanDaily: 0.01, sdDaily: 0, daysSinceLastUse: 400 } },
      { ...input, stock: { onHand: 0, onOrder: 0, reserved: 0 }, policy: { ...input.policy, method: 'eoq', overrides: undefined } },
      { ...input, stock: { onHand: 9000, onOrder: 0, reserved: 0 } },
    ]
    speak('es')
    const seen = new Set<string>()
    for (const line of lines) {
      for (const s of reorderSuggestion(line).explanation.words) {
        seen.add(s.k)
        expect(word(s)).not.toMatch(/\b(dead stock|no use recorded|unreserved|order now|position|overstocked|ceiling|order =)\b/)
      }
    }
    // common practice: the four lines reach the dead-stock, order-now and overstocked comparisons
    for (const k of ['deadNoUse', 'deadIdle', 'orderNow', 'overstocked', 'orderLot']) expect(seen.has(k), k).toBe(true)
  })
})
