// A quote's life, in our own words: written as a draft, offered to the contractor (e-mailed or handed
// over), then taken (accepted: it becomes a sales order), lost (with the reason) or lapsed (its validity
// date passed). A new revision replaces the one it was made from, which is kept as it was.
export const QUOTE_STATUSES = ['draft', 'offered', 'taken', 'lapsed', 'lost', 'replaced'] as const
export type QuoteStatus = (typeof QUOTE_STATUSES)[number]
export type QuoteAction = 'edit' | 'offer' | 'take' | 'lose' | 'revise'

const ALLOWED: Record<QuoteAction, readonly QuoteStatus[]> = {
  edit: ['draft'],
  offer: ['draft', 'offered'],
  take: ['offered'],
  lose: ['draft', 'offered', 'lapsed'],
  revise: ['offered', 'lapsed', 'lost'],
}

/** The status a reader sees: an open quote past its validity date has lapsed (ISO days compare as text). */
export function quoteStatusOn(stored: QuoteStatus, validUntil: string, today: string): QuoteStatus {
  return (stored === 'draft' || stored === 'offered') && validUntil < today ? 'lapsed' : stored
}

export function canQuote(action: QuoteAction, status: QuoteStatus): boolean {
  return ALLOWED[action].includes(status)
}
