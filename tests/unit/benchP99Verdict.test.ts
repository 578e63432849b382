// The bench's p99 verdict (scripts/bench/stats.ts, judgeP99): the target judged with the floor's p99 beside it, and
// the throughput a p99 under the target takes by Little's law, L = λW (J. D. C. Little, "A Proof for the Queuing
// Formula: L = λW", Operations Research 9(3), 1961): with L requests always in flight (a closed load of L
// connections), the mean time in the system is W = L / λ. Expected figures worked out by hand below.
import { describe, expect, it } from 'vitest'
import { judgeP99 } from '../../scripts/bench/stats.js'

describe('bench p99 verdict', () => {
  it('says the machine keeps the target out of reach when the floor misses it too', () => {
    // 50 connections, 30 ms: more than 50 / 0.030 s = 1,666.7 answers a second. Means: 50 / 1,027 s = 48.7 ms,
    // 50 / 2,160 s = 23.1 ms. p99 105 against 57 ms: 1.84×.
    const v = judgeP99(30, 50, { median: 1027, p99: 105 }, { median: 2160, p99: 57 })
    expect(v.holds).toBe(false)
    expect(v.floorHolds).toBe(false)
    expect(v.neededReqPerS).toBeCloseTo(1666.67, 1)
    expect(v.meanMs.lumenyard).toBeCloseTo(48.69, 1)
    expect(v.meanMs.floor).toBeCloseTo(23.15, 1)
    expect(v.verdict).toContain('the floor also misses the target (p99 57 ms')
    expect(v.verdict).toContain('the machine, not the app')
    expect(v.verdict).toContain('1.8× the floor')
    expect(v.verdict).toContain('more than 1,667 answers/s')
  })

  it('blames the app when the floor meets the target in the same rounds', () => {
    // 20 clients, 50 ms: more than 20 / 0.050 s = 400 answers a second.
    const v = judgeP99(50, 20, { median: 532, p99: 69 }, { median: 900, p99: 41 })
    expect(v.holds).toBe(false)
    expect(v.floorHolds).toBe(true)
    expect(v.neededReqPerS).toBe(400)
    expect(v.verdict).toContain('the app misses it')
    expect(v.verdict).not.toContain('the machine')
  })

  it('holds only under the target, not at it', () => {
    expect(judgeP99(50, 20, { median: 600, p99: 49 }, { median: 800, p99: 60 }).holds).toBe(true)
    expect(judgeP99(50, 20, { median: 600, p99: 50 }, { median: 800, p99: 60 }).holds).toBe(false)
  })
})
