// Conservation under load: 20 warehouse clients (25 operations each) send random receipts, issues, bin moves, transfers (shipped
// and put away) and pick confirmations, half of them on one hot bin, some sent twice with one key, while
// readers take consistent snapshots. Afterwards and at every snapshot: totals = seed + acknowledged
// receipts − acknowledged issues and picks, no negative balance, ledger = balances, as many ledger
// batches as acknowledged operations (no Idempotency-Key with two moves), and no answer 5xx.
// source: Jepsen's bank workload (conserved total under concurrent transfers, checked in every read);
// IETF draft "The Idempotency-Key HTTP Header Field" (a retried key answers the first result).
// Set LUMENYARD_LOAD_SEED to replay a run; the figures are printed.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { transactionRetries } from '../../server/db/transaction.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { listen, type Listening } from '../support/stockFixtures.js'
import { checkConservation, createWorkloadFixture, innodbDeadlocks, runWorkload, signedInClients } from '../support/stockWorkload.js'

let h: ApiHarness
let net: Listening
beforeAll(async () => {
  h = await startApiHarness()
  net = await listen(h)
})
afterAll(async () => {
  await net?.close()
  await h?.close()
})

describe('stock conservation under concurrent load', () => {
  it('conserves every unit with a hot bin, answers no 5xx and applies each key once', async () => {
    const seed = Number(process.env.LUMENYARD_LOAD_SEED) || Date.now() % 1_000_000
    const clients = await signedInClients(h, net.url, 'warehouse', 20, 6)
    const [counter] = await signedInClients(h, net.url, 'counter', 1, 1)
    const fx = await createWorkloadFixture(h.ds, clients[0], counter)
    const deadlocksBefore = await innodbDeadlocks(h.ds)
    const retriesBefore = transactionRetries.count
    const stats = await runWorkload(h.ds, fx, clients, { seed, opsPerClient: 25, readers: 2 })
    const report = await checkConservation(h.ds, fx, stats)
    const figures = {
      ...report.figures,
      'InnoDB deadlocks': (await innodbDeadlocks(h.ds)) - deadlocksBefore,
      'transactions retried': transactionRetries.count - retriesBefore,
    }
    console.log(`conservation (seed ${seed}): ${JSON.stringify(figures)}`)
    expect(report.violations).toEqual([])
    expect(stats.serverErrors).toEqual([])
    // The run did real work on every path, or its passing would prove nothing.
    expect(stats.acked.receipts).toBeGreaterThan(20)
    expect(stats.acked.issues).toBeGreaterThan(20)
    expect(stats.acked.moves).toBeGreaterThan(5)
    expect(stats.acked.putAways).toBeGreaterThan(2)
    expect(stats.acked.confirmations).toBeGreaterThan(2)
    expect(stats.replays.sent).toBeGreaterThan(5)
    expect(stats.snapshots.taken).toBeGreaterThan(3)
  }, 300_000) // a bound for a loaded CI machine; the figures print the time it took
})
