// The message files reach the browser in two chunks per language (src/i18n/bundles/): the sign-in page's
// areas, and every other area. The bundles' globs are literal file patterns, so this checks them against
// every file in the language's folder: every area in exactly one bundle, the boot bundle exactly BOOT_AREAS. A new
// area file missed by both would show its keys bare; a boot area left out would leave the sign-in page
// unworded. source: common practice (the folder's own listing is the ground truth).
import { describe, expect, it } from 'vitest'
import { BOOT_AREAS } from '@/i18n/bootAreas'
import enBoot from '@/i18n/bundles/enBoot'
import enRest from '@/i18n/bundles/enRest'
import esBoot from '@/i18n/bundles/esBoot'
import esRest from '@/i18n/bundles/esRest'

// Every file of each language's folder, listed by a plain glob of the folder (no bundle pattern involved).
const files = { en: Object.keys(import.meta.glob('../../../src/i18n/en/*.ts')), es: Object.keys(import.meta.glob('../../../src/i18n/es/*.ts')) }
const onDisk = (language: 'en' | 'es') => files[language].map((f) => f.replace(/^.*\/([^/]+)\.ts$/, '$1')).sort()

describe.each([
  ['en' as const, enBoot, enRest],
  ['es' as const, esBoot, esRest],
])('message bundles of %s', (language, boot, rest) => {
  it('hold the sign-in areas in the boot bundle and nothing else there', () => {
    expect(Object.keys(boot).sort()).toEqual([...BOOT_AREAS].sort())
  })

  it('hold every area file on disk in exactly one bundle', () => {
    const bootAreas = Object.keys(boot)
    const restAreas = Object.keys(rest)
    expect(restAreas.filter((a) => bootAreas.includes(a))).toEqual([])
    expect([...bootAreas, ...restAreas].sort()).toEqual(onDisk(language))
  })

  it('carry each file’s messages under its area', () => {
    expect(Object.keys(boot.auth ?? {}).length).toBeGreaterThan(0)
    expect(Object.keys(rest.stock ?? {}).length).toBeGreaterThan(0)
  })
})
