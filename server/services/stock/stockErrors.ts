import { AppError } from '../../errors.js'

export interface Described {
  sku: string
  binCode: string
  lotCode: string | null
}

const where = (d: Described) => `${d.sku} in bin ${d.binCode}${d.lotCode ? ` (lot ${d.lotCode})` : ''}`

export function notEnoughOnHand(d: Described, onHand: number, wanted: number): AppError {
  return AppError.conflict(`Only ${onHand} of ${where(d)} on hand; ${wanted} cannot be taken.`, 'insufficient_stock')
}

export function notEnoughAvailable(d: Described, onHand: number, reserved: number, wanted: number): AppError {
  const available = onHand - reserved
  return AppError.conflict(
    `Only ${available} of ${where(d)} available (${onHand} on hand, ${reserved} reserved for pick lists); ${wanted} cannot be taken.`,
    'insufficient_stock',
  )
}
