// Selling prices and sales tax (shared/pricing/): every figure below is worked by hand in the comment
// beside it, from the list price and the terms given; none is produced by the code under test.
import { describe, expect, it } from 'vitest'
import { percentOffPrice, resolvePrice, sellingQty, type PricedItem, type PriceLevelTerms, type PriceRule } from '../../shared/pricing/sellingPrice.js'
import { documentTax } from '../../shared/pricing/salesTax.js'

const block: PricedItem = { listPrice: '24.99', packSize: 1, sellByPack: false }
const spacers: PricedItem = { listPrice: '0.45', packSize: 100, sellByPack: true }
const contractor: PriceLevelTerms = { id: 7, code: 'CONTR', percentOff: '15' }
const levelBreak: PriceRule = { levelId: 7, minQty: 100, basis: 'unit', price: '19.50', percentOff: null }
const everyoneBreak: PriceRule = { levelId: null, minQty: 50, basis: 'unit', price: null, percentOff: '20' }

describe('price resolution: list, level, break, override', () => {
  it('no level: the list price; 10 × 24.99 = 249.90', () => {
    const p = resolvePrice({ item: block, qty: 10, level: null, rules: [] })
    expect(p).toMatchObject({ unitPrice: '24.99', extension: '249.90', explanation: { source: 'list' } })
  })

  it('a level 15 % off list: 24.99 × 0.85 = 21.2415 → 21.24 (half-up to the cent); 10 × 21.24 = 212.40', () => {
    expect(percentOffPrice('24.99', '15')).toBe('21.24')
    const p = resolvePrice({ item: block, qty: 10, level: contractor, rules: [levelBreak] })
    expect(p).toMatchObject({ unitPrice: '21.24', extension: '212.40', explanation: { source: 'level', levelCode: 'CONTR', percentOff: '15' } })
  })

  it('a quantity break applies from its quantity on: 99 at the level price, 100 at 19.50 (100 × 19.50 = 1,950.00)', () => {
    expect(resolvePrice({ item: block, qty: 99, level: contractor, rules: [levelBreak] }).unitPrice).toBe('21.24')
    const p = resolvePrice({ item: block, qty: 100, level: contractor, rules: [levelBreak] })
    expect(p).toMatchObject({ unitPrice: '19.50', extension: '1950.00', explanation: { source: 'break', minQty: 100, levelCode: 'CONTR' } })
  })

  it('the lowest price the account is entitled to wins: an all-accounts break of 20 % off (24.99 × 0.8 = 19.992 → 19.99) beats the level at 60', () => {
    const rules = [levelBreak, everyoneBreak]
    const at60 = resolvePrice({ item: block, qty: 60, level: contractor, rules })
    expect(at60).toMatchObject({ unitPrice: '19.99', extension: '1199.40', explanation: { source: 'break', allAccounts: true, minQty: 50 } })
    // At 100 the level's own break (19.50) is lower than 19.99.
    expect(resolvePrice({ item: block, qty: 100, level: contractor, rules }).unitPrice).toBe('19.50')
    // An account without a level reaches the all-accounts break too, never the level's.
    expect(resolvePrice({ item: block, qty: 100, level: null, rules }).unitPrice).toBe('19.99')
  })

  it("another level's rules are ignored", () => {
    const other: PriceRule = { levelId: 9, minQty: 1, basis: 'unit', price: '1.00', percentOff: null }
    expect(resolvePrice({ item: block, qty: 5, level: contractor, rules: [other] }).unitPrice).toBe('21.24')
  })

  it('an override replaces the resolved price and carries its reason and author: 10 × 20.00 = 200.00', () => {
    const p = resolvePrice({ item: block, qty: 10, level: contractor, rules: [levelBreak], override: { unitPrice: '20', reason: 'Matched a written quote', by: 'Dev Okafor' } })
    expect(p).toMatchObject({ unitPrice: '20.00', extension: '200.00', explanation: { source: 'override', overrideReason: 'Matched a written quote', overrideBy: 'Dev Okafor' } })
  })
})

describe('pack pricing (items sold by the case)', () => {
  it('250 spacers sold by the case of 100 become 3 cases = 300; 0.45 × 100 = 45.00 a case; 3 × 45.00 = 135.00', () => {
    expect(sellingQty(250, spacers)).toEqual({ qty: 300, packs: 3 })
    const p = resolvePrice({ item: spacers, qty: 250, level: null, rules: [] })
    expect(p).toMatchObject({ qty: 300, packs: 3, packPrice: '45.00', unitPrice: '0.45', extension: '135.00' })
  })

  it('a case price rule: 39.99 a case is 0.3999 a unit; 3 cases × 39.99 = 119.97 (never 300 × 0.40 = 120.00)', () => {
    const rule: PriceRule = { levelId: 7, minQty: 1, basis: 'pack', price: '39.99', percentOff: null }
    const caseOnly: PriceLevelTerms = { id: 7, code: 'CONTR', percentOff: null }
    const p = resolvePrice({ item: spacers, qty: 300, level: caseOnly, rules: [rule] })
    expect(p).toMatchObject({ packs: 3, packPrice: '39.99', unitPrice: '0.3999', extension: '119.97', explanation: { source: 'level', basis: 'pack' } })
    // With the level's 15 % off list (0.38 a unit = 38.00 a case) the lower price wins: 3 × 38.00 = 114.00.
    expect(resolvePrice({ item: spacers, qty: 300, level: contractor, rules: [rule] }).extension).toBe('114.00')
  })

  it('a level percentage on a case item: 0.45 × 0.85 = 0.3825 → 0.38 a unit, 38.00 a case, 2 cases = 76.00', () => {
    const p = resolvePrice({ item: spacers, qty: 200, level: contractor, rules: [] })
    expect(p).toMatchObject({ unitPrice: '0.38', packPrice: '38.00', extension: '76.00' })
  })

  it('a case rule on an item not sold by the case does not apply', () => {
    const rule: PriceRule = { levelId: 7, minQty: 1, basis: 'pack', price: '1.00', percentOff: null }
    expect(resolvePrice({ item: block, qty: 10, level: contractor, rules: [rule] }).unitPrice).toBe('21.24')
  })

  it('a quantity of 0, a fraction or a negative is refused', () => {
    for (const qty of [0, -1, 2.5]) expect(() => resolvePrice({ item: block, qty, level: null, rules: [] })).toThrow(RangeError)
  })
})

describe('sales tax, rounded to the cent once per document', () => {
  // source: Streamlined Sales and Use Tax Agreement, section 324 (rounding rule), from memory: tax is
  // carried to the third decimal place and rounded up to the next cent when the third decimal is greater than four.
  it('212.40 + 135.00 = 347.40 at 8.25 % = 28.6605 → 28.66', () => {
    expect(documentTax(['212.40', '135.00'], '8.25', null, '2026-12-04')).toMatchObject({ taxable: '347.40', tax: '28.66' })
  })

  it('third decimal 4 rounds down: 100.06 × 7.5 % = 7.5045 → 7.50; third decimal 5 rounds up: 100.07 × 7.5 % = 7.50525 → 7.51', () => {
    expect(documentTax(['100.06'], '7.5', null, '2026-12-04').tax).toBe('7.50')
    expect(documentTax(['100.07'], '7.5', null, '2026-12-04').tax).toBe('7.51')
  })

  it('once per document, not per line: 3 lines of 0.10 at 5 % = 0.015 → 0.02 (per line 0.005 → 0.01 each would make 0.03)', () => {
    expect(documentTax(['0.10', '0.10', '0.10'], '5', null, '2026-12-04').tax).toBe('0.02')
  })

  it('an exempt account pays no tax while its certificate holds, and tax again the day after it expires', () => {
    const cert = { certificate: 'RS-40112', validUntil: '2026-12-31' }
    expect(documentTax(['500.00'], '8.25', cert, '2026-12-31')).toMatchObject({ tax: '0.00', exemptCertificate: 'RS-40112' })
    // 500.00 × 8.25 % = 41.25
    expect(documentTax(['500.00'], '8.25', cert, '2027-01-01').tax).toBe('41.25')
  })

  it('no rate set for the location: no tax, and the answer says so', () => {
    expect(documentTax(['10.00'], null, null, '2026-12-04')).toMatchObject({ tax: '0.00', noRate: true })
  })
})
