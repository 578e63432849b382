// Lumenyard's mark where people see it: the sign-in screen (on white), the navigation rail (light on dark),
// the favicon at 16 px and a printed document (one ink). Screenshots go to test-results/screenshots.
import { execFileSync } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import type { Page } from 'playwright-core'
import { PNG } from 'pngjs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { SCREENSHOTS, startE2e, type E2eHarness } from '../support/browser.js'

let h: E2eHarness
beforeAll(async () => { h = await startE2e() })
afterAll(() => h?.close())

// source: WCAG 2.2, definitions of relative luminance and contrast ratio; SC 1.4.11 Non-text Contrast asks 3:1
// for the parts of a graphic needed to understand it.
function luminance(rgb: string): number {
  const [r, g, b] = (rgb.match(/[\d.]+/g) ?? []).slice(0, 3).map((v) => Number(v) / 255)
    .map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4))
  return 0.2126 * r + 0.7152 * g + 0.0722 * b
}
const contrast = (a: string, b: string) => {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x)
  return (hi + 0.05) / (lo + 0.05)
}

/** The blocks' fill and the colour behind the mark (the nearest ancestor with a background). */
function markColours(page: Page, scope: string) {
  return page.locator(`${scope} [data-test="lumenyard-logo"]`).first().evaluate((logo) => {
    const fill = getComputedStyle(logo.querySelector('path')!).fill
    let el: Element | null = logo
    let back = 'rgb(255, 255, 255)'
    while (el) {
      const bg = getComputedStyle(el).backgroundColor
      if (bg && bg !== 'transparent' && !bg.startsWith('rgba(0, 0, 0, 0)')) { back = bg; break }
      el = el.parentElement
    }
    return { fill, back }
  })
}

/** Inked regions (4-connected) of a PNG composited over white: how many separate shapes a reader sees. */
function shapes(png: Buffer): number {
  const img = PNG.sync.read(png)
  const dark = new Uint8Array(img.width * img.height)
  for (let i = 0; i < dark.length; i++) {
    const a = img.data[i * 4 + 3] / 255
    const grey = (0.299 * img.data[i * 4] + 0.587 * img.data[i * 4 + 1] + 0.114 * img.data[i * 4 + 2]) * a + 255 * (1 - a)
    dark[i] = grey < 230 ? 1 : 0
  }
  let count = 0
  for (let start = 0; start < dark.length; start++) {
    if (dark[start] !== 1) continue
    count++
    const stack = [start]
    dark[start] = 2
    while (stack.length) {
      const i = stack.pop()!
      const x = i % img.width
      for (const j of [i - img.width, i + img.width, x > 0 ? i - 1 : -1, x < img.width - 1 ? i + 1 : -1]) {
        if (j >= 0 && j < dark.length && dark[j] === 1) { dark[j] = 2; stack.push(j) }
      }
    }
  }
  return count
}

describe('the mark', () => {
  it('stands out on the sign-in screen, in the rail, as a 16 px favicon and on paper', async () => {
    const { page, context } = await h.newPage()
    try {
      await page.goto('/sign-in')
      await page.locator('[data-test="lumenyard-logo"]').first().waitFor()
      const onWhite = await markColours(page, '.panel')
      expect(contrast(onWhite.fill, onWhite.back), JSON.stringify(onWhite)).toBeGreaterThanOrEqual(3)
      await h.screenshot(page, 'brand-sign-in')

      // The favicon is the shipped SVG; drawn 16 px wide its four blocks stay four separate shapes.
      expect(await page.locator('link[rel="icon"]').getAttribute('href')).toBe('/lumenyard-mark.svg')
      const svg = await page.request.get('/lumenyard-mark.svg')
      expect(svg.status()).toBe(200)
      expect(svg.headers()['content-type']).toContain('image/svg+xml')
      const probe = await context.newPage()
      const dataUrl = `data:image/svg+xml;base64,${(await svg.body()).toString('base64')}`
      await probe.setContent(`<body style="margin:0;background:#fff"><img id="m" width="16" height="16" src="${dataUrl}"></body>`)
      await probe.waitForFunction(() => (document.getElementById('m') as HTMLImageElement).complete)
      const sixteen = await probe.locator('#m').screenshot()
      writeFileSync(path.join(SCREENSHOTS, 'brand-favicon-16.png'), sixteen)
      expect(shapes(sixteen)).toBe(4)
      await probe.close()

      await h.signIn(page, 'admin')
      const inRail = await markColours(page, 'aside')
      expect(contrast(inRail.fill, inRail.back), JSON.stringify(inRail)).toBeGreaterThanOrEqual(3)
      await page.locator('aside').first().screenshot({ path: path.join(SCREENSHOTS, 'brand-rail.png') })

      // A printed document carries the mark in one ink: the saved bill of the demo's curved shower.
      const [bill] = await h.ds.query('SELECT id FROM boms ORDER BY id LIMIT 1')
      await page.goto(`/counter/boms/${bill.id}`)
      await page.locator('[data-test="bom-title"]').waitFor()
      await page.emulateMedia({ media: 'print' })
      const printed = page.locator('.ly-print-brand')
      expect(await printed.isVisible()).toBe(true)
      const inks = await printed.locator('path').evaluateAll((paths) => [...new Set(paths.map((p) => getComputedStyle(p).fill))])
      expect(inks).toEqual(['rgb(0, 0, 0)'])
      const dir = mkdtempSync(path.join(tmpdir(), 'lumenyard-brand-'))
      const pdf = path.join(dir, 'bill.pdf')
      writeFileSync(pdf, await page.pdf({ format: 'Letter', printBackground: true }))
      // pdftoppm (poppler-utils) rasterises the first printed page as someone would see it on paper
      execFileSync('pdftoppm', ['-png', '-r', '100', '-f', '1', '-l', '1', '-singlefile', pdf, path.join(SCREENSHOTS, 'brand-printed-bill')])
      rmSync(dir, { recursive: true, force: true })
    } finally {
      await context.close()
    }
  })
})
