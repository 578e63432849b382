// Keyboard-only driving for browser tests: Tab until a control has focus (failing when it can't be reached),
// and checks that every control met on the way is visible, not covered by a sticky bar.
import type { Page } from 'playwright-core'

/** What covers the centre of the focused element, when something else does (a sticky bar); null otherwise. */
async function focusCovered(page: Page): Promise<string | null> {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null
    if (!el || el === document.body) return null
    const r = el.getBoundingClientRect()
    if (!r.width || !r.height) return null
    const x = Math.min(Math.max(r.left + r.width / 2, 0), innerWidth - 1)
    const y = Math.min(Math.max(r.top + r.height / 2, 0), innerHeight - 1)
    const top = document.elementFromPoint(x, y)
    if (!top || el.contains(top) || top.contains(el)) return null
    // A label or wrapper drawn over its own input (the component library's selects) is the control itself.
    if (top.closest('label, .el-select__wrapper, .el-input__wrapper, .el-checkbox, .el-radio, .el-switch')?.contains(el)) return null
    return `${el.outerHTML.slice(0, 80)} is under ${top.outerHTML.slice(0, 80)}`
  })
}

/**
 * Presses Tab (Shift+Tab with `back`) until the focused element matches the selector or sits inside it.
 * source: WCAG 2.2 SC 2.1.1 Keyboard (reachable without a mouse) and SC 2.4.11 Focus Not Obscured (Minimum)
 */
export async function tabTo(page: Page, selector: string, opts: { max?: number; back?: boolean } = {}): Promise<void> {
  const max = opts.max ?? 80
  for (let i = 0; i < max; i++) {
    await page.keyboard.press(opts.back ? 'Shift+Tab' : 'Tab')
    const covered = await focusCovered(page)
    if (covered) throw new Error(`Focus is hidden on the way to ${selector}: ${covered}`)
    const here = await page.evaluate((sel) => {
      const el = document.activeElement
      return !!el && (el.matches(sel) || !!el.closest(sel))
    }, selector)
    if (here) return
  }
  throw new Error(`${selector} was not reached with ${max} presses of Tab`)
}

/** The focused element's data-test attribute, or its tag when it has none. */
export const focused = (page: Page) => page.evaluate(() => {
  const el = document.activeElement as HTMLElement | null
  return el?.closest('[data-test]')?.getAttribute('data-test') ?? el?.tagName.toLowerCase() ?? ''
})
