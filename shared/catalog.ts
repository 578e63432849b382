// The trade's catalog vocabulary: item families, stock units, block attributes.
export const ITEM_FAMILIES = [
  'glass_block',
  'spacer',
  'arc_spacer',
  'sealant',
  'grout',
  'anchor',
  'fastener',
  'shower_base',
  'wall_section',
  'accessory',
] as const
export type ItemFamily = (typeof ITEM_FAMILIES)[number]

export const STOCK_UNITS = ['each', 'tube', 'bag', 'piece', 'foot'] as const
export type StockUnit = (typeof STOCK_UNITS)[number]

export const THICKNESS_CLASSES = ['standard', 'thin'] as const
export type ThicknessClass = (typeof THICKNESS_CLASSES)[number]

/** Our own descriptive pattern names. */
export const BLOCK_PATTERNS = ['clear', 'frosted', 'wavy', 'rippled', 'fluted', 'dimpled', 'prism', 'tinted'] as const
export const BLOCK_SHAPES = ['square', 'rectangle', 'end_finish', 'double_end_finish', 'corner', 'angle_45'] as const
export type BlockShape = (typeof BLOCK_SHAPES)[number]

/** Nominal face sizes the yard stocks (inch sizes are nominal; actual = nominal − 1/4 in, common practice). */
export const NOMINAL_SIZES = ['6x6', '8x8', '4x8', '6x8', '12x12', '190x190', '240x240', '190x90', '115x115'] as const

/** Adjustment reasons: every adjustment names one. */
export const ADJUSTMENT_REASONS = ['damaged', 'found', 'counted', 'written_off'] as const
export type AdjustmentReason = (typeof ADJUSTMENT_REASONS)[number]

/** Kinds of ledger move. On-hand changes only through these. */
export const MOVE_TYPES = [
  'receipt',
  'issue',
  'pick',
  'adjustment',
  'count',
  'bin_move',
  'transfer_out',
  'transfer_in',
  'assembly',
  'return',
  // Stock a business already held when it started on Lumenyard, brought in from its own sheets.
  'opening',
] as const
export type MoveType = (typeof MOVE_TYPES)[number]

export const BIN_KINDS = ['storage', 'receiving', 'staging', 'transit'] as const
export type BinKind = (typeof BIN_KINDS)[number]
