// The purchase order's life: draft → approved → sent → partly_received → received → closed, or
// cancelled before anything arrives. Each action names the statuses it may start from.
import type { PoStatus } from '../schemas/purchasing.js'

export type PoAction = 'edit' | 'approve' | 'send' | 'resend' | 'receive' | 'close' | 'cancel'

const FROM: Readonly<Record<PoAction, readonly PoStatus[]>> = {
  edit: ['draft'],
  approve: ['draft'],
  send: ['approved'],
  // Sending again (a corrected copy, a failed first try that was marked sent by hand) keeps the status.
  resend: ['sent', 'partly_received'],
  receive: ['sent', 'partly_received'],
  // A buyer closes short (the rest will not come) or closes a received order after checking it.
  close: ['sent', 'partly_received', 'received'],
  cancel: ['draft', 'approved', 'sent'],
}

export function canDo(action: PoAction, status: PoStatus): boolean {
  return FROM[action].includes(status)
}

/** The statuses an action may start from. */
export function allowedFrom(action: PoAction): PoStatus[] {
  return [...FROM[action]]
}

/** Why an action is refused, in English for the log; null when allowed. */
export function refusal(action: PoAction, status: PoStatus): string | null {
  if (canDo(action, status)) return null
  const allowed = FROM[action].map(words)
  const list = allowed.length > 1 ? `${allowed.slice(0, -1).join(', ')} or ${allowed.at(-1)}` : allowed[0]
  return `${article(words(status))} ${words(status)} purchase order cannot be ${VERB[action]}; only ${list} ones can.`
}

const words = (status: PoStatus) => status.replace('_', ' ')
/** "An approved", "A sent": the article goes by the sound of the next word (all our statuses start as spelled). */
const article = (word: string) => (/^[aeiou]/i.test(word) ? 'An' : 'A')

const VERB: Readonly<Record<PoAction, string>> = {
  edit: 'changed',
  approve: 'approved',
  send: 'sent',
  resend: 'sent again',
  receive: 'received',
  close: 'closed',
  cancel: 'cancelled',
}

/** Status after a receipt: received when every line has all it ordered, else partly received. */
export function statusAfterReceipt(lines: readonly { qtyOrdered: number; qtyReceived: number }[]): 'partly_received' | 'received' {
  return lines.every((l) => l.qtyReceived >= l.qtyOrdered) ? 'received' : 'partly_received'
}
