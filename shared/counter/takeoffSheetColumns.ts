// Lumenyard's own takeoff spreadsheet (.xlsx first sheet, or .csv): one row per wall segment, and one
// row per loose item. The blank template, the importer and the help text on the upload screen all read
// this list.

export interface SheetColumn {
  name: string
  /** How the importer types the cell; lengths are text so "7' 2 1/2"" and "2134 mm" both read. */
  kind: 'text' | 'integer' | 'decimal' | 'boolean'
  /** wall: read from a wall's first row; segment: every wall row; item: loose item rows. */
  level: 'wall' | 'segment' | 'item'
  help: string
}

export const TAKEOFF_SHEET = 'Takeoff'
/** More rows than any real takeoff (50 walls × 24 segments, plus items); anything larger is refused. */
export const MAX_SHEET_ROWS = 2_000

export const TAKEOFF_COLUMNS: SheetColumn[] = [
  { name: 'wall', kind: 'text', level: 'segment', help: 'Wall name. Rows with the same name make one wall, its segments in row order.' },
  { name: 'block_sku', kind: 'text', level: 'wall', help: 'SKU of the glass block from the catalog.' },
  { name: 'joint', kind: 'text', level: 'wall', help: 'spacer (the default) or mortar.' },
  { name: 'joint_width', kind: 'text', level: 'wall', help: 'Head and bed joint; 1/8 in for spacers and 1/4 in for mortar unless given.' },
  { name: 'sizing', kind: 'text', level: 'wall', help: 'opening (from the rough opening) or count (from blocks and courses).' },
  { name: 'height', kind: 'text', level: 'wall', help: 'Opening sizing: rough opening height, e.g. 84 in, 7\' 0", 2134 mm.' },
  { name: 'courses', kind: 'integer', level: 'wall', help: 'Count sizing: courses high.' },
  { name: 'segment', kind: 'text', level: 'segment', help: 'straight, curved or corner.' },
  { name: 'length', kind: 'text', level: 'segment', help: 'Straight segment, opening sizing: the opening length.' },
  { name: 'blocks', kind: 'integer', level: 'segment', help: 'Straight segment, count sizing: blocks across. Curved: blocks on the arc.' },
  { name: 'inside_radius', kind: 'text', level: 'segment', help: 'Curved segment: radius of the layout circle through the blocks\' inside corners.' },
  { name: 'arc_angle', kind: 'decimal', level: 'segment', help: 'Curved segment: degrees turned. Give one of arc_angle, arc_length or blocks.' },
  { name: 'arc_length', kind: 'text', level: 'segment', help: 'Curved segment: length along the inside.' },
  { name: 'turn', kind: 'text', level: 'segment', help: 'Curved or corner segment: left or right.' },
  { name: 'free_start', kind: 'boolean', level: 'wall', help: 'yes when the start of the wall stands free (no jamb).' },
  { name: 'free_end', kind: 'boolean', level: 'wall', help: 'yes when the end of the wall stands free.' },
  { name: 'free_top', kind: 'boolean', level: 'wall', help: 'yes when nothing is fixed above the wall.' },
  { name: 'exposure', kind: 'text', level: 'wall', help: 'interior (the default) or exterior.' },
  { name: 'wet_area', kind: 'boolean', level: 'wall', help: 'yes for showers and other wet areas.' },
  { name: 'wind_psf', kind: 'decimal', level: 'wall', help: 'Exterior walls: design wind pressure, psf.' },
  { name: 'item_sku', kind: 'text', level: 'item', help: 'A loose item row (leave wall empty): SKU of a catalog item.' },
  { name: 'quantity', kind: 'integer', level: 'item', help: 'Loose item: whole number in the item\'s stock unit.' },
  { name: 'note', kind: 'text', level: 'item', help: 'Loose item: an optional note.' },
]
