// The catalog's shared rules, checked against outside sources: GS1 check digits, the IRC's least
// glass unit thickness, inch arithmetic, and the bin range and pattern rules of the warehouse set-up.
import { describe, expect, it } from 'vitest'
import { zodFieldProblems } from '../../shared/errors/zodProblems.js'
import { actualFaceFromNominal } from '../../shared/blockFace.js'
import { itemSchema, LEAST_THICKNESS_MM } from '../../shared/schemas/catalog.js'
import { binPatternProblem, binRangeCodes, binRangeSchema, DEFAULT_BIN_PATTERN, warehouseSchema } from '../../shared/schemas/warehouses.js'

const block = (extra: Record<string, unknown> = {}) => ({
  sku: 'GB-TEST-1', name: 'Test block', family: 'glass_block', stockUnit: 'each', cost: '7.80', listPrice: '13.95',
  nominalSize: '8x8', faceWidthMm: '196.85', faceHeightMm: '196.85', depthMm: '98.43', thicknessClass: 'standard', shape: 'square', ...extra,
})
/** The coded problem per field, as the server answers and the form shows it. */
const fieldErrors = (input: unknown) => {
  const r = itemSchema.safeParse(input)
  return r.success ? {} : zodFieldProblems(r.error)
}

describe('item schema', () => {
  it('accepts a GTIN with the right GS1 check digit and stores it as 14 digits', () => {
    // source: GS1 check digit calculation (General Specifications §7.9.1); 629104150021 → 3 is gs1.org's worked example (from memory)
    const parsed = itemSchema.parse(block({ gtin: '6291041500213' }))
    expect(parsed.gtin).toBe('06291041500213')
    expect(fieldErrors(block({ gtin: '6291041500214' })).gtin).toEqual({ code: 'check_digit_wrong', params: { label: 'GTIN-13', expected: 3, actual: 4 } })
    expect(fieldErrors(block({ gtin: '62910415002' })).gtin).toEqual({ code: 'gtin_length', params: { length: 11 } })
    expect(itemSchema.parse(block({ gtin: '' })).gtin).toBeNull()
  })

  it('refuses a SKU a scanner would read as a GTIN', () => {
    expect(fieldErrors(block({ sku: '629104150021' })).sku).toEqual({ code: 'sku_like_gtin' })
    expect(fieldErrors(block({ sku: 'has space' })).sku).toEqual({ code: 'sku_chars' })
  })

  it('holds blocks to the least thickness of IRC 2021 R607.3', () => {
    // source: IRC 2021 R607.3, standard units at least 3 7/8 in, thin units at least 3 1/8 in; 1 in = 25.4 mm (NIST SP 811)
    expect(LEAST_THICKNESS_MM.standard).toBeCloseTo(98.425, 6)
    expect(LEAST_THICKNESS_MM.thin).toBeCloseTo(79.375, 6)
    expect(fieldErrors(block())).toEqual({})
    expect(fieldErrors(block({ depthMm: '98.00' })).depthMm).toEqual({ code: 'standard_block_too_thin', params: { min: LEAST_THICKNESS_MM.standard, unit: 'mm' } })
    expect(fieldErrors(block({ depthMm: '79.38', thicknessClass: 'thin' }))).toEqual({})
    expect(fieldErrors(block({ depthMm: '80', thicknessClass: 'thin' }))).toEqual({}) // an 80 mm metric unit is a thin unit
    expect(fieldErrors(block({ depthMm: '79.00', thicknessClass: 'thin' })).depthMm).toEqual({ code: 'thin_block_too_thin', params: { min: LEAST_THICKNESS_MM.thin, unit: 'mm' } })
  })

  it('requires block attributes only of blocks, and whole cases per pallet', () => {
    const spacer = { sku: 'SP-1', name: 'Spacer', family: 'spacer', stockUnit: 'each', cost: '0.31', listPrice: '0.65' }
    expect(fieldErrors(spacer)).toEqual({})
    expect(Object.keys(fieldErrors({ ...spacer, family: 'glass_block' })).sort()).toEqual(['depthMm', 'faceHeightMm', 'faceWidthMm', 'nominalSize', 'shape', 'thicknessClass'])
    expect(fieldErrors(block({ caseQty: 8, palletQty: 324 })).palletQty).toEqual({ code: 'pallet_whole_cases', params: { caseQty: 8 } })
    expect(fieldErrors(block({ caseQty: '8', palletQty: '320' }))).toEqual({})
  })

  it('keeps money as decimal text, never a float', () => {
    expect(itemSchema.parse(block({ cost: 7.8 })).cost).toBe('7.8')
    expect(fieldErrors(block({ cost: '7.80001' })).cost).toEqual({ code: 'cost_format' })
    expect(fieldErrors(block({ listPrice: '$13.95' })).listPrice).toBeDefined()
  })
})

describe('actual face from nominal size', () => {
  it('takes 1/4 in off inch sizes and reads metric sizes as actual', () => {
    // common practice: actual face = nominal − 1/4 in; 7 3/4 in × 25.4 = 196.85 mm (NIST SP 811)
    expect(actualFaceFromNominal('8x8')).toMatchObject({ widthMm: 196.85, heightMm: 196.85, metric: false })
    expect(actualFaceFromNominal('4x8')).toMatchObject({ widthMm: 196.85, heightMm: 95.25 })
    expect(actualFaceFromNominal('12 × 12')!.widthMm).toBeCloseTo(298.45, 6)
    expect(actualFaceFromNominal('190x90')).toEqual({ widthMm: 190, heightMm: 90, metric: true })
    expect(actualFaceFromNominal('eight')).toBeNull()
  })
})

describe('warehouse set-up rules', () => {
  it('expands a bin range aisle by aisle, bay by bay, level by level', () => {
    const codes = binRangeCodes({ aisleFrom: 'A', aisleTo: 'C', bayFrom: 1, bayTo: 10, levelFrom: 1, levelTo: 3 })
    expect(codes).toHaveLength(3 * 10 * 3)
    expect(codes.slice(0, 4)).toEqual(['A-01-1', 'A-01-2', 'A-01-3', 'A-02-1'])
    expect(codes.at(-1)).toBe('C-10-3')
    expect(new Set(codes).size).toBe(codes.length)
    expect(codes.every((c) => new RegExp(DEFAULT_BIN_PATTERN).test(c))).toBe(true)
    expect(binRangeSchema.safeParse({ aisleFrom: 'A', aisleTo: 'Z', bayFrom: 1, bayTo: 100, levelFrom: 1, levelTo: 9 }).success).toBe(false)
  })

  it('requires a bin pattern that compiles, is anchored and names aisle, bay and level', () => {
    expect(binPatternProblem(DEFAULT_BIN_PATTERN)).toBeNull()
    expect(binPatternProblem('^(?<aisle>[A-Z]+$')).toEqual({ code: 'bin_pattern_invalid' })
    expect(binPatternProblem('(?<aisle>[A-Z])(?<bay>\\d)(?<level>\\d)')).toEqual({ code: 'bin_pattern_anchors' })
    expect(binPatternProblem('^(?<aisle>[A-Z]+)-(?<bay>\\d+)$')).toEqual({ code: 'bin_pattern_groups', params: { missing: ['level'] } })
    expect(warehouseSchema.parse({ code: 'HRY', name: 'Yard' }).binPattern).toBe(DEFAULT_BIN_PATTERN)
  })
})
