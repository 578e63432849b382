// Barcodes drawn by bwip-js in the browser as SVG, shown as image data (no markup injected into the page).
import { toSVG } from 'bwip-js/browser'
import type { LabelPayload } from '@shared/barcode/scan'

const asDataUrl = (svg: string) => `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`

/** Code 128 or GS1-128 from one of our label payloads, with a 10-module quiet zone each side (ISO/IEC 15417, from memory); the text line is printed by the label itself. */
export function linearBarcode(payload: LabelPayload, barHeightMm: number): string {
  return asDataUrl(toSVG({ ...payload.bwip, height: barHeightMm, scale: 2, includetext: false, paddingwidth: 10, paddingheight: 0 }))
}

/** QR code with the symbology's default error correction (level M in BWIPP). */
export function qrCode(text: string): string {
  return asDataUrl(toSVG({ bcid: 'qrcode', text, scale: 3, paddingwidth: 2, paddingheight: 2 }))
}
