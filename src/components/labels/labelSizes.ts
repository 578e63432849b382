// Label stock Lumenyard prints on: a letter sheet of 30 and three roll sizes. Dimensions in inches,
// as label stock is sold (common practice; the 30-up sheet layout is from memory: 0.5 in top and
// bottom margin, 3/16 in side margins, 1/8 in between columns).

export type LabelSizeKey = 'sheet30' | 'small' | 'medium' | 'large'

export interface LabelSize {
  key: LabelSizeKey
  widthIn: number
  heightIn: number
  /** Left and right padding inside the label. */
  paddingIn: number
  /** A sheet of several labels per page, or one label per page (rolls). */
  sheet?: { pageWidthIn: number; pageHeightIn: number; columns: number; rows: number; marginTopIn: number; marginLeftIn: number; gapXIn: number; gapYIn: number }
  /** Bar height in mm for linear symbols on this size. */
  barHeightMm: number
  /** Largest X-dimension of the linear symbol, in 300 dpi dots (see BarcodeSymbol). */
  maxDots: number
  /** Whether a QR Code fits, its room (quiet zone included) and its largest X-dimension in dots. */
  roomForQr: boolean
  qrMm: number
  qrMaxDots: number
}

export const LABEL_SIZES: Record<LabelSizeKey, LabelSize> = {
  sheet30: {
    key: 'sheet30', widthIn: 2.625, heightIn: 1, paddingIn: 0.1, barHeightMm: 7, maxDots: 4, roomForQr: false, qrMm: 0, qrMaxDots: 0,
    sheet: { pageWidthIn: 8.5, pageHeightIn: 11, columns: 3, rows: 10, marginTopIn: 0.5, marginLeftIn: 0.1875, gapXIn: 0.125, gapYIn: 0 },
  },
  small: { key: 'small', widthIn: 2, heightIn: 1, paddingIn: 0.06, barHeightMm: 7, maxDots: 4, roomForQr: false, qrMm: 0, qrMaxDots: 0 },
  medium: { key: 'medium', widthIn: 4, heightIn: 2, paddingIn: 0.1, barHeightMm: 14, maxDots: 4, roomForQr: true, qrMm: 16, qrMaxDots: 5 },
  large: { key: 'large', widthIn: 4, heightIn: 6, paddingIn: 0.25, barHeightMm: 25, maxDots: 5, roomForQr: true, qrMm: 40, qrMaxDots: 10 },
}

/** The @page rule for a size: exact paper, no margins (the sheet lays out its own). */
export function pageRule(size: LabelSize): string {
  const page = size.sheet ? `${size.sheet.pageWidthIn}in ${size.sheet.pageHeightIn}in` : `${size.widthIn}in ${size.heightIn}in`
  return `@page { size: ${page}; margin: 0; }`
}
