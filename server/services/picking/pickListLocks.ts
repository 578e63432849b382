// Every change to a pick list locks its row first, so confirmations, completion and cancelling of
// one list queue up behind each other, always in the same order (list, then its lines).
import type { EntityManager } from 'typeorm'
import type { PickListStatus } from '../../../shared/schemas/picking.js'
import { PickList } from '../../entities/PickList.js'
import { AppError } from '../../errors.js'

export const pickNumber = (id: number) => `PL-${String(id).padStart(5, '0')}`

export async function lockPickList(em: EntityManager, id: number): Promise<PickList> {
  const list = await em.findOne(PickList, { where: { id }, lock: { mode: 'pessimistic_write' } })
  if (!list) throw AppError.notFound('pick_list_not_found', 'That pick list was not found.')
  return list
}

const STATUS_WORDS: Record<PickListStatus, string> = {
  draft: 'still a draft',
  released: 'released',
  picking: 'being picked',
  picked: 'already picked',
  cancelled: 'cancelled',
}

/** What is being done to the list, for the refusal's words. */
export type PickAction = 'release' | 'cancel' | 'pick' | 'complete' | 'settle' | 'ship'
const ACTION_WORDS: Record<PickAction, string> = {
  release: 'released', cancel: 'cancelled', pick: 'picked now', complete: 'completed', settle: 'settled that way', ship: 'shipped to',
}

export function requireStatus(list: PickList, allowed: readonly PickListStatus[], action: PickAction): void {
  if (!allowed.includes(list.status)) {
    const number = pickNumber(list.id)
    throw AppError.conflict('pick_list_status', `Pick list ${number} is ${STATUS_WORDS[list.status]}, so it cannot be ${ACTION_WORDS[action]}.`, {
      params: { number, listStatus: list.status, pickAction: action },
    })
  }
}
