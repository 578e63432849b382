// Printed barcodes read by a program nobody on the project wrote: the page printed to PDF by Chromium, rasterised
// at 300 dpi by pdftoppm (poppler-utils) and decoded by zbarimg (zbar-tools).
import { execFileSync, spawnSync } from 'node:child_process'
import { copyFileSync, readdirSync, writeFileSync } from 'node:fs'
import path from 'node:path'
import type { Page } from 'playwright-core'
import { SCREENSHOTS } from './browser.js'

export interface Decoded { type: string; gs1: boolean; data: string }

/** Prints the page to PDF as Chromium prints it into `dir`, rasterises every page at 300 dpi and decodes every symbol. */
export async function printAndDecode(page: Page, dir: string, name: string, pdfOptions: Parameters<Page['pdf']>[0]): Promise<Decoded[]> {
  await page.emulateMedia({ media: 'print' })
  const pdf = path.join(dir, `${name}.pdf`)
  writeFileSync(pdf, await page.pdf({ printBackground: true, ...pdfOptions }))
  await page.emulateMedia({ media: 'screen' })
  // source: pdftoppm(1), poppler-utils — -r 300 renders at 300 dpi, the resolution a label or laser printer works at
  execFileSync('pdftoppm', ['-r', '300', '-gray', '-png', pdf, path.join(dir, name)])
  const pngs = readdirSync(dir).filter((f) => f.startsWith(`${name}-`) && f.endsWith('.png')).sort().map((f) => path.join(dir, f))
  copyFileSync(pngs[0], path.join(SCREENSHOTS, `printed-${name}.png`))
  // source: zbarimg(1), zbar-tools — --xml lists each symbol with its type, GS1 modifier (FNC1 first) and data
  // (exit status 4: some page held no symbol, as a pick sheet's signature page)
  const run = spawnSync('zbarimg', ['-q', '--xml', ...pngs], { encoding: 'utf8' })
  if (run.status !== 0 && run.status !== 4) throw new Error(`zbarimg failed (${run.status}): ${run.stderr}`)
  return [...run.stdout.matchAll(/<symbol ([^>]*)><data><!\[CDATA\[([\s\S]*?)\]\]><\/data>/g)].map((m) => ({
    type: /type='([^']+)'/.exec(m[1])![1],
    gs1: /modifiers='[^']*GS1/.test(m[1]),
    data: m[2],
  }))
}

/** Decoded symbols as sorted "TYPE[+GS1] data" lines, to compare as sets. */
export const sortedSymbols = (list: Decoded[]) => list.map((d) => `${d.type}${d.gs1 ? '+GS1' : ''} ${d.data}`).sort()

// source: GS1 General Specifications §7.9.1 (standard check digit calculation: weights 3 and 1 from the right)
export function gs1CheckDigitOk(digits: string): boolean {
  const body = digits.slice(0, -1).split('').reverse()
  const sum = body.reduce((s, d, i) => s + Number(d) * (i % 2 === 0 ? 3 : 1), 0)
  return (10 - (sum % 10)) % 10 === Number(digits.at(-1))
}
