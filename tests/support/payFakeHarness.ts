// The API harness with the local card-payment fake: the fake on a free port, the SDK pointed at it, and the
// app listening on a port of its own so the fake can deliver its signed events to the webhook.
import type { Server } from 'node:http'
import type supertest from 'supertest'
import { LOCAL_PAY_SECRET_KEY, LOCAL_PAY_WEBHOOK_SECRET } from '../../server/config.js'
import { startPayFake, type PayFake } from '../../server/fakes/payFake.js'
import { PAYMENT_WEBHOOK_PATH } from '../../server/routes/payments.js'
import { startApiHarness, type ApiHarness } from './apiHarness.js'
import { bookedOrder, createSalesFixture, type SalesFixture } from './salesFixtures.js'

export interface PayHarness {
  h: ApiHarness
  fake: PayFake
  close(): Promise<void>
}

export async function startPayHarness(): Promise<PayHarness> {
  const fake = await startPayFake({ port: 0, secretKey: LOCAL_PAY_SECRET_KEY, webhookSecret: LOCAL_PAY_WEBHOOK_SECRET, retryMs: 20 })
  const h = await startApiHarness({ LUMENYARD_PAY_PORT: String(fake.port) })
  const server = await new Promise<Server>((resolve) => {
    const s = h.built.app.listen(0, '127.0.0.1', () => resolve(s))
  })
  const address = server.address()
  fake.webhookUrl = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}${PAYMENT_WEBHOOK_PATH}`
  return {
    h,
    fake,
    close: async () => {
      await fake.close()
      await new Promise<void>((resolve) => server.close(() => resolve()))
      await h.close()
    },
  }
}

export interface CardOrderHarness extends PayHarness {
  counter: supertest.Agent
  fx: SalesFixture
  orderId: number
}

/**
 * The card-payment harness with a counter clerk and a booked order for a fresh contractor on a 15 %-off level
 * (`levelPrefix` + the fixture's tag): the made-to-order base sells at 895.00 × 0.85 = 760.75 (hand-worked).
 */
export async function startCardOrder(levelPrefix: string): Promise<CardOrderHarness> {
  const pay = await startPayHarness()
  const counter = await pay.h.as('counter')
  const fx = await createSalesFixture(pay.h.ds)
  return { ...pay, counter, fx, orderId: await bookedOrder(pay.h.ds, counter, fx, `${levelPrefix}${fx.tag}`) }
}
