// Typed call for the start page's panels (what needs doing today, per role).
import type { TodayAnswer } from '@shared/schemas/today'
import { api } from './client'
import { toQuery } from './stock'

export const todayApi = {
  panels: (tz: string) => api.get<TodayAnswer>(`/today${toQuery({ tz })}`),
}
