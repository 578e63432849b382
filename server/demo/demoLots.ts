// Production lots of the demo's blocks: one per delivery, coded by receipt date, some with a tint note.
import { dateText, shortDate } from './demoCalendar.js'
import type { SeededRandom } from './seededRandom.js'

export interface DemoLot {
  id: number
  itemId: number
  code: string
  receivedAt: string
  vendorId: number | null
  tintNote: string | null
}

const TINT_NOTES = [
  'Clear, no visible cast',
  'Faint green edge, a shade deeper than earlier runs',
  'Slight blue cast: keep apart from older lots',
  'Warm tint in daylight',
  'Very slight grey cast',
  'Matches the previous run side by side',
]

export class DemoLots {
  readonly rows: DemoLot[] = []
  private readonly codes = new Map<number, Set<string>>()

  constructor(private readonly rng: SeededRandom, private nextId: number) {}

  private readonly latest = new Map<number, { id: number; at: Date }>()

  /**
   * The lot a delivery belongs to: often the same production run as the item's last delivery when that
   * came within two months, else a new lot coded like K250314A (K, YYMMDD of receipt, run letter).
   */
  create(itemId: number, at: Date, vendorId: number | null): number {
    const last = this.latest.get(itemId)
    if (last && at.getTime() - last.at.getTime() < 60 * 86_400_000 && this.rng.chance(0.75)) return last.id
    const used = this.codes.get(itemId) ?? new Set<string>()
    this.codes.set(itemId, used)
    let letter = 0
    while (used.has(`K${shortDate(at)}${String.fromCharCode(65 + letter)}`)) letter++
    const code = `K${shortDate(at)}${String.fromCharCode(65 + letter)}`
    used.add(code)
    const tintNote = this.rng.chance(0.6) ? this.rng.pick(TINT_NOTES) : null
    const id = this.nextId++
    this.rows.push({ id, itemId, code, receivedAt: dateText(at), vendorId, tintNote })
    this.latest.set(itemId, { id, at })
    return id
  }
}
