// Spreadsheet downloads keep no time zone: the screen sends the reader's (IANA name) and the server writes
// each time as the wall-clock time there.
import { z } from 'zod'
import { issueCode } from '../errors/zodProblems.js'

export function isTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone })
    return true
  } catch {
    return false
  }
}

/** `tz`: an IANA time zone; UTC when absent. */
export const timeZoneParam = z.preprocess(
  (v: unknown) => (v === '' || v === null ? undefined : v),
  z.string().max(64).refine((zone) => isTimeZone(zone), issueCode('time_zone_unknown')).default('UTC'),
)

/** The query of a download that writes times. */
export const exportQuerySchema = z.object({ tz: timeZoneParam })
