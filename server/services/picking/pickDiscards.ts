// A confirmation the handheld held but will not send (the server refused it, or the picker made it by
// mistake): dropping it from the device is recorded on the audit trail with who, why and what it
// said. If the server has that confirmation already (its answer was lost on the way back), nothing is
// dropped: the answer comes back instead, so the device can show it as recorded.
import type { EntityManager } from 'typeorm'
import type { PickDiscardAnswer, PickDiscardInput } from '../../../shared/schemas/picking.js'
import { PickConfirmation, PickListLine } from '../../entities/PickList.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { confirmationAnswer } from './pickConfirmations.js'
import { lockPickList } from './pickListLocks.js'

export async function discardConfirmation(em: EntityManager, actor: AuditActor, pickListId: number, input: PickDiscardInput): Promise<PickDiscardAnswer> {
  // The list lock orders this after any confirmation of the same list still being recorded.
  const list = await lockPickList(em, pickListId)
  const line = await em.findOneBy(PickListLine, { id: input.lineId, pickListId })
  if (!line) throw AppError.badRequest('line_not_on_list', 'That line is not on this pick list.', { fields: { lineId: problem('line_not_on_list') } })
  const earlier = await em.findOneBy(PickConfirmation, { clientKey: input.clientKey })
  if (earlier) {
    if (earlier.pickListId !== pickListId) throw AppError.unprocessable('idempotency_key_reused', 'This confirmation key belongs to another pick list.')
    const recordedLine = await em.findOneByOrFail(PickListLine, { id: earlier.lineId })
    return { discarded: false, recorded: confirmationAnswer(earlier, recordedLine, list.status, true) }
  }
  await audit(em, actor, 'pick_confirmation.discard', 'pick_list', pickListId, {
    clientKey: input.clientKey, lineId: line.id, itemId: line.itemId, binId: line.binId, lotId: line.lotId, qty: input.qty,
    shortReason: input.shortReason ?? null, refusedCode: input.refusedCode ?? null, reason: input.reason, note: input.note ?? null,
  })
  return { discarded: true }
}
