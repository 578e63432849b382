// The demo history generator, run in memory: no balance below zero at any point (DemoLedger refuses
// it), balances equal the sum of their moves, and each warehouse's average cost equals the
// perpetual moving average replayed from the ledger's receipts and transfers in
// (shared/inventory/movingAverage.ts, checked against textbook examples in inventoryMovingAverage.test.ts).
import { describe, expect, it } from 'vitest'
import { applyReceipt, EMPTY_COST_STATE, type CostState } from '../../shared/inventory/movingAverage.js'
import { demoItems } from '../../server/demo/demoCatalog.js'
import { DemoHistory } from '../../server/demo/demoHistory.js'
import { planStock, type PlanItem, type PlanWarehouse } from '../../server/demo/demoStockPlan.js'

function warehouses(): PlanWarehouse[] {
  let binId = 1
  return ['HRY', 'MBS', 'EKD'].map((code, i) => ({
    id: i + 1, code, receivingBin: binId++, transitBin: binId++,
    storageBins: Array.from({ length: 40 }, () => binId++),
  }))
}

function run(seed: number, now = new Date('2026-06-15T12:00:00')) {
  const items: PlanItem[] = demoItems().map((demo, i) => ({
    id: i + 1, demo,
    source: demo.row.madeToOrder ? null : { vendorId: 1, unitCost: demo.row.cost, leadDays: demo.row.family === 'glass_block' ? 28 : 7, packQty: demo.row.caseQty ?? 1, minOrderQty: demo.row.caseQty ?? 1 },
  }))
  const plans = planStock(items, warehouses())
  const history = new DemoHistory({ plans, users: { counter: 2, warehouse: 3 }, now, seed, ids: { lot: 1, transfer: 1, transferLine: 1 } })
  history.run()
  return history
}

describe('demo history generator', () => {
  const history = run(7)
  const moves = history.ledger.moves

  it('ends before now and balances equal the sum of their moves', () => {
    expect(moves.length).toBeGreaterThan(10_000)
    expect(moves.every((m) => m.at < new Date('2026-06-15T12:00:00'))).toBe(true)
    const sums = new Map<string, number>()
    for (const m of moves) sums.set(`${m.itemId}:${m.binId}:${m.lotId ?? 0}`, (sums.get(`${m.itemId}:${m.binId}:${m.lotId ?? 0}`) ?? 0) + m.qty)
    for (const [key, bal] of history.ledger.balances) {
      expect(bal.onHand, key).toBe(sums.get(key) ?? 0)
      expect(bal.onHand, key).toBeGreaterThanOrEqual(0)
    }
  })

  it('is in time order, so a running balance never dips below zero', () => {
    const running = new Map<string, number>()
    for (let i = 0; i < moves.length; i++) {
      if (i > 0) expect(moves[i].at.getTime()).toBeGreaterThanOrEqual(moves[i - 1].at.getTime())
      const key = `${moves[i].itemId}:${moves[i].binId}:${moves[i].lotId ?? 0}`
      running.set(key, (running.get(key) ?? 0) + moves[i].qty)
      if (running.get(key)! < 0) throw new Error(`running balance of ${key} below zero at move ${i}`)
    }
  })

  it('keeps the moving average the ledger replays to', () => {
    const states = new Map<string, CostState>()
    for (const m of moves) {
      const key = `${m.itemId}|${m.warehouseId}`
      const state = states.get(key) ?? EMPTY_COST_STATE
      const next = m.moveType === 'receipt' || m.moveType === 'transfer_in'
        ? applyReceipt(state, m.qty, m.unitCost!).after
        : { onHand: state.onHand + m.qty, averageCost: state.averageCost }
      states.set(key, next)
    }
    const averages = history.ledger.averagesByPair()
    expect(averages.size).toBeGreaterThan(100)
    for (const [key, avg] of averages) expect(avg, key).toBe(states.get(key)!.averageCost)
  })

  it('moves stock between warehouses only by transfers that balance out', () => {
    const out = moves.filter((m) => m.moveType === 'transfer_out').reduce((s, m) => s + m.qty, 0)
    const inn = moves.filter((m) => m.moveType === 'transfer_in').reduce((s, m) => s + m.qty, 0)
    expect(history.transfers.rows.length).toBeGreaterThan(3)
    expect(out).toBe(-inn)
  })

  it('is the same history for the same seed, and another for another seed', () => {
    const again = run(7).ledger.moves
    expect(again.length).toBe(moves.length)
    expect(again.slice(0, 500).map((m) => [m.itemId, m.qty, m.at.getTime()])).toEqual(moves.slice(0, 500).map((m) => [m.itemId, m.qty, m.at.getTime()]))
    expect(run(8).ledger.moves.length).not.toBe(moves.length)
  })
})
