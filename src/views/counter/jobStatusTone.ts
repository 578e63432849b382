import type { JobStatusName } from '@shared/schemas/counter'

/** Tag tone per job status: open work stands out, finished work recedes. */
export function statusTone(status: JobStatusName): 'primary' | 'success' | 'warning' | 'info' | 'danger' {
  return ({ open: 'primary', ordered: 'warning', picking: 'warning', complete: 'success', cancelled: 'info' } as const)[status]
}
