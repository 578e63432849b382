import type { ShowerBase } from '@shared/schemas/takeoff'
import { formatLength, type LengthUnit } from '@shared/units'

type Translate = (key: string, values?: Record<string, unknown>) => string

/** The made-to-order base's spec in one line, lengths in the reader's unit. */
export function showerBaseText(base: ShowerBase, unit: LengthUnit, t: Translate): string {
  const len = (mm: number) => formatLength(mm, unit)
  const curb = base.curbless
    ? t('counter.curbless')
    : base.curb
      ? t('counter.specCurved', { r: len(base.curb.radiusMm), deg: base.curb.arcDeg })
      : t('counter.specStraight')
  return t('counter.specLine', {
    width: len(base.widthMm),
    depth: len(base.depthMm),
    left: len(base.drain.fromLeftMm),
    back: len(base.drain.fromBackMm),
    entry: t(`counter.${base.entry === 'center' ? 'center' : base.entry}`).toLowerCase(),
    curb,
  }) + (base.note ? ` · ${base.note}` : '')
}
