// Every action the server may record is worded in both languages on the audit trail, and has a kind.
import { describe, expect, it } from 'vitest'
import { actionKey, AUDIT_ACTIONS, AUDIT_KINDS, auditKindOf } from '../../shared/audit/auditKinds.js'
import { auditWordsEn } from '../../shared/audit/auditWordsEn.js'
import { auditWordsEs } from '../../shared/audit/auditWordsEs.js'

describe('audit trail words', () => {
  it('word every recorded action in English and Spanish', () => {
    const missing = Object.keys(AUDIT_ACTIONS).flatMap((a) =>
      [auditWordsEn, auditWordsEs].filter((w) => !(actionKey(a) in w.actions)).map((w) => `${a} (${w === auditWordsEn ? 'en' : 'es'})`))
    expect(missing).toEqual([])
  })

  it('file every action under one of the kinds the page filters by', () => {
    for (const a of Object.keys(AUDIT_ACTIONS)) expect(AUDIT_KINDS).toContain(auditKindOf(a))
    expect(auditKindOf('something.recorded_long_ago')).toBe('records')
  })
})
