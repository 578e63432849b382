// Layout measurements a browser test makes on the page as it stands: sideways scrolling of the page itself
// (data grids scroll inside their own box and don't count) and the size of every control a finger has to hit.
import type { Page } from 'playwright-core'

/**
 * How many CSS pixels the page scrolls sideways (0 when its content fits the window's width), and the
 * outermost elements that stick out past the window (outside any box that scrolls by itself).
 */
export const sidewaysScroll = (page: Page) =>
  page.evaluate(() => {
    const width = document.documentElement.clientWidth
    const by = Math.max(0, document.documentElement.scrollWidth - width)
    if (!by) return { by, culprits: [] as string[] }
    const scrolls = (el: Element) => ['auto', 'scroll', 'hidden'].includes(getComputedStyle(el).overflowX)
    const culprits: string[] = []
    const walk = (el: Element) => {
      for (const child of Array.from(el.children)) {
        const r = child.getBoundingClientRect()
        if (r.right > width + 1 && r.width) {
          culprits.push(`${child.tagName.toLowerCase()}.${String(child.className).split(' ').slice(0, 2).join('.')} ${Math.round(r.width)}px`)
          continue
        }
        if (!scrolls(child)) walk(child)
      }
    }
    walk(document.body)
    return { by, culprits: culprits.slice(0, 4) }
  })

export interface TargetSizes {
  controls: number
  under44: string[]
  under24: string[]
}

const CONTROLS = 'a[href], button, input:not([type="hidden"]), select, textarea, [role="button"], [role="checkbox"], [role="switch"], [role="tab"], [role="combobox"], .el-checkbox, .el-radio, .el-input-number__increase, .el-input-number__decrease'

/**
 * Every visible control's hit box: the control itself or, for an input drawn inside the component library's
 * box (select, input, checkbox), that box.
 */
export async function targetSizes(page: Page): Promise<TargetSizes> {
  return page.evaluate((selector) => {
    const seen = new Set<Element>()
    const out = { controls: 0, under44: [] as string[], under24: [] as string[] }
    for (const el of Array.from(document.querySelectorAll(selector))) {
      const box = el.closest('.el-select__wrapper, .el-input__wrapper, .el-checkbox, .el-radio, .el-radio-button, .el-switch') ?? el
      if (seen.has(box) || !(box as HTMLElement).checkVisibility?.()) continue
      seen.add(box)
      const r = box.getBoundingClientRect()
      if (!r.width || !r.height) continue
      out.controls++
      const name = `${box.tagName.toLowerCase()}${box.getAttribute('data-test') ? `[data-test=${box.getAttribute('data-test')}]` : ''}.${String(box.className).split(' ')[0]} ${Math.round(r.width)}×${Math.round(r.height)}`
      if (r.width < 44 || r.height < 44) out.under44.push(name)
      if (r.width < 24 || r.height < 24) out.under24.push(name)
    }
    return out
  }, CONTROLS)
}
