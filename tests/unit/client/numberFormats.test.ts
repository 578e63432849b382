// The named number formats views write figures with (src/i18n/formats.ts, through vue-i18n's n()) round as their
// names say, the same for English and Spanish readers (both write numbers the United States way).
// source: ECMA-402, Intl.NumberFormat, maximumFractionDigits (rounding "half expand": half away from zero); figures
// worked by hand
import { describe, expect, it } from 'vitest'
import { numberFormats } from '@/i18n/formats'

describe('named number formats', () => {
  it('tenths, hundredths and whole numbers', () => {
    for (const locale of ['en-US', 'es-US'] as const) {
      const f = numberFormats[locale] as Record<string, Intl.NumberFormatOptions>
      expect(new Intl.NumberFormat('en-US', f.tenths).format(97.46)).toBe('97.5')
      expect(new Intl.NumberFormat('en-US', f.hundredths).format(3.716)).toBe('3.72')
      expect(new Intl.NumberFormat('en-US', f.integer).format(1234.5)).toBe('1,235')
    }
  })
})
