// How purchase orders read on screen: status colours and money text (decimal strings, never floats).
import { formatMoney } from '@shared/money'
import type { PoStatus } from '@shared/schemas/purchasing'
import { dateTimeText } from '@/i18n/when'

type Tone = 'info' | 'warning' | 'success' | 'danger' | 'primary'

const TONES: Record<PoStatus, Tone> = {
  draft: 'info',
  approved: 'primary',
  sent: 'warning',
  partly_received: 'warning',
  received: 'success',
  closed: 'success',
  cancelled: 'danger',
}

export const statusTone = (s: PoStatus): Tone => TONES[s]

export function money(amount: string | null | undefined, currency = 'USD'): string {
  if (amount === null || amount === undefined) return '—'
  return formatMoney(amount, { symbol: currency === 'USD' ? '$' : `${currency} ` })
}

/** Unit costs keep their four places. */
export const unitMoney = (amount: string | null | undefined, currency = 'USD') =>
  amount === null || amount === undefined ? '—' : formatMoney(amount, { symbol: currency === 'USD' ? '$' : `${currency} `, decimals: 4 })

/** A draft line as edited on screen, sent back with the order's version. */
export interface LineEdit {
  id: number
  packsOrdered: number
  unitCost?: string
}

export const shortDate = (iso: string | null) => (iso ? iso.slice(0, 10) : '—')
export const dateTime = (iso: string | null) => dateTimeText(iso)
