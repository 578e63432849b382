import { AppError } from '../../errors.js'

export interface Described {
  sku: string
  binCode: string
  lotCode: string | null
}

const where = (d: Described) => `${d.sku} in bin ${d.binCode}${d.lotCode ? ` (lot ${d.lotCode})` : ''}`

export function notEnoughOnHand(d: Described, onHand: number, wanted: number): AppError {
  return AppError.conflict('insufficient_stock', `Only ${onHand} of ${where(d)} on hand; ${wanted} cannot be taken.`, {
    params: { sku: d.sku, bin: d.binCode, available: onHand, wanted },
  })
}

export function notEnoughAvailable(d: Described, onHand: number, reserved: number, wanted: number): AppError {
  const available = onHand - reserved
  return AppError.conflict(
    'insufficient_stock',
    `Only ${available} of ${where(d)} available (${onHand} on hand, ${reserved} reserved for pick lists); ${wanted} cannot be taken.`,
    { params: { sku: d.sku, bin: d.binCode, available: Math.max(0, available), wanted } },
  )
}
