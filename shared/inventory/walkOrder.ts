// Pick lines in the order a picker meets the bins on the warehouse's path.
// serpentine: the 1st, 3rd, 5th… aisle of the walk is taken in ascending bays, the 2nd, 4th… descending,
// so the picker never walks an aisle back empty; oneWay: every aisle ascending (one-way aisles or a return lane).
// Within a bay, levels ascend by default. Bins the pattern cannot read, or in aisles not in the walk, come last
// in their original order; equal bins keep their original order (the sort is stable).

export interface WalkConfig {
  /** Named groups `aisle`, `bay`, `level` (or groups 1, 2, 3 in that order). Default reads `A-03-2`. */
  binPattern?: RegExp | string
  /** Aisles in walking order. Omitted: every aisle, in natural order of its name. */
  aisleOrder?: readonly string[]
  direction: 'serpentine' | 'oneWay'
  levelOrder?: 'ascending' | 'descending'
}

export interface BinLocation {
  aisle: string
  bay: number
  level: string
}

export const DEFAULT_BIN_PATTERN = /^(?<aisle>[A-Z]+)-(?<bay>\d+)-(?<level>\d+)$/i

/** Natural comparison: runs of digits by value ('A9' before 'A10'), other runs by code units, then whole text. */
function compareNatural(a: string, b: string): number {
  const runs = (s: string) => s.match(/\d+|\D+/g) ?? []
  const [ra, rb] = [runs(a), runs(b)]
  for (let i = 0; i < Math.min(ra.length, rb.length); i++) {
    const [x, y] = [ra[i], rb[i]]
    const diff = /^\d/.test(x) && /^\d/.test(y) ? Number(x) - Number(y) : x < y ? -1 : x > y ? 1 : 0
    if (diff !== 0) return diff
  }
  return ra.length - rb.length || (a < b ? -1 : a > b ? 1 : 0)
}

function patternOf(config: WalkConfig): RegExp {
  const p = config.binPattern ?? DEFAULT_BIN_PATTERN
  // A 'g' or 'y' flag would make exec() remember its last position between bins.
  return typeof p === 'string' ? new RegExp(p, 'i') : new RegExp(p.source, p.flags.replace(/[gy]/g, ''))
}

/** Reads a bin code into aisle (upper-cased), bay and level; null when the code does not fit the pattern. */
export function parseBinCode(code: string, config: Pick<WalkConfig, 'binPattern'> = {}): BinLocation | null {
  const m = patternOf(config as WalkConfig).exec(code.trim())
  if (!m) return null
  const aisle = m.groups?.aisle ?? m[1]
  const bay = m.groups?.bay ?? m[2]
  const level = m.groups?.level ?? m[3] ?? ''
  if (aisle === undefined || bay === undefined || !/^\d+$/.test(bay)) return null
  return { aisle: aisle.toUpperCase(), bay: Number(bay), level }
}

interface Keyed<T> {
  line: T
  index: number
  aisleRank: number
  bayKey: number
  level: string
}

/** Sorts pick lines into walking order; returns a new array, the input is left alone. */
export function walkOrder<T extends { binCode: string }>(lines: readonly T[], config: WalkConfig): T[] {
  const parsed = lines.map((line) => parseBinCode(line.binCode, config))
  const aisles = config.aisleOrder
    ? config.aisleOrder.map((a) => a.toUpperCase())
    : [...new Set(parsed.flatMap((p) => (p ? [p.aisle] : [])))].sort(compareNatural)
  const rank = new Map(aisles.map((a, i) => [a, i] as const))
  const known: Keyed<T>[] = []
  const unknown: T[] = []
  lines.forEach((line, index) => {
    const loc = parsed[index]
    const aisleRank = loc ? rank.get(loc.aisle) : undefined
    if (!loc || aisleRank === undefined) {
      unknown.push(line)
      return
    }
    const descending = config.direction === 'serpentine' && aisleRank % 2 === 1
    known.push({ line, index, aisleRank, bayKey: descending ? -loc.bay : loc.bay, level: loc.level })
  })
  const levelSign = config.levelOrder === 'descending' ? -1 : 1
  known.sort((a, b) =>
    a.aisleRank - b.aisleRank || a.bayKey - b.bayKey || levelSign * compareNatural(a.level, b.level) || a.index - b.index)
  return [...known.map((k) => k.line), ...unknown]
}
