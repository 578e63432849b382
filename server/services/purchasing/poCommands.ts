// What the purchase-order routes ask for, each in its one transaction, answering the records as they are now:
// an order made or changed answers its detail, a suggestion changed answers the accepted list.
import type { DataSource, EntityManager } from 'typeorm'
import type { PoFromJobInput, PoFromSuggestionsInput, PoManualInput, SuggestionUpdateInput } from '../../../shared/schemas/purchasing.js'
import { inTransaction } from '../../db/transaction.js'
import type { AuditActor } from '../auditService.js'
import { createFromJob } from './jobPurchasing.js'
import { createFromSuggestions, createManual } from './poCreation.js'
import { poDetail } from './poRead.js'
import { acceptedSuggestions } from './suggestionsRead.js'
import { dismissSuggestion, updateSuggestion } from './suggestionEdits.js'

const details = (ds: DataSource, ids: number[]) => Promise.all(ids.map((id) => poDetail(ds, id)))

/** A status change or edit of one order in one transaction; answers the order as it is now. */
export async function changeOrder(ds: DataSource, id: number, work: (em: EntityManager, id: number) => Promise<void>) {
  await inTransaction(ds, (em) => work(em, id))
  return poDetail(ds, id)
}

export const createOrder = async (ds: DataSource, actor: AuditActor, input: PoManualInput) =>
  poDetail(ds, await inTransaction(ds, (em) => createManual(em, actor, input)))

export const createOrdersFromSuggestions = async (ds: DataSource, actor: AuditActor, input: PoFromSuggestionsInput) =>
  details(ds, await inTransaction(ds, (em) => createFromSuggestions(em, actor, input)))

export const createOrdersFromJob = async (ds: DataSource, actor: AuditActor, input: PoFromJobInput) =>
  details(ds, await inTransaction(ds, (em) => createFromJob(em, actor, input)))

export async function changeSuggestion(ds: DataSource, actor: AuditActor, id: number, input: SuggestionUpdateInput) {
  await inTransaction(ds, (em) => updateSuggestion(em, actor, id, input))
  return acceptedSuggestions(ds)
}

export async function dismissAcceptedSuggestion(ds: DataSource, actor: AuditActor, id: number) {
  await inTransaction(ds, (em) => dismissSuggestion(em, actor, id))
  return acceptedSuggestions(ds)
}
