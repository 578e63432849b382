// A glass block's actual face from its nominal size. Inch sizes are nominal, the block plus its
// joint: actual = nominal − 1/4 in (common practice). Metric sizes name the actual face (190x190).
import { MM_PER_INCH } from './units.js'

/** Nominal sizes above this many units are millimetres; below, inches. */
const METRIC_THRESHOLD = 50

export interface BlockFace {
  widthMm: number
  heightMm: number
  metric: boolean
}

/**
 * "8x8", "4x8" or "190x90"; null when the text is not a size. Rectangular units are taken lying in
 * the course, so the longer side is the width (4x8 and 8x4 are the same unit).
 */
export function actualFaceFromNominal(nominal: string): BlockFace | null {
  const m = /^\s*(\d+(?:\.\d+)?)\s*[x×]\s*(\d+(?:\.\d+)?)\s*$/i.exec(nominal)
  if (!m) return null
  const [a, b] = [Number(m[1]), Number(m[2])]
  const [height, width] = [Math.min(a, b), Math.max(a, b)]
  const metric = height >= METRIC_THRESHOLD || width >= METRIC_THRESHOLD
  const actual = (n: number) => (metric ? n : (n - 0.25) * MM_PER_INCH)
  return { widthMm: actual(width), heightMm: actual(height), metric }
}
