// Site figures a maker's instructions may set differently from the defaults here; an admin changes them
// under takeoff settings, and every computation (browser and server) reads the same values.
import type { SiteFigures } from '../schemas/takeoff.js'
import { MM_PER_INCH } from '../units.js'

export const DEFAULT_SITE_FIGURES: SiteFigures = {
  // Spacer systems leave the middle of the joint to the spacer; grout fills from each face to it. About
  // 3/8 in a face on a 3 7/8 in unit is the usual fill (common practice, from memory); set the maker's figure.
  groutDepthMm: (3 / 8) * MM_PER_INCH,
  // Panel anchors at most 16 in on centre at jambs and head (IRC 2021 R607.5.2.1, from memory); spacer
  // makers' screws are set to the same spacing unless their instructions say otherwise (common practice).
  fixingSpacingMm: 16 * MM_PER_INCH,
  // More than 1 in left at a jamb or head after whole blocks needs a filler, framing or another size
  // (common practice).
  leftoverWarnMm: 1 * MM_PER_INCH,
  // A made-to-order base within 1/4 in and 1° of the wall it carries fits (common practice).
  baseToleranceMm: MM_PER_INCH / 4,
  baseToleranceDeg: 1,
}

/** Where each default comes from, shown beside it in takeoff settings and in explanations. */
export const SITE_FIGURE_SOURCES: Record<keyof SiteFigures, string> = {
  groutDepthMm: 'common practice (from memory); the spacer maker’s sheet gives the exact fill',
  fixingSpacingMm: 'IRC 2021 R607.5.2.1 for panel anchors (from memory); spacer makers’ instructions for screws',
  leftoverWarnMm: 'common practice',
  baseToleranceMm: 'common practice',
  baseToleranceDeg: 'common practice',
}

/** The figures in force: the admin's where set, else the defaults. */
export function siteFigures(overrides: Partial<SiteFigures> = {}): SiteFigures {
  return { ...DEFAULT_SITE_FIGURES, ...Object.fromEntries(Object.entries(overrides).filter(([, v]) => v !== undefined)) }
}
