// How pick lines read on screen and paper: packs (pallets, cases, loose), weights and cautions.
import { useI18n } from 'vue-i18n'
import { lineHandling, type HandlingCaution } from '@shared/picking/handling'
import type { PickLineView } from '@shared/schemas/picking'

export function usePickFormat() {
  const { t } = useI18n()

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

  function cautionText(line: PickLineView, caution: HandlingCaution, qty = line.qty): string {
    const h = handling(line, qty)
    return t(`picking.caution.${caution}`, { kg: caution === 'team_lift' ? h.heaviestLiftKg : h.totalKg })
  }

  // Light lines (spacers) round to 0.0 kg: say "under 0.1 kg" rather than nothing.
  const weightText = (line: PickLineView, qty = line.qty) => {
    const kg = handling(line, qty).totalKg
    return kg === '0.0' && qty > 0 && Number(line.weightKg) > 0 ? '< 0.1 kg' : `${kg} kg`
  }

  return { handling, packsText, cautionText, weightText }
}
