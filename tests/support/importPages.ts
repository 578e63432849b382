// The import page's problem table as a browser test reads it: the sheet rows shown now, and runs of row numbers.
import type { BrowserContext, Page } from 'playwright-core'
import type { E2eHarness } from './browser.js'

/** The sheet rows the problem table shows now (numbers written with or without grouping). */
export const shownProblemRows = (page: Page) => page.locator('[data-test="import-problems"] tbody tr td:first-child').allTextContents()
  .then((t) => t.map((s) => Number(s.trim().replace(/[.,\s]/g, ''))))

/** from, from + step, … up to to. */
export const rowRange = (from: number, to: number, step = 1) => Array.from({ length: Math.floor((to - from) / step) + 1 }, (_, k) => from + k * step)

/** Puts the admin back in English and closes the page and the app. */
export async function closeImportPage(h: E2eHarness | undefined, context: BrowserContext | undefined): Promise<void> {
  await h?.ds.query("UPDATE users SET locale = 'en' WHERE username = 'admin'").catch(() => undefined)
  await context?.close()
  await h?.close()
}
