// The warehouse crew reads Lumenyard in Spanish from sign-in to sign-out. In Chromium, a fresh browser set to
// Spanish opens the sign-in page, the demo warehouse user (Spanish) signs in and opens every screen a
// warehouse user can reach; on each, no English message of the app (src/i18n/en, where the Spanish differs)
// and no raw message key may be visible, and the grid's and Element Plus's own words are Spanish too.
// Signing out returns to a Spanish sign-in page. The share of Spanish messages per screen is printed.
// The English wording of the grid ("No Rows To Show") and of Element Plus ("No Data") is from memory of
// those libraries' default English texts.
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF } from '../support/apiHarness.js'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { fxBom, pickScenario, releasedPickList, signedInAgent } from '../support/pickFixtures.js'
import { screenText } from '../support/spanishText.js'

async function settle(page: Page): Promise<void> {
  await page.waitForLoadState('networkidle')
  await page.locator('.el-loading-mask:visible').first().waitFor({ state: 'detached', timeout: 10_000 }).catch(() => undefined)
}

let h: E2eHarness
const ids: Record<string, number | undefined> = {}
beforeAll(async () => {
  h = await startE2e()
  const one = async (sql: string) => ((await h.ds.query(sql)) as { id: number }[])[0]?.id
  ids.item = await one('SELECT id FROM items WHERE active = 1 ORDER BY id LIMIT 1')
  ids.order = await one("SELECT id FROM purchase_orders WHERE status IN ('sent', 'partly_received') ORDER BY id LIMIT 1")
  // A released pick list and an open count of our own, for the handheld screens
  const crew = await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD)
  const s = await pickScenario(h.ds, crew)
  const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 12 }, { itemId: s.spacer.id, qty: 40 }])
  ids.pickList = await releasedPickList(await signedInAgent(h.built.app, 'counter', DEMO_PASSWORD), bom.bomId, s.main.id)
  const count = await crew.post('/api/counts').set(CSRF).send({ warehouseId: s.main.id, scope: 'bins', binIds: [s.main.bins['A-01-1']] })
  ids.count = count.body.id
})
afterAll(() => h?.close())

describe('a Spanish warehouse user, from sign-in to sign-out', () => {
  it('sees no English message and no raw key on any screen a warehouse user can open', async () => {
    const screens: [string, string | null][] = [
      ['/', 'inicio'],
      ['/profile', 'perfil'],
      ['/stock', 'existencias'],
      ['/stock/overview', 'por almacén'],
      ['/stock/bins', 'ubicaciones'],
      ['/stock/movements', 'movimientos'],
      ['/stock/transfers', 'traslados'],
      ['/stock/adjust', 'ajuste'],
      ['/stock/move', 'cambio de ubicación'],
      ['/stock/items', 'catálogo'],
      [`/stock/items/${ids.item}`, 'artículo'],
      ['/stock/warehouses', 'almacenes'],
      ['/stock/labels', 'etiquetas'],
      ['/warehouse', 'almacén'],
      ['/warehouse/outbox', 'pendientes'],
      ['/warehouse/receiving', 'recepción'],
      [ids.order ? `/warehouse/receiving/${ids.order}` : '', 'recibir orden'],
      [ids.pickList ? `/warehouse/pick/${ids.pickList}` : '', 'preparar'],
      [ids.pickList ? `/warehouse/pick-lists/${ids.pickList}/sheet` : '', 'hoja de preparación'],
      ['/warehouse/counts', 'conteos'],
      ['/warehouse/counts/history', 'historial de conteos'],
      [ids.count ? `/warehouse/counts/${ids.count}` : '', 'conteo'],
      [ids.count ? `/warehouse/counts/${ids.count}/count` : '', 'contar'],
      ['/no-such-page', 'no encontrada'],
    ]
    // A fresh browser whose language is Spanish: nobody has signed in here yet.
    const fresh = await h.browser.newContext({ baseURL: h.baseUrl, locale: 'es-US', viewport: { width: 1280, height: 860 } })
    const p = await fresh.newPage()
    p.setDefaultTimeout(15_000)
    const problems: string[] = []
    const figures: string[] = []
    const check = async (name: string) => {
      await settle(p)
      const text = await screenText(p)
      figures.push(`${name}: ${text.spanish}/${text.matched} Spanish`)
      for (const e of text.english) problems.push(`${name}: English "${e}"`)
      for (const k of text.keys) problems.push(`${name}: raw key ${k}`)
    }
    try {
      await p.goto('/sign-in')
      await p.locator('[data-test="sign-in"]').waitFor()
      await check('sign-in')
      // A wrong password is refused in Spanish
      await p.locator('[data-test="username"]').fill('warehouse')
      await p.locator('[data-test="password"]').fill('not-the-password')
      await p.locator('[data-test="sign-in"]').click()
      await p.locator('[data-test="sign-in-error"]').waitFor()
      await check('sign-in, wrong password')
      await h.signIn(p, 'warehouse')
      for (const [path, name] of screens) {
        if (!path) continue // the demo data holds none of this kind
        await p.goto(path)
        await check(`${name} (${path})`)
      }
      // The stock form's own checks, refused before anything is sent
      await p.goto('/stock/adjust')
      await settle(p)
      await p.locator('[data-test="adjust-review"]').click()
      await check('ajuste, sin datos')
      await p.locator('[data-test="user-menu"]').click()
      await p.locator('[data-test="sign-out"]').click()
      await p.waitForURL(/\/sign-in/)
      await check('sign-in after sign-out')
      expect(await p.locator('[data-test="sign-in"]').textContent()).toMatch(/Entrar|Iniciar/)
    } finally {
      console.log(`Spanish share of the app's messages per screen:\n  ${figures.join('\n  ')}`)
      await fresh.close()
    }
    expect(problems).toEqual([])
  })
})
