// Every error answer carries a code the client can word in English and Spanish, with the values its
// message needs, and field errors carry codes too. The harness (tests/support/apiHarness.ts) checks
// every error answer of every API test the same way; this file provokes one of each kind of failure
// on purpose and reads the answer. Status codes as RFC 9110 §15.5 defines them.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { unknownErrorCodes } from '../support/errorCodeCheck.js'

let h: ApiHarness
beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

const suffix = Date.now().toString(36).slice(-5).toUpperCase()

function known(res: { status: number; body: unknown }, status: number, code: string) {
  expect(res.status, JSON.stringify(res.body)).toBe(status)
  expect((res.body as { error: { code: string } }).error.code).toBe(code)
  expect(unknownErrorCodes(res.body)).toEqual([])
}

describe('error answers', () => {
  it('the check itself refuses a code the client has no words for, and a field without a code', () => {
    expect(unknownErrorCodes({ error: { code: 'no_such_code', message: 'x' } })).toEqual(['code no_such_code'])
    expect(unknownErrorCodes({ error: { code: 'invalid_input', message: 'x', fields: { qty: 'More than zero' } } })).toHaveLength(1)
    expect(unknownErrorCodes({ error: { code: 'invalid_input', message: 'x', fields: { qty: { code: 'more_than_zero' } } } })).toEqual([])
  })

  it('requests the server cannot take: unknown route, bad JSON, missing request header, signed out, wrong role', async () => {
    known(await h.agent().get('/api/no-such-thing'), 404, 'route_not_found')
    known(await h.agent().post('/api/session').set(CSRF).set('Content-Type', 'application/json').send('{"username":'), 400, 'bad_json')
    known(await h.agent().post('/api/session').send({ username: 'a', password: 'b' }), 403, 'csrf')
    known(await h.agent().get('/api/items'), 401, 'unauthenticated')
    known(await (await h.as('viewer')).post('/api/warehouses').set(CSRF).send({}), 403, 'forbidden')
    known(await h.agent().post('/api/session').set(CSRF).send({ username: 'nobody-at-all', password: 'wrong-password' }), 401, 'bad_credentials')
  })

  it('bad input: a code per field with the bound it broke', async () => {
    const admin = await h.as('admin')
    const res = await admin.post('/api/warehouses').set(CSRF).send({ code: 'x', name: '', binPattern: '^[A-Z]+$', address: 'a'.repeat(201) })
    known(res, 400, 'invalid_input')
    expect(res.body.error.fields).toEqual({
      code: expect.objectContaining({ code: expect.any(String) }),
      name: { code: 'required' },
      address: { code: 'too_long', params: { max: 200 } },
      binPattern: { code: 'bin_pattern_groups', params: { missing: ['aisle', 'bay', 'level'] } },
    })
    const filters = await admin.get('/api/stock/ledger?pageSize=0')
    known(filters, 400, 'invalid_filters')
    expect(filters.body.error.fields.pageSize).toEqual({ code: 'at_least', params: { min: 1 } })
  })

  it('a length bound names its unit, so the client can write it in inches or millimetres', async () => {
    const res = await (await h.as('counter')).post('/api/takeoffs/compute').set(CSRF).send({
      takeoff: { walls: [{ heightMm: -5 }] },
    })
    known(res, 400, 'invalid_input')
    const lengths = Object.entries(res.body.error.fields as Record<string, { params?: { unit?: string } }>).filter(([k]) => k.endsWith('Mm'))
    expect(lengths.length).toBeGreaterThan(0)
    for (const [field, p] of lengths) if (p.params && ('min' in p.params || 'max' in p.params)) expect(p.params.unit, field).toBe('mm')
  })

  it('a refusal of a duplicate names the field and the situation', async () => {
    const admin = await h.as('admin')
    const first = await admin.post('/api/warehouses').set(CSRF).send({ code: `E${suffix}`, name: 'Error code test' })
    expect(first.status).toBe(201)
    const dup = await admin.post('/api/warehouses').set(CSRF).send({ code: `E${suffix}`, name: 'Again' })
    known(dup, 409, 'warehouse_code_taken')
    expect(dup.body.error.fields).toEqual({ code: { code: 'warehouse_code_taken' } })
    expect(dup.body.error.message).toMatch(/warehouse/) // English stays for logs and people reading the API
  })

  it('a throttled sign-in carries the minutes to wait as a value', async () => {
    const throttled = await startApiHarness({ LUMENYARD_SIGNIN_FAILS_PER_ACCOUNT: '1' })
    try {
      await throttled.user('errcode-throttle', ['viewer'])
      await throttled.agent().post('/api/session').set(CSRF).send({ username: 'errcode-throttle', password: 'wrong-password!' })
      const locked = await throttled.agent().post('/api/session').set(CSRF).send({ username: 'errcode-throttle', password: 'wrong-password!' })
      known(locked, 429, 'too_many_signins_account')
      expect(locked.body.error.params.minutes).toBeGreaterThanOrEqual(1)
    } finally {
      await throttled.close()
    }
  })
})
