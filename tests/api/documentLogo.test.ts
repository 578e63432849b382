// The company logo on printed documents: once a logo is set in the company profile, the purchase order and
// quote PDFs carry it as an image, read back with poppler's pdfimages (Debian's poppler-utils, an outside
// reader); without one they carry no image. The pick sheet reads the same logo from a route every role
// that prints may call.
import { execFile } from 'node:child_process'
import { mkdtemp, rm, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { promisify } from 'node:util'
import { PNG } from 'pngjs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { download } from '../support/downloads.js'
import { createSalesFixture, type SalesFixture } from '../support/salesFixtures.js'
import { companyProfileFixture, createPurchasingFixture } from '../support/purchasingFixtures.js'

let h: ApiHarness
let fx: SalesFixture
let poId = 0
let quoteId = 0
let saved: { logo: Buffer | null; logo_type: string | null } | undefined

/** The images a PDF holds, as `pdfimages -list` reports them: width and height in pixels of each. */
async function pdfImages(bytes: Buffer): Promise<{ width: number; height: number }[]> {
  const dir = await mkdtemp(path.join(tmpdir(), 'ly-logo-'))
  try {
    await writeFile(path.join(dir, 'doc.pdf'), bytes)
    const { stdout } = await promisify(execFile)('pdfimages', ['-list', path.join(dir, 'doc.pdf')])
    // source: poppler pdfimages(1): two header lines, then one row per image: page num type width height …;
    // type 'smask' is an image's transparency, not an image of its own.
    return stdout.trim().split('\n').slice(2).filter(Boolean).map((line) => line.trim().split(/\s+/))
      .filter((cols) => cols[2] === 'image').map((cols) => ({ width: Number(cols[3]), height: Number(cols[4]) }))
  } finally {
    await rm(dir, { recursive: true, force: true })
  }
}

/** A 60 × 20 pixel PNG (drawn here, written by pngjs). */
function logoPng(): Buffer {
  const png = new PNG({ width: 60, height: 20 })
  for (let i = 0; i < png.data.length; i += 4) png.data.set([20, 110, 120, 255], i)
  return PNG.sync.write(png)
}

beforeAll(async () => {
  h = await startApiHarness()
  ;[saved] = await h.ds.query('SELECT logo, logo_type FROM company_profile WHERE id = 1')
  await companyProfileFixture(h.ds)
  const purchasing = await createPurchasingFixture(h.ds)
  const buyer = await h.as('buyer')
  const po = await buyer.post('/api/purchase-orders').set(CSRF).send({ vendorId: purchasing.vendorB, warehouseId: purchasing.warehouse.id, lines: [{ itemId: purchasing.sealant.id, packsOrdered: 1 }] })
  expect(po.status, JSON.stringify(po.body)).toBe(201)
  poId = po.body.id
  fx = await createSalesFixture(h.ds)
  const quote = await (await h.as('counter')).post('/api/quotes').set(CSRF).send({ customerId: fx.customerId, warehouseId: fx.warehouseId, lines: [{ itemId: fx.block.id, qty: 7 }] })
  expect(quote.status, JSON.stringify(quote.body)).toBe(201)
  quoteId = quote.body.id
})

afterAll(async () => {
  if (saved) await h.ds.query('UPDATE company_profile SET logo = ?, logo_type = ? WHERE id = 1', [saved.logo, saved.logo_type])
  await h?.close()
})

describe('company logo on printed documents', () => {
  it('prints no image without a logo, and the logo on the purchase order and the quote once one is set', async () => {
    await h.ds.query('UPDATE company_profile SET logo = NULL, logo_type = NULL WHERE id = 1')
    const admin = await h.as('admin')
    const po = async () => (await download(admin, `/api/purchase-orders/${poId}/pdf`)).body as Buffer
    const quote = async () => (await download(admin, `/api/quotes/${quoteId}/pdf`)).body as Buffer
    expect(await pdfImages(await po())).toEqual([])
    expect(await pdfImages(await quote())).toEqual([])
    expect((await (await h.as('warehouse')).get('/api/setup/printed-logo')).status).toBe(204)

    const set = await admin.put('/api/setup/logo').set(CSRF).attach('file', logoPng(), 'logo.png')
    expect(set.status, JSON.stringify(set.body)).toBe(200)
    // The PNG's own pixels, unscaled (pdfkit embeds the image and scales it on the page).
    expect(await pdfImages(await po())).toEqual([{ width: 60, height: 20 }])
    expect(await pdfImages(await quote())).toEqual([{ width: 60, height: 20 }])
    const printed = await download(await h.as('warehouse'), '/api/setup/printed-logo')
    expect(printed.status).toBe(200)
    expect(printed.headers['content-type']).toBe('image/png')
    expect(PNG.sync.read(printed.body as Buffer).width).toBe(60)
  })
})
