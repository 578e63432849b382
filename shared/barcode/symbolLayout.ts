// How a barcode is laid on paper: the module width (X-dimension) it is printed at, its quiet zones and its
// exact size in millimetres, drawn from the symbol's modules. Pure: the modules come from bwip-js.
//
// Every printed symbol keeps:
// - an X-dimension of at least 0.25 mm, the smallest in any of GS1's symbol specification tables (GS1 General
//   Specifications, section 5.12.3, from memory), chosen as whole printer dots (multiples of 1/300 in, so 300
//   and 600 dpi printers lay every bar down alike) and larger where there is room;
// - its quiet zones inside the drawing, so no border or text can come nearer than they allow: 10 modules
//   each side of Code 128 and GS1-128 (ISO/IEC 15417 and GS1 General Specifications section 5.4, from memory),
//   4 modules around a QR Code (ISO/IEC 18004, from memory).

export const MIN_MODULE_MM = 0.25
/** One dot of a 300 dpi printer. */
export const DOT_MM = 25.4 / 300
export const QUIET_ZONE_MODULES = { linear: 10, qr: 4 } as const

export type SymbolModules =
  /** Bar and space widths in modules, starting with a bar (bwip-js `sbs`). */
  | { kind: 'linear'; widths: readonly number[] }
  /** A square matrix, row by row, 1 for a dark module (bwip-js `pixs`). */
  | { kind: 'qr'; size: number; dark: readonly number[] }

export interface PrintedSymbol {
  /** The X-dimension it is printed at. */
  moduleMm: number
  widthMm: number
  heightMm: number
  /** The drawing in module units, quiet zones included: viewBox 0 0 across tall, dark modules as one path. */
  across: number
  tall: number
  path: string
}

const round = (n: number) => Math.round(n * 10_000) / 10_000

/** Modules across the symbol, quiet zones included. */
export function modulesAcross(m: SymbolModules): number {
  return m.kind === 'linear'
    ? m.widths.reduce((a, b) => a + b, 0) + 2 * QUIET_ZONE_MODULES.linear
    : m.size + 2 * QUIET_ZONE_MODULES.qr
}

/**
 * The widest X-dimension, in whole 300 dpi dots (3 dots = 0.254 mm up to `maxDots`), at which the symbol fits
 * `maxWidthMm`; null when even the smallest readable one does not fit.
 */
export function chooseModuleMm(modules: number, maxWidthMm: number, maxDots = 4): number | null {
  const minDots = Math.ceil(MIN_MODULE_MM / DOT_MM - 1e-9)
  for (let dots = maxDots; dots >= minDots; dots--) if (modules * dots * DOT_MM <= maxWidthMm + 1e-9) return dots * DOT_MM
  return null
}

/** Linear bars `barHeightMm` tall (a QR Code is square); null when the symbol cannot fit `maxWidthMm` readably. */
export function layOut(m: SymbolModules, opts: { maxWidthMm: number; barHeightMm?: number; maxDots?: number }): PrintedSymbol | null {
  const across = modulesAcross(m)
  const x = chooseModuleMm(across, opts.maxWidthMm, opts.maxDots)
  if (x === null) return null
  const q = m.kind === 'linear' ? QUIET_ZONE_MODULES.linear : QUIET_ZONE_MODULES.qr
  let path = ''
  let tall: number
  if (m.kind === 'linear') {
    tall = round((opts.barHeightMm ?? 10) / x)
    let at = q
    m.widths.forEach((w, i) => {
      if (i % 2 === 0) path += `M${at} 0h${w}v${tall}h-${w}z`
      at += w
    })
  } else {
    tall = across
    for (let y = 0; y < m.size; y++) {
      for (let x0 = 0; x0 < m.size; x0++) {
        if (!m.dark[y * m.size + x0] || (x0 > 0 && m.dark[y * m.size + x0 - 1])) continue
        let run = 1
        while (x0 + run < m.size && m.dark[y * m.size + x0 + run]) run++
        path += `M${x0 + q} ${y + q}h${run}v1h-${run}z`
      }
    }
  }
  return { moduleMm: round(x), widthMm: round(across * x), heightMm: round(tall * x), across, tall, path }
}
