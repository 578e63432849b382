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

/**
 * What sticks out past the right edge of a box that clips its content (a dialog): the page may not scroll, yet
 * a field or its label is cut off. Elements inside a box that scrolls by itself don't count.
 */
export const cutOffInside = (page: Page, selector: string) =>
  page.locator(selector).evaluate((box) => {
    const right = box.getBoundingClientRect().right
    const scrolls = (el: Element) => ['auto', 'scroll'].includes(getComputedStyle(el).overflowX)
    const out: string[] = []
    const walk = (el: Element) => {
      for (const child of Array.from(el.children)) {
        const r = child.getBoundingClientRect()
        if (r.width && r.right > right + 1) out.push(`${child.tagName.toLowerCase()}.${String(child.className).split(' ').slice(0, 2).join('.')} ${Math.round(r.right - right)}px`)
        else if (!scrolls(child)) walk(child)
      }
    }
    walk(box)
    return out.slice(0, 4)
  })

/**
 * The boxes inside `selector` that scroll sideways by themselves because their content is wider than they are
 * (a table's region), each with its label and by how many pixels. `sidewaysScroll` doesn't count these, yet on a
 * phone a column scrolled out of such a box is as far out of sight as one cut off.
 */
export const regionsScrolledSideways = (page: Page, selector = '#app') =>
  page.locator(selector).first().evaluate((root) => {
    const out: string[] = []
    for (const el of Array.from(root.querySelectorAll('*'))) {
      if (!['auto', 'scroll'].includes(getComputedStyle(el).overflowX) || !(el as HTMLElement).checkVisibility?.()) continue
      const by = el.scrollWidth - el.clientWidth
      if (by > 1) out.push(`${el.getAttribute('aria-label') ?? el.tagName.toLowerCase() + '.' + String(el.className).split(' ')[0]} by ${by}px`)
    }
    return out
  })

export interface TargetSizes {
  controls: number
  under44: string[]
  /** Pairs of targets closer than 8 px to each other (or overlapping), with their gap. */
  crowded: string[]
}

const CONTROLS = 'a[href], button, input:not([type="hidden"]), select, textarea, [role="button"], [role="checkbox"], [role="switch"], [role="tab"], [role="combobox"], .el-checkbox, .el-radio'

/**
 * Every visible control's hit box: the control itself or, for an input drawn inside the component library's
 * box (select, input, checkbox), that box. A stepper's field and its − and + buttons are three targets (the
 * box around all three is not one). Then how close each target comes to every other one: two targets
 * side by side, closer than 8 px, or one over the other (neither inside the other), are crowded.
 */
export async function targetSizes(page: Page): Promise<TargetSizes> {
  return page.evaluate((selector) => {
    const seen = new Set<Element>()
    const out = { controls: 0, under44: [] as string[], crowded: [] as string[] }
    const boxes: { el: Element; r: DOMRect; name: string }[] = []
    for (const el of Array.from(document.querySelectorAll(selector))) {
      const box = el.closest('.el-select__wrapper, .el-input__wrapper, .el-checkbox, .el-radio, .el-radio-button, .el-switch') ?? el
      if (seen.has(box) || !(box as HTMLElement).checkVisibility?.()) continue
      seen.add(box)
      const r = box.getBoundingClientRect()
      if (!r.width || !r.height) continue
      out.controls++
      const name = `${box.tagName.toLowerCase()}${box.getAttribute('data-test') ? `[data-test=${box.getAttribute('data-test')}]` : ''}.${String(box.className).split(' ')[0]} ${Math.round(r.width)}×${Math.round(r.height)}`
      // Half a pixel of rounding: a 44 px box can measure 43.99 after the browser's layout arithmetic.
      if (r.width < 43.5 || r.height < 43.5) out.under44.push(name)
      boxes.push({ el: box, r, name })
    }
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) {
        const a = boxes[i]!
        const b = boxes[j]!
        if (a.el.contains(b.el) || b.el.contains(a.el)) continue
        const dx = Math.max(0, b.r.left - a.r.right, a.r.left - b.r.right)
        const dy = Math.max(0, b.r.top - a.r.bottom, a.r.top - b.r.bottom)
        const gap = Math.hypot(dx, dy)
        if (gap < 7.5) out.crowded.push(`${a.name} ↔ ${b.name}: ${Math.round(gap)} px`)
      }
    }
    return out
  }, CONTROLS)
}

export interface MainControlSizes {
  /** The scan boxes and steppers showing, with their boxes. */
  main: string[]
  /** Other controls as tall as the smallest of them, or larger in area. */
  rivals: string[]
}

/**
 * Measures, on the page as it stands, the screen's main controls (`mainSelector`: its scan box and quantity
 * stepper; an input or our number field (.ly-number) is measured by its whole box, so a stepper's − and +
 * buttons and its field are one thing to find) against every other visible control (the same hit boxes as
 * `targetSizes`). A control outside them that is at least as tall as the smallest of them, or larger in
 * area, is a rival.
 */
export async function mainControlSizes(page: Page, mainSelector: string): Promise<MainControlSizes> {
  return page.evaluate(([selector, mainSel]) => {
    const label = (el: Element, r: DOMRect) =>
      `${el.tagName.toLowerCase()}${el.getAttribute('data-test') ? `[data-test=${el.getAttribute('data-test')}]` : ''}.${String(el.className).split(' ')[0]} ${Math.round(r.width)}×${Math.round(r.height)}`
    const shown = (el: Element) => !!(el as HTMLElement).checkVisibility?.() && el.getBoundingClientRect().width > 0
    const mains = [...new Set(Array.from(document.querySelectorAll(mainSel)).map((el) => el.closest('.ly-number, .el-input') ?? el))].filter(shown)
    const out = { main: [] as string[], rivals: [] as string[] }
    if (!mains.length) return out
    const rects = mains.map((el) => el.getBoundingClientRect())
    const height = Math.min(...rects.map((r) => r.height))
    const area = Math.min(...rects.map((r) => r.width * r.height))
    mains.forEach((el, i) => out.main.push(label(el, rects[i]!)))
    const seen = new Set<Element>()
    for (const el of Array.from(document.querySelectorAll(selector))) {
      if (mains.some((m) => m.contains(el))) continue
      const box = el.closest('.el-select__wrapper, .el-input__wrapper, .el-checkbox, .el-radio, .el-radio-button, .el-switch') ?? el
      if (seen.has(box) || !shown(box)) continue
      seen.add(box)
      const r = box.getBoundingClientRect()
      // Half a pixel of rounding either way, as for the target sizes.
      if (r.height > height - 0.5 || r.width * r.height > area + 0.5) out.rivals.push(label(box, r))
    }
    return out
  }, [CONTROLS, mainSelector] as const)
}

/**
 * The text boxes in `selector` whose placeholder is wider than the room inside them, as the browser draws it in the
 * box's own font (a canvas's measureText): a cut-off hint ("Scan a label or type a SKU, then En…") reads as a
 * different instruction. Each as `"placeholder" needs N px, has M px`.
 */
export const placeholdersCutOff = (page: Page, selector: string) =>
  page.locator(selector).evaluateAll((boxes) => {
    const ctx = document.createElement('canvas').getContext('2d')!
    const out: string[] = []
    for (const box of boxes as HTMLInputElement[]) {
      if (!box.placeholder || !box.checkVisibility()) continue
      const style = getComputedStyle(box)
      ctx.font = `${style.fontStyle} ${style.fontWeight} ${style.fontSize} ${style.fontFamily}`
      const needs = Math.ceil(ctx.measureText(box.placeholder).width)
      const has = Math.floor(box.clientWidth - parseFloat(style.paddingLeft) - parseFloat(style.paddingRight))
      if (needs > has) out.push(`"${box.placeholder}" needs ${needs} px, has ${has} px`)
    }
    return out
  })
