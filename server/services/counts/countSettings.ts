// The admin's count settings, kept in app_settings: which roles besides admin review counts, and how
// many days pass between counts of an A, B or C item (defaults in shared/counts/countFrequency.ts).
import type { DataSource, EntityManager } from 'typeorm'
import { In } from 'typeorm'
import { DEFAULT_COUNT_INTERVALS } from '../../../shared/counts/countFrequency.js'
import { COUNT_REVIEWER_CHOICES, type CountReviewerChoice } from '../../../shared/counts/countReviewRules.js'
import type { CountSettings, CountSettingsInput } from '../../../shared/schemas/counts.js'
import { AppSetting } from '../../entities/AppSetting.js'
import { audit, type AuditActor } from '../auditService.js'

const KEYS = {
  reviewerRoles: 'counts.reviewer_roles',
  A: 'counts.interval_a',
  B: 'counts.interval_b',
  C: 'counts.interval_c',
} as const

export async function countSettings(em: EntityManager | DataSource): Promise<CountSettings> {
  const rows = await em.getRepository(AppSetting).findBy({ key: In(Object.values(KEYS)) })
  const byKey = new Map(rows.map((r) => [r.key, r.value]))
  const days = (c: 'A' | 'B' | 'C') => {
    const n = Number(byKey.get(KEYS[c]))
    return Number.isInteger(n) && n > 0 ? n : DEFAULT_COUNT_INTERVALS[c]
  }
  const roles = (byKey.get(KEYS.reviewerRoles) ?? '').split(',').filter((r): r is CountReviewerChoice => (COUNT_REVIEWER_CHOICES as readonly string[]).includes(r))
  return { reviewerRoles: roles, intervals: { A: days('A'), B: days('B'), C: days('C') } }
}

export async function updateCountSettings(ds: DataSource, actor: AuditActor, input: CountSettingsInput): Promise<CountSettings> {
  return ds.transaction(async (em) => {
    const writes: [string, string][] = []
    if (input.reviewerRoles) writes.push([KEYS.reviewerRoles, [...new Set(input.reviewerRoles)].join(',')])
    if (input.intervals) for (const c of ['A', 'B', 'C'] as const) writes.push([KEYS[c], String(input.intervals[c])])
    for (const [key, value] of writes) {
      await em.query(
        'INSERT INTO app_settings (setting_key, value, updated_by) VALUES (?, ?, ?) ON DUPLICATE KEY UPDATE value = VALUES(value), updated_by = VALUES(updated_by)',
        [key, value, actor.userId],
      )
    }
    await audit(em, actor, 'settings.update', 'app_settings', 'counts', input)
    return countSettings(em)
  })
}
