// WCAG 2.2 AA on every screen: axe-core on each route of the client's own router table, opened by the role
// that uses it (the warehouse's screens also at a phone width), then with the main dialogs open. Any
// critical or serious violation fails the test and is listed with its screen, width, rule and elements.
// source: W3C, Web Content Accessibility Guidelines (WCAG) 2.2, levels A and AA; rules as axe-core implements them.
import { writeFileSync } from 'node:fs'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { BrowserContext, Page, Request } from 'playwright-core'
import type { Role } from '../../shared/roles.js'
import { SCREENSHOTS, startE2e, type E2eHarness } from '../support/browser.js'
import { axeFindings, blocking, colourOnlyStatus, describeFindings, tally, unnamedTables, type AxeFinding } from '../support/axeCheck.js'
import { sidewaysScroll, targetSizes, type TargetSizes } from '../support/layoutChecks.js'
import { walkRecords } from '../support/walkRecords.js'
import { byRole, MAIN_DIALOGS, openInApp, RouteSamples, routeTable, settle, type WalkRoute } from '../support/routeWalk.js'

const DESKTOP = { width: 1280, height: 860 }
// A 412 px phone: the warehouse's handheld width in the team's trials (Chromium's metrics of a common Android phone).
const PHONE = { width: 412, height: 900 }
// source: WCAG 2.2 SC 1.4.10 Reflow: content fits 320 CSS pixels wide without scrolling in two directions
const NARROW = { width: 320, height: 900 }

let h: E2eHarness
let page: Page
let context: BrowserContext
let groups: Map<Role | 'signed-out', WalkRoute[]>
let samples: RouteSamples
const found: AxeFinding[] = []
const visited = new Set<string>()
const dialogsChecked = new Set<string>()
const sideways = new Map<string, string>()
const targets = new Map<string, TargetSizes>()

beforeAll(async () => {
  h = await startE2e()
  await walkRecords(h)
  ;({ page, context } = await h.newPage({ viewport: DESKTOP }))
  // With reduced motion the theme has no transitions, so axe reads colours as they are.
  await page.emulateMedia({ reducedMotion: 'reduce' })
  // Notes what each loading mask put into the page covered, so a screen that waits for nothing can be held to
  // showing none. The screen being left may still put one up as it goes (a slow answer to its last refresh):
  // that mask covers an element no longer in the page, and is not the new screen's.
  await page.addInitScript(() => {
    const w = window as unknown as { lyMaskTargets: Element[] }
    w.lyMaskTargets = []
    new MutationObserver((changes) => {
      for (const c of changes) for (const n of Array.from(c.addedNodes)) if (n instanceof Element && n.classList.contains('el-loading-mask')) w.lyMaskTargets.push(c.target as Element)
    }).observe(document, { childList: true, subtree: true })
  })
  samples = new RouteSamples(h.ds)
  await page.goto('/sign-in')
  await page.locator('[data-test="username"]').waitFor()
  groups = byRole(await routeTable(page))
})
afterAll(async () => {
  if (found.length) console.log('axe findings by impact (places, rules, elements):', JSON.stringify(tally(found)))
  writeFileSync(path.join(SCREENSHOTS, '..', 'axe-findings.json'), JSON.stringify(found, null, 1))
  await context?.close()
  await h?.close()
})

async function check(where: string) {
  found.push(...(await axeFindings(page, where)), ...(await unnamedTables(page, where)), ...(await colourOnlyStatus(page, where)))
}

const OPEN_DIALOG = '.el-overlay-dialog .el-dialog'

/** The screens the warehouse crew use on a phone: picking, receiving, moving, adjusting, an item, counts. */
const onPhone = (r: WalkRoute) => r.area === 'warehouse' || ['stock-move', 'stock-adjust', 'stock-item'].includes(r.name) || /count/.test(r.name)

async function checkDialog(route: string, clicks: string[], where: string) {
  for (const c of clicks) await page.locator(c).first().click()
  const dialog = page.locator(OPEN_DIALOG).first()
  await dialog.waitFor()
  await settle(page)
  await check(`${route} dialog (${where})`)
  dialogsChecked.add(route)
  await page.keyboard.press('Escape')
  await dialog.waitFor({ state: 'hidden' })
  // source: WCAG 2.2 SC 2.4.3 Focus Order: closing a dialog returns focus to the control that opened it
  const back = await page.evaluate((sel) => document.activeElement === document.querySelector(sel), clicks.at(-1)!)
  if (!back) found.push({ where: `${route} dialog (${where})`, rule: 'focus-return', impact: 'serious', help: 'Focus returns to the opener when the dialog closes', nodes: 1, targets: [clicks.at(-1)!] })
}

/**
 * Lets the page lay itself out again after a change of width: two animation frames (the component library's
 * tables and the grids re-measure in resize observers, which run before the next frame is drawn). A resize
 * asks the server for nothing, so there is no request to wait for.
 */
const relayout = (on: Page) => on.evaluate(() => new Promise<void>((r) => requestAnimationFrame(() => requestAnimationFrame(() => r()))))

/** Opens each screen of a role and checks it, at 320 px for reflow, and at the phone width too for the warehouse crew. */
async function walk(who: Role | 'signed-out') {
  const routes = groups.get(who) ?? []
  await context.clearCookies()
  if (who === 'signed-out') {
    await page.goto('/sign-in')
    await page.locator('[data-test="username"]').waitFor()
  } else await h.signIn(page, who)
  const before = found.length
  for (const route of routes) {
    const path = await samples.pathFor(route)
    const t = [Date.now()]
    let apiCalls = 0
    const countApi = (r: Request) => void (new URL(r.url()).pathname.startsWith('/api/') && apiCalls++)
    await page.evaluate(() => void ((window as unknown as { lyMaskTargets: Element[] }).lyMaskTargets = []))
    page.on('request', countApi)
    await openInApp(page, path).finally(() => page.off('request', countApi))
    // A screen with nothing to fetch shows no loading mask, not even for a moment after it has drawn: a mask
    // that comes up after the data would cover the rows someone is about to click or has focused.
    const masks = await page.evaluate(() => (window as unknown as { lyMaskTargets: Element[] }).lyMaskTargets.filter((e) => e.isConnected).length)
    if (!apiCalls && masks) found.push({ where: `${route.name} (${path}, ${who})`, rule: 'mask-without-wait', impact: 'serious', help: 'No loading mask on a screen that waits for nothing', nodes: masks, targets: ['.el-loading-mask'] })
    t.push(Date.now())
    await samples.harvest(page)
    await check(`${route.name} (${path}, ${who}, desktop)`)
    t.push(Date.now())
    const dialog = MAIN_DIALOGS[route.name]
    if (dialog) await checkDialog(route.name, dialog, `${path}, ${who}`)
    await page.setViewportSize(NARROW)
    await relayout(page)
    const over = await sidewaysScroll(page)
    if (over.by) sideways.set(route.name, `${over.by} px: ${over.culprits.join(', ')}`)
    t.push(Date.now())
    if (who === 'warehouse' && onPhone(route)) {
      await page.setViewportSize(PHONE)
      await relayout(page)
      await check(`${route.name} (${path}, ${who}, phone)`)
      targets.set(route.name, await targetSizes(page))
      t.push(Date.now())
    }
    await page.setViewportSize(DESKTOP)
    if (process.env.A11Y_TIMING) console.log('TIMING', route.name, t.slice(1).map((x, k) => x - t[k]!).join(' '))
    visited.add(route.name)
  }
  return blocking(found.slice(before))
}

describe('accessibility of every screen (axe, WCAG 2.2 AA)', () => {
  it('reads every named route from the router', () => {
    expect([...groups.values()].flat().length).toBeGreaterThan(30)
  })
  // A colour read right after a state change is the new colour: axe (and a reader) never sees a control half way
  // between two states. Found when a bill's save button, enabled while axe ran, read as white text on its
  // disabled tint (1.46:1): a "very short" reduced-motion transition still waits for the next frame.
  // source: W3C, Media Queries Level 5, prefers-reduced-motion; WCAG 2.2 SC 1.4.3 Contrast (Minimum)
  it('applies a control\'s new colours at once when motion is reduced', async () => {
    await page.goto('/sign-in')
    await page.locator('button.el-button--primary').waitFor()
    const colours = await page.evaluate(() => {
      const button = document.querySelector('button.el-button--primary') as HTMLElement
      const read = () => `${getComputedStyle(button.querySelector('span') ?? button).color} on ${getComputedStyle(button).backgroundColor}`
      const enabled = read()
      button.classList.add('is-disabled')
      const disabled = read()
      button.classList.remove('is-disabled')
      return { enabled, disabled, back: read() }
    })
    // The theme's primary colours (src/assets/theme.css): white on lagoon #14505c; lagoon on the pale tint #c8d8db.
    expect(colours).toEqual({ enabled: 'rgb(255, 255, 255) on rgb(20, 80, 92)', disabled: 'rgb(20, 80, 92) on rgb(200, 216, 219)', back: 'rgb(255, 255, 255) on rgb(20, 80, 92)' })
  })
  // Each role's screens in its own test, so one role's findings don't hide another's.
  for (const who of ['signed-out', 'warehouse', 'counter', 'buyer', 'admin'] as const) {
    it(`finds no critical or serious violation on the screens of: ${who}`, async () => {
      const bad = await walk(who)
      expect(bad, describeFindings(bad)).toEqual([])
    }, 300_000)
  }
  // source: WCAG 2.2 SC 1.4.10 Reflow: at 320 CSS px no screen scrolls sideways (data grids and tables scroll
  // inside their own box, which the measure leaves out).
  it('reflows every screen at 320 px', () => {
    expect(sideways.size + visited.size).toBeGreaterThan(30)
    expect(Object.fromEntries(sideways)).toEqual({})
  })
  // Gloves on a phone: every control on the warehouse screens at least 44 × 44 CSS px, with 8 px between one
  // target and the next, so a gloved thumb lands on the control it aims at.
  // source: WCAG 2.2 SC 2.5.5 Target Size (Enhanced), 44 × 44 CSS pixels
  // source: WCAG 2.2 SC 2.5.8 Target Size (Minimum), spacing between targets; 8 px is common practice for touch
  it('gives the warehouse screens on a phone targets a gloved finger can hit', () => {
    expect(targets.size).toBeGreaterThan(5)
    expect(targets.get('warehouse-pick')?.controls).toBeGreaterThan(3)
    const small = [...targets].filter(([, s]) => s.under44.length).map(([route, s]) => `${route}: ${s.under44.join(', ')}`)
    expect.soft(small, 'controls under 44 × 44 px').toEqual([])
    const crowded = [...targets].filter(([, s]) => s.crowded.length).map(([route, s]) => `${route}: ${s.crowded.join('; ')}`)
    expect(crowded, 'targets closer than 8 px').toEqual([])
  })
  it('opened every main dialog', () => {
    expect([...dialogsChecked].sort()).toEqual(Object.keys(MAIN_DIALOGS).sort())
  })
  it('visited every route, and the page for an address that leads nowhere', async () => {
    await openInApp(page, '/no-such-page')
    await check('not-found (desktop)')
    const all = [...groups.values()].flat().map((r) => r.name)
    expect(all.filter((n) => !visited.has(n))).toEqual([])
    const bad = blocking(found.filter((f) => f.where.startsWith('not-found')))
    expect(bad, describeFindings(bad)).toEqual([])
  })
})
