// Who may review a counted line: an admin, or a person holding a role the admin chose, and never the
// person who counted that line (a count is checked by someone else).
import type { Role } from '../roles.js'
import type { CountLineStatus } from './countTerms.js'

/** Roles an admin may allow to review counts besides admin itself. */
export const COUNT_REVIEWER_CHOICES = ['warehouse', 'buyer'] as const
export type CountReviewerChoice = (typeof COUNT_REVIEWER_CHOICES)[number]

export type ReviewRefusal = 'count_reviewer_role' | 'count_self_approval' | 'count_line_not_counted'

export function mayReview(roles: readonly Role[], reviewerRoles: readonly CountReviewerChoice[]): boolean {
  return roles.includes('admin') || roles.some((r) => (reviewerRoles as readonly Role[]).includes(r))
}

/**
 * Why this person may not decide this line, or null. Approving and asking for a recount are both reviews;
 * only approving your own count is refused (asking for your own line to be counted again is harmless).
 */
export function reviewRefusal(
  reviewer: { userId: number; roles: readonly Role[] },
  reviewerRoles: readonly CountReviewerChoice[],
  line: { status: CountLineStatus; countedBy: number | null },
  action: 'approve' | 'recount',
): ReviewRefusal | null {
  if (!mayReview(reviewer.roles, reviewerRoles)) return 'count_reviewer_role'
  if (line.status !== 'counted') return 'count_line_not_counted'
  if (action === 'approve' && line.countedBy === reviewer.userId) return 'count_self_approval'
  return null
}
