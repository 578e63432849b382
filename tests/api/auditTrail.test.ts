// The audit trail through the API on the real MariaDB: one sample of each kind the admin looks for (a good
// and a failed sign-in, a role change, a password set by the admin, a stock move, a document's change of
// state, a settings change) is done through the app by a person of this file's own, then read back filtered
// by that person, by kind and by day; the spreadsheet is read back with exceljs; and no method changes or
// deletes an entry. Who may open the trail (admins only) is checked by the role matrix (roleMatrix.ts).
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { AuditKind } from '../../shared/audit/auditKinds.js'
import type { AuditTrailEntry, AuditTrailPage } from '../../shared/schemas/audit.js'
import { CSRF, startApiHarness, TEST_PASSWORD, type ApiHarness } from '../support/apiHarness.js'
import { download, loadWorkbook } from '../support/downloads.js'
import { fxItem, fxWarehouse, receive, signedInAgent, tagOf, type FxItem, type FxWarehouse } from '../support/pickFixtures.js'

let h: ApiHarness
let boss: supertest.Agent
let bossId: number
let clerkId: number
let wh: FxWarehouse
let block: FxItem
let countId: number
const today = new Date().toISOString().slice(0, 10)

async function trail(query: string): Promise<AuditTrailEntry[]> {
  const res = await boss.get(`/api/audit?tz=UTC&limit=500&${query}`)
  expect(res.status, JSON.stringify(res.body)).toBe(200)
  return (res.body as AuditTrailPage).entries
}

beforeAll(async () => {
  h = await startApiHarness()
  const tag = tagOf()
  const bossUser = await h.user(`audit-boss-${tag}`, ['admin'])
  const clerk = await h.user(`audit-clerk-${tag}`, ['counter'])
  bossId = bossUser.id
  clerkId = clerk.id
  wh = await fxWarehouse(h.ds, `U${tag}`, ['A-01-1'])
  block = await fxItem(h.ds, `AU-${tag}`)
  // A wrong password for the clerk, then the admin signs in and works.
  const wrong = await h.agent().post('/api/session').set(CSRF).send({ username: clerk.username, password: 'not-the-password' })
  expect(wrong.status).toBe(401)
  boss = await signedInAgent(h.built.app, bossUser.username, TEST_PASSWORD)
  expect((await boss.patch(`/api/users/${clerkId}`).set(CSRF).send({ roles: ['counter', 'buyer'] })).status).toBe(200)
  expect((await boss.post(`/api/users/${clerkId}/password`).set(CSRF).send({ password: 'a-new-password-456' })).status).toBe(200)
  await receive(boss, wh.id, [{ itemId: block.id, binId: wh.bins['A-01-1'], qty: 12 }])
  const opened = await boss.post('/api/counts').set(CSRF).send({ warehouseId: wh.id, scope: 'bins', binIds: [wh.bins['A-01-1']] })
  expect(opened.status, JSON.stringify(opened.body)).toBe(201)
  countId = opened.body.id
  expect((await boss.post(`/api/counts/${countId}/cancel`).set(CSRF).send({ reason: 'opened to test the trail' })).status).toBe(200)
  const settings = await boss.get('/api/purchasing/settings')
  expect((await boss.patch('/api/purchasing/settings').set(CSRF).send(settings.body)).status).toBe(200)
})
afterAll(async () => {
  await h?.close()
})

describe('the audit trail records each kind', () => {
  it("files the admin's own work under the admin, one sample of each kind", async () => {
    const mine = await trail(`userId=${bossId}`)
    const kinds = new Set(mine.map((e) => e.kind))
    for (const kind of ['sign_in', 'roles', 'password', 'stock_move', 'document', 'settings'] satisfies AuditKind[]) expect(kinds, kind).toContain(kind)
    expect(mine.every((e) => e.userId === bossId)).toBe(true)
  })

  it('a failed sign-in is filed under the person whose name was typed, without the password', async () => {
    const clerks = await trail(`userId=${clerkId}&kind=sign_in`)
    const failed = clerks.find((e) => e.action === 'session.sign_in_failed')
    expect(failed?.facts.username).toMatch(/^audit-clerk-/)
    expect(JSON.stringify(clerks)).not.toContain('not-the-password')
  })

  it('a role change keeps the roles before and after, and names the person', async () => {
    const roles = await trail(`userId=${bossId}&kind=roles`)
    const change = roles.find((e) => e.action === 'user.roles')
    expect(change?.facts).toEqual({ rolesFrom: ['counter'], rolesTo: ['buyer', 'counter'] })
    expect(change?.subject?.type).toBe('user')
    expect(change?.subject?.ref).toMatch(/^Test audit-clerk-/)
  })

  it('documents are named as people name them, never by a table and an id', async () => {
    const docs = await trail(`userId=${bossId}&kind=document`)
    const cancelled = docs.find((e) => e.action === 'count.cancel')
    expect(cancelled?.subject).toEqual({ type: 'cycle_count', ref: `${wh.code} · ${countId}` })
    const move = (await trail(`userId=${bossId}&kind=stock_move`))[0]
    expect(move.move).toMatchObject({ moveType: 'receipt', sku: block.sku, qty: 12, warehouseCode: wh.code, binCode: 'A-01-1' })
  })

  it('filters by day: nothing of today before today', async () => {
    expect(await trail(`userId=${bossId}&from=2020-01-01&to=2020-01-31`)).toEqual([])
    expect((await trail(`userId=${bossId}&from=${today}&to=${today}`)).length).toBeGreaterThanOrEqual(6)
  })

  it('pages newest first without repeating or skipping an entry', async () => {
    const all = await trail(`userId=${bossId}`)
    const seen: string[] = []
    let before = ''
    for (;;) {
      const page = (await boss.get(`/api/audit?userId=${bossId}&limit=2${before && `&before=${before}`}`)).body as AuditTrailPage
      seen.push(...page.entries.map((e) => e.key))
      if (!page.next) break
      before = page.next
    }
    expect(seen).toEqual(all.map((e) => e.key))
    const times = all.map((e) => Date.parse(e.at))
    expect(times).toEqual([...times].sort((a, b) => b - a))
  })

  it('refuses bad filters with a field problem', async () => {
    const res = await boss.get('/api/audit?kind=everything&from=2026-02-01&to=2026-01-01')
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.error.fields ?? {})).toEqual(expect.arrayContaining(['kind']))
  })
})

describe('entries cannot be changed or deleted', () => {
  it('PUT, PATCH and DELETE find no route, and the entry stays as it was', async () => {
    const [entry] = await trail(`userId=${bossId}&kind=settings`)
    const id = entry.key.slice(1)
    for (const path of ['/api/audit', `/api/audit/${id}`]) {
      for (const method of ['put', 'patch', 'delete'] as const) {
        const res = await boss[method](path).set(CSRF).send({ action: 'nothing' })
        expect([404, 405], `${method} ${path}`).toContain(res.status)
      }
    }
    const [after] = await trail(`userId=${bossId}&kind=settings`)
    expect(after).toEqual(entry)
  })
})

describe('the spreadsheet', () => {
  it('holds the same entries in the reader’s language, read back with exceljs', async () => {
    const shown = await trail(`userId=${bossId}`)
    const res = await download(boss, `/api/audit/export?userId=${bossId}&tz=UTC&lang=es`)
    expect(res.status).toBe(200)
    const book = await loadWorkbook(res.body as Buffer)
    const sheet = book.getWorksheet('Registro de auditoría')!
    expect(sheet.getRow(1).getCell(3).value).toBe('Qué')
    expect(sheet.rowCount - 1).toBe(shown.length)
    const keys = sheet.getColumn(13).values.slice(2)
    expect(keys).toEqual(shown.map((e) => e.key))
    const whats = sheet.getColumn(3).values.slice(2)
    expect(whats).toContain('Funciones cambiadas')
    expect(whats).toContain('Conteo cancelado')
    expect(sheet.getColumn(4).values).toContain(`Conteo ${wh.code} · ${countId}`)
  })

  it('refuses more entries than a spreadsheet holds, with a code', async () => {
    const { prepareAuditExport } = await import('../../server/services/audit/auditExport.js')
    await expect(prepareAuditExport(h.ds, { userId: bossId, tz: 'UTC', lang: 'en' }, 2)).rejects.toMatchObject({ code: 'audit_export_too_large' })
  })
})
