// Reads a barcode back out of a PNG with ZXing, the general-purpose decoder, as an independent check of what we print.
// @zxing/library ships CommonJS, so Node's ESM loader exposes it whole as the default export.
import ZXing from '@zxing/library'
import { PNG } from 'pngjs'

const GS = '\u001d'

export type DecodeFormat = 'code128' | 'qrcode' | 'ean13'

const FORMATS: Record<DecodeFormat, ZXing.BarcodeFormat> = {
  code128: ZXing.BarcodeFormat.CODE_128,
  qrcode: ZXing.BarcodeFormat.QR_CODE,
  ean13: ZXing.BarcodeFormat.EAN_13,
}

/** Grey levels of the image composited over white, framed by a white quiet zone (bwip-js draws none by default). */
function luminance(png: Buffer, quietZone: number): { pixels: Uint8ClampedArray; width: number; height: number } {
  const image = PNG.sync.read(png)
  const width = image.width + 2 * quietZone
  const height = image.height + 2 * quietZone
  const pixels = new Uint8ClampedArray(width * height).fill(255)
  for (let y = 0; y < image.height; y++) {
    for (let x = 0; x < image.width; x++) {
      const i = (y * image.width + x) * 4
      const alpha = image.data[i + 3] / 255
      // ITU-R BT.601 luma weights, then alpha over a white background (bwip-js leaves the background transparent).
      const grey = 0.299 * image.data[i] + 0.587 * image.data[i + 1] + 0.114 * image.data[i + 2]
      pixels[(y + quietZone) * width + x + quietZone] = grey * alpha + 255 * (1 - alpha)
    }
  }
  return { pixels, width, height }
}

/**
 * The decoded text. ASSUME_GS1 makes ZXing report GS1 data as a scanner with symbology identifiers would:
 * "]C1" for a leading FNC1 and GS (ASCII 29) for every later one.
 */
export function decodePng(png: Buffer, format: DecodeFormat, quietZone = 40): string {
  const { pixels, width, height } = luminance(png, quietZone)
  const bitmap = new ZXing.BinaryBitmap(new ZXing.HybridBinarizer(new ZXing.RGBLuminanceSource(pixels, width, height)))
  const hints = new Map<ZXing.DecodeHintType, unknown>([
    [ZXing.DecodeHintType.POSSIBLE_FORMATS, [FORMATS[format]]],
    [ZXing.DecodeHintType.TRY_HARDER, true],
    [ZXing.DecodeHintType.ASSUME_GS1, true],
  ])
  const result = new ZXing.MultiFormatReader().decode(bitmap, hints)
  if (result.getBarcodeFormat() !== FORMATS[format]) throw new Error(`expected ${format}, decoded ${ZXing.BarcodeFormat[result.getBarcodeFormat()]}`)
  const text = result.getText()
  // @zxing/library 0.23 reports a Code 128 check symbol whose value is 102 (FNC1's) as one more trailing GS; bwip-js's
  // codewords for such a label (decoded from bwipjs.raw's bar widths) end "... 102 <stop>" with no data FNC1 there, so drop it.
  return format === 'code128' && text.startsWith(']C1') && text.endsWith(GS) ? text.slice(0, -1) : text
}
