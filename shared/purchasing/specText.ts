// A made-to-order spec (a shower base's footprint, curb, drain and entry) as one line a vendor reads, every
// length in one unit through the one length formatter (never a raw float such as 1219.1999999999998).
// Accepts the takeoff's nested shape and the flat one the bill of materials explains itself with.
import { formatLength, formatSize, type LengthUnit } from '../units.js'

type Spec = Record<string, unknown>

const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null)

function curbText(spec: Spec, len: (mm: number) => string): string | null {
  if (spec.curbless === true) return 'curbless'
  if (typeof spec.curb === 'string') return `curb ${spec.curb}`
  const curb = spec.curb as { radiusMm?: unknown; arcDeg?: unknown } | undefined
  const radius = num(curb?.radiusMm)
  if (radius !== null) return `curved curb, radius ${len(radius)}, ${num(curb?.arcDeg) ?? '?'}°`
  return spec.curbless === false || 'widthMm' in spec ? 'straight curb' : null
}

function drainText(spec: Spec, len: (mm: number) => string): string | null {
  const drain = (spec.drain ?? {}) as { fromLeftMm?: unknown; fromBackMm?: unknown }
  const left = num(drain.fromLeftMm) ?? num(spec.drainFromLeftMm)
  const back = num(drain.fromBackMm) ?? num(spec.drainFromBackMm)
  if (left === null && back === null) return null
  const at = (mm: number | null) => (mm === null ? '?' : len(mm))
  return `drain ${at(left)} from left, ${at(back)} from back`
}

const KNOWN = new Set(['widthMm', 'depthMm', 'curb', 'curbless', 'drain', 'drainFromLeftMm', 'drainFromBackMm', 'entry', 'note'])

/**
 * "48 in × 36 in (width × depth); straight curb; drain 24 in from left, 18 in from back; entry left" in inches
 * (to the sixteenth), or the same in millimetres to a tenth. Never shortened: the whole specification.
 */
export function specText(spec: Spec | null | undefined, unit: LengthUnit = 'in'): string | null {
  if (!spec || typeof spec !== 'object') return null
  const len = (mm: number) => formatLength(mm, unit, { style: 'words' })
  const parts: string[] = []
  const width = num(spec.widthMm)
  const depth = num(spec.depthMm)
  if (width !== null && depth !== null) parts.push(`${formatSize([width, depth], unit, { style: 'words' })} (width × depth)`)
  const curb = curbText(spec, len)
  if (curb) parts.push(curb)
  const drain = drainText(spec, len)
  if (drain) parts.push(drain)
  if (typeof spec.entry === 'string') parts.push(`entry ${spec.entry}`)
  for (const [key, value] of Object.entries(spec)) {
    if (KNOWN.has(key)) continue
    // Any other length the takeoff adds (…Mm) is a length too, written like the rest.
    if (key.endsWith('Mm') && num(value) !== null) parts.push(`${key.slice(0, -2)} ${len(value as number)}`)
    else if (typeof value === 'string' || typeof value === 'number') parts.push(`${key} ${value}`)
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
