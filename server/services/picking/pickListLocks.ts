// Every change to a pick list locks its row first, so confirmations, completion and cancelling of
// one list queue up behind each other, always in the same order (list, then its lines).
import type { EntityManager } from 'typeorm'
import type { PickListStatus } from '../../../shared/schemas/picking.js'
import { PickList } from '../../entities/PickList.js'
import { AppError } from '../../errors.js'

export const pickNumber = (id: number) => `PL-${String(id).padStart(5, '0')}`

export async function lockPickList(em: EntityManager, id: number): Promise<PickList> {
  const list = await em.findOne(PickList, { where: { id }, lock: { mode: 'pessimistic_write' } })
  if (!list) throw AppError.notFound('That pick list')
  return list
}

const STATUS_WORDS: Record<PickListStatus, string> = {
  draft: 'still a draft',
  released: 'released',
  picking: 'being picked',
  picked: 'already picked',
  cancelled: 'cancelled',
}

export function requireStatus(list: PickList, allowed: readonly PickListStatus[], action: string): void {
  if (!allowed.includes(list.status)) {
    throw AppError.conflict(`Pick list ${pickNumber(list.id)} is ${STATUS_WORDS[list.status]}, so it cannot be ${action}.`, 'wrong_status')
  }
}
