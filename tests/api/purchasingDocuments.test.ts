// What a vendor receives: the special order of a job's shower base, sent by e-mail with a PDF (read back
// with poppler's pdftotext, an outside reader) and a spreadsheet (exceljs). It must say who orders (the
// company profile, the buyer, a reply-to), bill-to and ship-to, and the whole specification in sensible
// units; ship to the job's warehouse by default; and warn the buyer when it would arrive after the job is due.
import ExcelJS from 'exceljs'
import { simpleParser } from 'mailparser'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PoDetail } from '../../shared/schemas/purchasingViews.js'
import { startSmtpFake, type SmtpFake } from '../../server/fakes/smtpFake.js'
import { pdfText } from '../support/pdfText.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { download } from '../support/downloads.js'
import { createPurchasingFixture, insertId, jobWithShowerBase, TEST_COMPANY, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: ApiHarness
let f: PurchasingFixture
let smtp: SmtpFake
beforeAll(async () => {
  smtp = await startSmtpFake({ port: 0 })
  h = await startApiHarness({ LUMENYARD_SMTP_PORT: String(smtp.port), LUMENYARD_SMTP_HOST: '127.0.0.1', LUMENYARD_SMTP_SECURE: 'false' })
  f = await createPurchasingFixture(h.ds)
})
afterAll(async () => {
  await h?.close()
  await smtp?.close()
})

const squash = (text: string) => text.replace(/\s+/g, ' ')

describe('the company profile', () => {
  it('is read by buyers, kept by admins, and refuses a blank name or bill-to with nothing written', async () => {
    const before = (await (await h.as('buyer')).get('/api/purchasing/company')).body
    expect(before).toMatchObject({ legalName: TEST_COMPANY.legalName, complete: true })
    expect((await (await h.as('buyer')).put('/api/purchasing/company').set(CSRF).send(before)).status).toBe(403)
    const bad = await (await h.as('admin')).put('/api/purchasing/company').set(CSRF).send({ ...before, legalName: '  ', billToAddress: '', replyTo: 'not-an-address' })
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['billToAddress', 'legalName', 'replyTo'])
    expect((await (await h.as('buyer')).get('/api/purchasing/company')).body).toEqual(before)
    const same = await (await h.as('admin')).put('/api/purchasing/company').set(CSRF).send({ ...before, complete: undefined })
    expect(same.status, JSON.stringify(same.body)).toBe(200)
    expect(same.body).toEqual(before)
  })
})

describe('a special order sent to the vendor', () => {
  it('ships to the job’s warehouse, warns when late for the job, and sends a PDF and a sheet with who orders and the whole specification', async () => {
    const tomorrow = new Date(Date.now() + 86_400_000).toISOString().slice(0, 10)
    const { jobId, bomLineId } = await jobWithShowerBase(h.ds, f, tomorrow)
    // 42 × 48 in typed at the counter, stored as millimetres (48 × 25.4 = 1219.1999999999998 in floating point),
    // with a note long enough that a 200-character description would have lost the drain and entry.
    const note = 'Tile flange on three sides, pre-slope to drain, membrane by the tile setter; deliver on a pallet, strapped, with the drain body taped shut. '.repeat(2).trim()
    const spec = { widthMm: 42 * 25.4, depthMm: 48 * 25.4, curb: { radiusMm: 48 * 25.4, arcDeg: 90 }, drain: { fromLeftMm: 21 * 25.4, fromBackMm: 24 * 25.4 }, entry: 'right', curbless: false, note }
    await h.ds.query('UPDATE bom_lines SET spec_json = ? WHERE id = ?', [JSON.stringify(spec), bomLineId])
    // Hand written from the inputs above (1 in = 25.4 mm exactly, NIST SP 811): no float noise, nothing cut.
    const specLine = `42 in × 48 in (width × depth); curved curb, radius 48 in, 90°; drain 21 in from left, 24 in from back; entry right; note: ${note}`

    const buyer = await h.as('buyer')
    // No ship-to chosen and no pick list yet: the buyer is asked for one; nothing is written.
    const ask = await buyer.post('/api/purchase-orders/from-job').set(CSRF).send({ jobId, vendorId: f.vendorA })
    expect(ask.status).toBe(400)
    expect(ask.body.error.fields).toHaveProperty('warehouseId')
    expect((await h.ds.query('SELECT ordered_qty FROM bom_lines WHERE id = ?', [bomLineId]))[0].ordered_qty).toBe(0)
    // The job is picked in the other warehouse: its shower base ships there by default.
    const [bom] = await h.ds.query('SELECT bom_id FROM bom_lines WHERE id = ?', [bomLineId])
    await insertId(h.ds, 'INSERT INTO pick_lists (bom_id, job_id, warehouse_id) VALUES (?, ?, ?)', [bom.bom_id, jobId, f.otherWarehouse.id])
    const made = await buyer.post('/api/purchase-orders/from-job').set(CSRF).send({ jobId, vendorId: f.vendorA })
    expect(made.status, JSON.stringify(made.body)).toBe(201)
    const po = made.body[0] as PoDetail
    expect(po.warehouse.id).toBe(f.otherWarehouse.id)
    // Vendor A's lead time for the base is 21 days (fixture): after a job due tomorrow.
    expect(po.arrivesAfterDue).toBe(true)
    const [line] = po.lines
    // The description no longer repeats the catalog item's size; the size lives in the specification.
    expect(line.description).not.toContain(`Item ${f.base.sku}`)
    expect(line.spec).toEqual(spec)

    const approved = await buyer.post(`/api/purchase-orders/${po.id}/approve`).set(CSRF).send({ version: po.version })
    expect(approved.status, JSON.stringify(approved.body)).toBe(200)
    const sent = await buyer.post(`/api/purchase-orders/${po.id}/send`).set(CSRF).send({})
    expect(sent.status, JSON.stringify(sent.body)).toBe(200)
    const mail = await simpleParser(smtp.messages[smtp.messages.length - 1].raw)
    expect(mail.replyTo?.text).toBe(TEST_COMPANY.replyTo)
    const [me] = await h.ds.query("SELECT display_name FROM users WHERE id = (SELECT approved_by FROM purchase_orders WHERE id = ?)", [po.id])
    for (const words of [TEST_COMPANY.legalName, 'Accounts payable 2140 Harbor Road Port Alder', `Yard ${f.otherWarehouse.code}`, `Specification: ${specLine}`, me.display_name]) {
      expect(squash(mail.text!), words).toContain(words)
    }
    expect(mail.attachments.map((a) => a.filename)).toEqual([`${po.number}.pdf`, `${po.number}.xlsx`])

    const pdf = squash(await pdfText(mail.attachments[0].content))
    for (const words of [`Purchase order ${po.number}`, TEST_COMPANY.legalName, 'Bill to', 'Accounts payable 2140 Harbor Road Port Alder', 'Ship to',
      `Yard ${f.otherWarehouse.code}`, me.display_name, TEST_COMPANY.replyTo, `Specification: ${specLine}`, 'Wanted by']) {
      expect(pdf, words).toContain(words)
    }
    expect(pdf).not.toMatch(/\d\.\d{5,}/)

    const book = new ExcelJS.Workbook()
    await book.xlsx.load(mail.attachments[1].content as unknown as ArrayBuffer)
    const sheet = book.worksheets[0]
    expect(sheet.getCell('E12').value).toBe('Specification')
    expect(sheet.getCell('E13').value).toBe(specLine)
    const texts: string[] = []
    sheet.eachRow((row) => row.eachCell((cell) => texts.push(String(cell.value))))
    // The vendor reads an order, not our workflow: no internal status on the sheet.
    expect(texts).not.toContain('approved')
    expect(texts).not.toContain('Status')
  })
})

describe('the PO sheet as PDF', () => {
  it('keeps a long reply-to address whole, or breaks it only after an @, a dot or a dash, never inside a name', async () => {
    // An address of 70 characters: wider than the half-page column the order's facts sit in.
    const long = 'purchasing.department.orders@brightcourse-glass-supply-harbor-yard.example'
    // (a reader like pdftotext drops a dash that ends a line: the address must never be split after one)
    await h.ds.query('UPDATE company_profile SET reply_to = ? WHERE id = 1', [long])
    try {
      const buyer = await h.as('buyer')
      const made = await buyer.post('/api/purchase-orders').set(CSRF).send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.sealant.id, packsOrdered: 1 }] })
      expect(made.status, JSON.stringify(made.body)).toBe(201)
      const res = await download(buyer, `/api/purchase-orders/${made.body.id}/pdf`)
      expect(res.status).toBe(200)
      const text = await pdfText(res.body as Buffer)
      // The address wherever it is printed, allowing a line break between any two of its characters.
      const spread = new RegExp(long.split('').map((c) => c.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')).join('\\s*'), 'g')
      const printed = [...text.matchAll(spread)].map((m) => m[0])
      expect(printed.length).toBeGreaterThanOrEqual(2) // beside "Reply to", and in the closing line
      for (const p of printed) {
        // source: RFC 5322 §3.4.1 addr-spec = local-part "@" domain, dot-separated atoms: a reader rejoins the
        // parts only where a line ends in "@" or "." (a line ending in "-" reads as a hyphenated word)
        for (const m of p.matchAll(/\s+/g)) expect(p.slice(0, m.index), p).toMatch(/[@.]$/)
      }
    } finally {
      await h.ds.query('UPDATE company_profile SET reply_to = ? WHERE id = 1', [TEST_COMPANY.replyTo])
    }
  })
})
