// A small seeded pseudo-random source for the demo scenario, so every load produces the same
// history (mulberry32: a 32-bit state, good enough for plausible demo data, not for security).

export interface SeededRandom {
  /** Uniform in [0, 1). */
  next(): number
  /** Integer in [min, max], both included. */
  int(min: number, max: number): number
  chance(p: number): boolean
  pick<T>(items: readonly T[]): T
  /** One item, chosen with probability proportional to its weight. */
  weighted<T>(items: readonly T[], weight: (item: T) => number): T
  /** Poisson-distributed count with mean lambda (Knuth's method; lambda stays small here). */
  poisson(lambda: number): number
  /** Uniform in [1 − spread, 1 + spread]. */
  jitter(spread: number): number
}

export function seededRandom(seed: number): SeededRandom {
  let state = seed >>> 0
  const next = () => {
    state = (state + 0x6d2b79f5) >>> 0
    let t = state
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
  const int = (min: number, max: number) => min + Math.floor(next() * (max - min + 1))
  return {
    next,
    int,
    chance: (p) => next() < p,
    pick: (items) => items[Math.floor(next() * items.length)],
    weighted(items, weight) {
      const total = items.reduce((sum, item) => sum + weight(item), 0)
      let r = next() * total
      for (const item of items) {
        r -= weight(item)
        if (r < 0) return item
      }
      return items[items.length - 1]
    },
    poisson(lambda) {
      const limit = Math.exp(-lambda)
      let k = 0
      let p = next()
      while (p > limit) {
        k++
        p *= next()
      }
      return k
    },
    jitter: (spread) => 1 - spread + next() * 2 * spread,
  }
}
