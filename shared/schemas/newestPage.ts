import { z } from 'zod'
import { idSchema } from './stock.js'

// A document list read newest first, a page at a time: at most `limit` rows, and the next page asked for by the
// last id shown (`beforeId`), so a page never repeats or skips a row written while the list is open. A list of
// 20,000 quotes opens on its newest page instead of sending (and drawing) all of them.
export const NEWEST_PAGE_MAX = 500

export const newestPageQuery = {
  limit: z.coerce.number().int().min(1).max(NEWEST_PAGE_MAX).default(NEWEST_PAGE_MAX),
  beforeId: idSchema.optional(),
}

export interface NewestPage {
  limit: number
  beforeId?: number
}
