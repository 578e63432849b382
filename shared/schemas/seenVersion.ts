import { z } from 'zod'

/**
 * The record's version as the edit screen loaded it. Every save of an edit screen carries it: a save made on an
 * older version is refused (409 changed_meanwhile) instead of writing over a change made meanwhile in another tab
 * or by another person.
 */
export const seenVersionSchema = z.number().int().positive()
