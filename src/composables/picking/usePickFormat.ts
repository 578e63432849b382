// How pick lines read on screen and paper: packs (pallets, cases, loose), weights in the person's
// unit and handling cautions.
import { useI18n } from 'vue-i18n'
import { Decimal } from 'decimal.js'
import { lineHandling, type HandlingCaution } from '@shared/picking/handling'
import type { PickLineView } from '@shared/schemas/picking'
import { useStockQty } from '@/composables/useStockQty'

export function usePickFormat() {
  const { t } = useI18n()
  const units = useStockQty()

  const handling = (line: PickLineView, qty = line.qty) =>
    lineHandling({ qty, weightKg: line.weightKg, caseQty: line.caseQty, palletQty: line.palletQty, family: line.family })

  function packsText(line: PickLineView, qty = line.qty): string {
    const { packs } = handling(line, qty)
    const parts: string[] = []
    if (packs.pallets) parts.push(t('picking.packs.pallets', { n: packs.pallets }, packs.pallets))
    if (packs.cases) parts.push(t('picking.packs.cases', { n: packs.cases }, packs.cases))
    if (packs.each) parts.push(t('picking.packs.each', { n: packs.each }))
    return parts.length ? parts.join(' + ') : t('picking.packs.none')
  }

  /** The whole line's weight, from the unit weight (not from a rounded total). */
  const lineKg = (line: PickLineView, qty = line.qty) => new Decimal(line.weightKg || '0').times(qty)

  function cautionText(line: PickLineView, caution: HandlingCaution, qty = line.qty): string {
    const weight = caution === 'team_lift' ? units.weightText(handling(line, qty).heaviestLiftKg) : units.weightText(lineKg(line, qty))
    return t(`picking.caution.${caution}`, { weight })
  }

  const weightText = (line: PickLineView, qty = line.qty) => units.weightText(lineKg(line, qty))

  /** How a short line was settled: "6 backordered, 2 substituted by GB8-…". */
  const settledText = (line: PickLineView) =>
    line.shortResolutions.map((r) => t(`picking.resolve.settled.${r.action}`, { qty: units.qtyText(r.qty, line.stockUnit), sku: r.sku ?? '' })).join(', ')

  return { handling, packsText, cautionText, weightText, lineKg, settledText }
}
