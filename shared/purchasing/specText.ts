// A made-to-order spec (a shower base's footprint, curb, drain and entry) as one line a vendor reads.
// Accepts the takeoff's nested shape and the flat one the bill of materials explains itself with.
import { formatInches } from '../units.js'

type Spec = Record<string, unknown>

const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null)
const mmAndInches = (mm: number) => `${mm} mm (${formatInches(mm)})`

function curbText(spec: Spec): string | null {
  if (spec.curbless === true) return 'curbless'
  if (typeof spec.curb === 'string') return `curb ${spec.curb}`
  const curb = spec.curb as { radiusMm?: unknown; arcDeg?: unknown } | undefined
  const radius = num(curb?.radiusMm)
  if (radius !== null) return `curved curb R ${radius} mm, ${num(curb?.arcDeg) ?? '?'}°`
  return spec.curbless === false || 'widthMm' in spec ? 'straight curb' : null
}

function drainText(spec: Spec): string | null {
  const drain = (spec.drain ?? {}) as { fromLeftMm?: unknown; fromBackMm?: unknown }
  const left = num(drain.fromLeftMm) ?? num(spec.drainFromLeftMm)
  const back = num(drain.fromBackMm) ?? num(spec.drainFromBackMm)
  if (left === null && back === null) return null
  return `drain ${left ?? '?'} mm from left, ${back ?? '?'} mm from back`
}

const KNOWN = new Set(['widthMm', 'depthMm', 'curb', 'curbless', 'drain', 'drainFromLeftMm', 'drainFromBackMm', 'entry', 'note'])

/** "1220 mm (48″) × 915 mm (36″); straight curb; drain 610 mm from left, 457 mm from back; entry left". */
export function specText(spec: Spec | null | undefined): string | null {
  if (!spec || typeof spec !== 'object') return null
  const parts: string[] = []
  const width = num(spec.widthMm)
  const depth = num(spec.depthMm)
  if (width !== null && depth !== null) parts.push(`${mmAndInches(width)} × ${mmAndInches(depth)}`)
  const curb = curbText(spec)
  if (curb) parts.push(curb)
  const drain = drainText(spec)
  if (drain) parts.push(drain)
  if (typeof spec.entry === 'string') parts.push(`entry ${spec.entry}`)
  for (const [key, value] of Object.entries(spec)) {
    if (!KNOWN.has(key) && (typeof value === 'string' || typeof value === 'number')) parts.push(`${key} ${value}`)
  }
  if (typeof spec.note === 'string' && spec.note) parts.push(`note: ${spec.note}`)
  return parts.length ? parts.join('; ') : null
}

/** Parses stored spec JSON; text that is not a JSON object yields null rather than an error. */
export function parseSpec(json: string | null | undefined): Spec | null {
  if (!json) return null
  try {
    const value: unknown = JSON.parse(json)
    return value && typeof value === 'object' && !Array.isArray(value) ? (value as Spec) : null
  } catch {
    return null
  }
}
