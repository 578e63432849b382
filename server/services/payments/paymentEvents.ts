// The provider's signed events, handled once each. The route has already checked the signature
// (payProvider.verifyEvent); here the event's id is written to payment_events in the same transaction as
// whatever the event changes, so a replay or a retry of the same event finds its row and changes nothing.
import type { DataSource, EntityManager } from 'typeorm'
import { fromMinorUnits } from '../../../shared/payments/minorUnits.js'
import { inTransaction } from '../../db/transaction.js'
import type { ProviderEvent } from './payProvider.js'

/** Handles one kind of event inside the recording transaction; answers the outcome word stored with it. */
export type ProviderEventHandler = (em: EntityManager, event: ProviderEvent) => Promise<string>

export interface EventReceipt {
  eventId: string
  type: string
  /** True when this event id was received before: nothing was done again. */
  duplicate: boolean
  outcome: string
}

interface ObjectFacts {
  id: string | null
  amount: string | null
  currency: string | null
  status: string | null
}

function factsOf(event: ProviderEvent): ObjectFacts {
  const obj = event.data.object as unknown as Record<string, unknown>
  const currency = typeof obj.currency === 'string' && /^[a-z]{3}$/.test(obj.currency) ? obj.currency : null
  const minor = typeof obj.amount_received === 'number' && obj.amount_received > 0 ? obj.amount_received : obj.amount
  return {
    id: typeof obj.id === 'string' ? obj.id.slice(0, 255) : null,
    amount: currency && typeof minor === 'number' && Number.isSafeInteger(minor) ? fromMinorUnits(minor, currency) : null,
    currency,
    status: typeof obj.status === 'string' ? obj.status.slice(0, 40) : null,
  }
}

export async function receiveProviderEvent(
  ds: DataSource,
  event: ProviderEvent,
  handlers: Partial<Record<string, ProviderEventHandler>> = {},
): Promise<EventReceipt> {
  const facts = factsOf(event)
  return inTransaction(ds, async (em) => {
    // Inserted (1 row) the first time; the second time the unique key turns it into a count of deliveries (2).
    const res: { affectedRows: number } = await em.query(
      `INSERT INTO payment_events (provider_event_id, type, object_id, amount, currency, object_status, provider_created_at)
       VALUES (?, ?, ?, ?, ?, ?, FROM_UNIXTIME(?))
       ON DUPLICATE KEY UPDATE deliveries = deliveries + 1`,
      [event.id.slice(0, 255), event.type.slice(0, 100), facts.id, facts.amount, facts.currency, facts.status, event.created],
    )
    if (res.affectedRows !== 1) {
      const [row] = (await em.query('SELECT outcome FROM payment_events WHERE provider_event_id = ?', [event.id])) as { outcome: string }[]
      return { eventId: event.id, type: event.type, duplicate: true, outcome: row?.outcome ?? 'noted' }
    }
    const handler = handlers[event.type]
    const outcome = handler ? await handler(em, event) : 'noted'
    if (outcome !== 'noted') await em.query('UPDATE payment_events SET outcome = ? WHERE provider_event_id = ?', [outcome.slice(0, 40), event.id])
    return { eventId: event.id, type: event.type, duplicate: false, outcome }
  })
}
