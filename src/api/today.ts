// Typed call for the start page's panels (what needs doing today, per role).
import { todayAnswerShape } from '@shared/schemas/answers/today'
import { api } from './client'
import { toQuery } from './stock'

export const todayApi = {
  panels: (tz: string) => api.get(`/today${toQuery({ tz })}`, { answer: todayAnswerShape }),
}
