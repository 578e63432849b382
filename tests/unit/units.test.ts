// Feature: unit conversions and length text (shared/units.ts).
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  feetToMm,
  flOzToIn3,
  flOzToMl,
  formatInches,
  formatLength,
  formatSize,
  ft2ToM2,
  in3ToMl,
  inchesToMm,
  kgToPounds,
  LengthParseError,
  m2ToFt2,
  mlToFlOz,
  mmToInches,
  parseLength,
  poundsToKg,
  tryParseLength,
} from '../../shared/units.js'

describe('conversion factors', () => {
  it('inch, foot and square foot match NIST SP 811 appendix B', () => {
    // source: NIST SP 811 B: 1 in = 0.0254 m, 1 ft = 0.3048 m, 1 ft² = 0.09290304 m² (all exact)
    expect(inchesToMm(1)).toBe(25.4)
    expect(feetToMm(1)).toBeCloseTo(304.8, 12)
    expect(ft2ToM2(1)).toBeCloseTo(0.09290304, 14)
    // source: 144 ft² × 0.09290304 = 13.378 m², the "13.4 m²" printed beside IRC 2021 R607.4.1
    expect(ft2ToM2(144)).toBeCloseTo(13.378, 3)
    expect(m2ToFt2(ft2ToM2(250))).toBeCloseTo(250, 10)
    expect(mmToInches(196.85)).toBeCloseTo(7.75, 12)
  })

  it('fluid ounce and cubic inch match NIST SP 811 appendix B', () => {
    // source: NIST SP 811 B: 1 US fl oz = 2.957353e-5 m³ (29.5735295625 mL exactly) = 1.8046875 in³ (231/128)
    expect(flOzToMl(1)).toBe(29.5735295625)
    expect(flOzToIn3(1)).toBe(231 / 128)
    // source: NIST SP 811 B: 1 in³ = 1.6387064e-5 m³; so 1.8046875 in³ × 16.387064 mL = 29.5735295625 mL
    expect(in3ToMl(flOzToIn3(1))).toBeCloseTo(29.5735295625, 10)
  })

  it('a 10.1 fl oz cartridge is 298.69 mL and 18.227 in³', () => {
    // hand-worked: 10.1 × 29.5735295625 = 298.692648... mL; 10.1 × 1.8046875 = 18.22734375 in³
    expect(flOzToMl(10.1)).toBeCloseTo(298.6926, 4)
    expect(flOzToIn3(10.1)).toBeCloseTo(18.2273, 4)
    expect(mlToFlOz(298.69)).toBeCloseTo(10.1, 3)
  })

  it('pound to kilogram is 0.45359237 exactly', () => {
    // source: NIST SP 811 B: 1 lb (avoirdupois) = 0.45359237 kg
    expect(poundsToKg(1)).toBe(0.45359237)
    // hand-worked: 50 lb × 0.45359237 = 22.6796185 kg
    expect(poundsToKg(50)).toBeCloseTo(22.6796185, 9)
    expect(kgToPounds(0.45359237)).toBeCloseTo(1, 12)
  })
})

describe('formatInches', () => {
  it('shows fractions to the sixteenth, reduced', () => {
    // hand-worked: 196.85 mm ÷ 25.4 = 7.75 in = 7 12/16 = 7 3/4
    expect(formatInches(196.85)).toBe('7 3/4″')
    // hand-worked: 3.175 mm = 0.125 in = 1/8
    expect(formatInches(3.175)).toBe('1/8″')
    // hand-worked: 1828.8 mm = 72 in exactly
    expect(formatInches(1828.8)).toBe('72″')
    expect(formatInches(0)).toBe('0″')
    expect(formatInches(-196.85)).toBe('-7 3/4″')
    // a hair below zero rounds to 0, with no stray sign
    expect(formatInches(-0.1)).toBe('0″')
  })

  it('rounds to the nearest sixteenth unless told to round up', () => {
    // hand-worked: 100 mm = 3.937 in = 62.99 sixteenths → 63/16 = 3 15/16
    expect(formatInches(100)).toBe('3 15/16″')
    // hand-worked: 1550.15 mm = 61.030 in = 976.48 sixteenths → nearest 976 (61), up 977 (61 1/16)
    expect(formatInches(1550.15)).toBe('61″')
    expect(formatInches(1550.15, { rounding: 'up' })).toBe('61 1/16″')
  })

  it('shows feet and inches on request', () => {
    // hand-worked: 5 ft 2 1/8 in = 62.125 in × 25.4 = 1577.975 mm
    expect(formatInches(1577.975, { feet: true })).toBe('5′ 2 1/8″')
    // hand-worked: 84 in = 7 ft 0 in
    expect(formatInches(2133.6, { feet: true })).toBe('7′ 0″')
    // under a foot the feet are left off
    expect(formatInches(196.85, { feet: true })).toBe('7 3/4″')
  })

  it('writes feet and inches in words for sentences and order specs', () => {
    // hand-worked: 1000 in = 83 ft 4 in = 25,400 mm
    expect(formatInches(25_400, { feet: true, style: 'words' })).toBe('83 ft 4 in')
    // hand-worked: 100 ft = 30,480 mm exactly (NIST SP 811: 1 ft = 0.3048 m); no trailing "0 in"
    expect(formatLength(30_480, 'in', { feet: true, style: 'words' })).toBe('100 ft')
    // hand-worked: 48 in = 1219.2 mm; stored as 1219.1999999999998 after 48 × 25.4
    expect(formatLength(48 * 25.4, 'in', { style: 'words' })).toBe('48 in')
    expect(formatLength(48 * 25.4, 'in', { feet: true, style: 'words' })).toBe('4 ft')
    // hand-worked: 5 ft 2 1/8 in = 1577.975 mm
    expect(formatLength(1577.975, 'in', { feet: true, style: 'words' })).toBe('5 ft 2 1/8 in')
    expect(formatLength(196.85, 'in', { style: 'words' })).toBe('7 3/4 in')
    expect(formatLength(48 * 25.4, 'mm', { style: 'words' })).toBe('1219.2 mm')
  })

  it('words read back through parseLength', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 20_000, noNaN: true }), (mm) => {
        const back = parseLength(formatInches(mm, { feet: true, style: 'words' }))
        expect(Math.abs(back - mm)).toBeLessThanOrEqual(25.4 / 32 + 1e-9)
      }),
    )
  })

  it('formatLength picks the unit', () => {
    expect(formatLength(196.85, 'in')).toBe('7 3/4″')
    expect(formatLength(196.85, 'mm')).toBe('196.9 mm')
    expect(formatLength(190, 'mm')).toBe('190 mm')
  })
})

describe('formatSize', () => {
  // 1 in = 25.4 mm exactly (NIST SP 811, appendix B): 48 in = 1219.2 mm, 36 in = 914.4 mm, 42 in = 1066.8 mm.
  it('writes a size typed in inches in one unit, without binary noise, the millimetre sign once', () => {
    const inches48 = 48 * 25.4 // 1219.1999999999998 in binary floating point
    expect(String(inches48)).toBe('1219.1999999999998')
    expect(formatSize([inches48, 36 * 25.4], 'in')).toBe('48″ × 36″')
    expect(formatSize([inches48, 36 * 25.4], 'in', { style: 'words' })).toBe('48 in × 36 in')
    expect(formatSize([inches48, 36 * 25.4], 'mm')).toBe('1219.2 × 914.4 mm')
    expect(formatSize([1066.8, 1219.2, 88.9], 'mm')).toBe('1066.8 × 1219.2 × 88.9 mm')
  })
})

describe('parseLength', () => {
  it.each([
    // hand-worked: each written form below is 7.75 in = 196.85 mm
    ['7 3/4"', 196.85],
    ['7-3/4"', 196.85],
    ['7.75 in', 196.85],
    ['7.75in', 196.85],
    ['7 3/4 inches', 196.85],
    ['7 3/4″', 196.85],
    // hand-worked: 5 ft 2 in = 62 in = 1574.8 mm
    ["5' 2\"", 1574.8],
    ['5′ 2″', 1574.8],
    ['5 ft 2 in', 1574.8],
    ["5'-2\"", 1574.8],
    // hand-worked: 6 ft = 1828.8 mm
    ["6'", 1828.8],
    ['6 ft', 1828.8],
    ['190 mm', 190],
    ['19 cm', 190],
    ['1.9 m', 1900],
    ['3/8"', 9.525],
  ])('reads %s', (text, mm) => {
    expect(parseLength(text)).toBeCloseTo(mm, 9)
  })

  it('a bare number takes the default unit', () => {
    expect(parseLength('190')).toBe(190)
    expect(parseLength('8', 'in')).toBeCloseTo(203.2, 12)
  })

  it('says clearly what it cannot read', () => {
    expect(() => parseLength('abc')).toThrow(LengthParseError)
    expect(() => parseLength('abc')).toThrow(/Can't read "abc" as a length/)
    expect(() => parseLength('')).toThrow(/empty/)
    expect(() => parseLength('-5 in')).toThrow(/negative/)
    expect(() => parseLength('3/0"')).toThrow(/0 below the line/)
    expect(() => parseLength('12 parsecs')).toThrow(LengthParseError)
    const result = tryParseLength('seven inches')
    expect(result.ok).toBe(false)
    if (!result.ok) expect(result.message).toContain('Try 7 3/4"')
    expect(tryParseLength('190 mm')).toEqual({ ok: true, mm: 190 })
  })

  it('gives each refusal a code a screen can word in the user’s language', () => {
    const code = (text: string) => {
      const r = tryParseLength(text, 'in')
      return r.ok ? 'read' : r.code
    }
    expect(code('')).toBe('empty')
    expect(code('-3')).toBe('negative')
    expect(code('3/0')).toBe('zero_denominator')
    // a comma between digits is refused: "1,5" (decimal comma) and "1,500" (thousands) differ 1000×
    expect(code('1,5')).toBe('decimal_comma')
    expect(code('1,500 mm')).toBe('decimal_comma')
    expect(code('1e9')).toBe('unreadable')
    // the ones a clerk types that are fine: 8' is 8 ft, 7 3/4 is inches in an inch takeoff
    expect(code("8'")).toBe('read')
    expect(parseLength("8'", 'in')).toBeCloseTo(2438.4, 9) // 8 × 304.8
    expect(parseLength('7 3/4', 'in')).toBeCloseTo(196.85, 9) // 7.75 × 25.4
  })

  it('reads back what formatInches writes, within half a sixteenth', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 20_000, noNaN: true }), fc.boolean(), (mm, feet) => {
        const back = parseLength(formatInches(mm, { feet }))
        // half of 1/16 in = 25.4 / 32 mm
        expect(Math.abs(back - mm)).toBeLessThanOrEqual(25.4 / 32 + 1e-9)
      }),
    )
  })
})
