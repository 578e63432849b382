// A quantity always with its stock unit ("17 ft", "3 tubos"), and weights in the person's unit
// (pounds or kilograms, from their profile), in their language.
import { computed } from 'vue'
import { useI18n } from 'vue-i18n'
import { Decimal } from 'decimal.js'
import { STOCK_UNITS, type StockUnit } from '@shared/catalog'
import type { SessionUser } from '@shared/schemas/auth'
import { KG_PER_POUND } from '@shared/units'
import { sessionApi } from '@/api/session'
import { useSessionStore } from '@/stores/session'

export type WeightUnit = SessionUser['weightUnit']

export function useStockQty() {
  const { t, n } = useI18n()
  const session = useSessionStore()

  const weightUnit = computed<WeightUnit>({
    get: () => session.user?.weightUnit ?? 'lb',
    set: (next) => {
      if (!session.user || session.user.weightUnit === next) return
      session.replaceUser({ ...session.user, weightUnit: next })
      // The screen follows at once; the profile catches up.
      sessionApi.saveProfile({ weightUnit: next }).catch(() => undefined)
    },
  })

  const isStockUnit = (unit: string): unit is StockUnit => (STOCK_UNITS as readonly string[]).includes(unit)

  function qtyText(qty: number, unit: string): string {
    return isStockUnit(unit) ? t(`units.qty.${unit}`, { n: n(qty) }, qty) : `${n(qty)} ${unit}`
  }

  const unitName = (unit: string) => (isStockUnit(unit) ? t(`units.name.${unit}`) : unit)

  /** kg as the catalog stores them (decimal text), shown to one decimal in the person's unit. */
  function weightText(kg: Decimal.Value): string {
    const unit = weightUnit.value
    const value = unit === 'lb' ? new Decimal(kg).div(KG_PER_POUND) : new Decimal(kg)
    const one = (v: number) => t(`units.weight.${unit}`, { n: n(v, { key: 'decimal', minimumFractionDigits: 1, maximumFractionDigits: 1 }) })
    // A few spacers weigh next to nothing: say so rather than "0.0".
    if (value.greaterThan(0) && value.lessThan(0.05)) return t('units.weight.under', { weight: one(0.1) })
    return one(value.toDecimalPlaces(1).toNumber())
  }

  return { weightUnit, qtyText, unitName, weightText }
}
