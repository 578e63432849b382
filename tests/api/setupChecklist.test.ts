// The first-run checklist's own answers against the real database: the GS1 company prefix (checked),
// the company's units, and the logo (PNG or JPEG by content, never by name). Outside production the
// checklist never opens by itself.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'

let h: ApiHarness
beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

// The 8-byte PNG signature (ISO/IEC 15948 / RFC 2083 §3.1), then a few bytes: enough for a content check.
const PNG = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.from('lumenyard-test-logo')])
const GIF = Buffer.from('GIF89a-not-allowed')

describe('first-run checklist settings', () => {
  it('checks the GS1 prefix, saves units and the logo, and reports each step from the data', async () => {
    const admin = await h.as('admin')
    const first = await admin.get('/api/setup')
    expect(first.status).toBe(200)
    expect(first.body.show).toBe(false) // NODE_ENV=test: only a production installation opens it by itself
    expect(first.body.steps.map((s: { key: string }) => s.key)).toEqual(['company', 'units', 'warehouses', 'gs1', 'items', 'opening_stock', 'vendors', 'accounts', 'purchase_orders', 'usage_history'])

    // source: GS1 General Specifications, GS1 Company Prefix: 4 to 12 digits
    for (const bad of ['123', '1234567890123', '06141A1']) {
      const res = await admin.put('/api/setup/gs1-prefix').set(CSRF).send({ prefix: bad })
      expect(res.status, bad).toBe(400)
      expect(res.body.error.fields.prefix.code, bad).toBe('gs1_prefix_digits')
    }
    const ok = await admin.put('/api/setup/gs1-prefix').set(CSRF).send({ prefix: ' 0614141 ' })
    expect(ok.status).toBe(200)
    expect(ok.body.steps.find((s: { key: string }) => s.key === 'gs1')).toEqual({ key: 'gs1', done: true, figures: { prefix: '0614141' } })

    const units = await admin.put('/api/setup/units').set(CSRF).send({ lengthUnit: 'mm', weightUnit: 'kg' })
    expect(units.status).toBe(200)
    expect(units.body.steps.find((s: { key: string }) => s.key === 'units')).toMatchObject({ done: true, figures: { lengthUnit: 'mm', weightUnit: 'kg' } })
    expect((await h.ds.query('SELECT document_unit FROM company_profile WHERE id = 1'))[0].document_unit).toBe('mm')
    await admin.put('/api/setup/units').set(CSRF).send({ lengthUnit: 'in', weightUnit: 'lb' }) // the demo's own again

    const gif = await admin.put('/api/setup/logo').set(CSRF).attach('file', GIF, 'logo.png')
    expect([gif.status, gif.body.error.code]).toEqual([415, 'image_type_not_allowed'])
    expect((await admin.put('/api/setup/logo').set(CSRF).attach('file', PNG, 'logo.bin')).status).toBe(200)
    const logo = await admin.get('/api/setup/logo').buffer(true).parse((r, done) => {
      const chunks: Buffer[] = []
      r.on('data', (c: Buffer) => chunks.push(c))
      r.on('end', () => done(null, Buffer.concat(chunks)))
    })
    expect(logo.headers['content-type']).toBe('image/png')
    expect(Buffer.compare(logo.body as Buffer, PNG)).toBe(0)

    // What the steps say is what the tables hold.
    const [{ n: warehouses }] = await h.ds.query('SELECT COUNT(*) AS n FROM warehouses WHERE active = 1')
    expect(units.body.steps.find((s: { key: string }) => s.key === 'warehouses').figures.warehouses).toBe(Number(warehouses))
  })
})
