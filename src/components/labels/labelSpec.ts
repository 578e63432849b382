import type { LabelPayload } from '@shared/barcode/scan'

/** One label to print: the barcode payload (or why there is none) and the text around it. */
export interface LabelSpec {
  key: string
  payload: LabelPayload | null
  /** Why no barcode could be made (an invalid code), shown instead of bars. */
  problem: string | null
  title: string
  lines: string[]
  /** Whether the label may carry a QR Code too: it holds the same data as the bars, for camera scanners. */
  qr: boolean
}
