// The answers' schemas for the interfaces in shared/schemas/today.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import { TODAY_FIGURES, TODAY_PANELS } from '../today.js'
import { withheldCost } from './terms.js'
import type { TodayPanelName, TodayFigureName, TodayFigure, TodayPanel, TodayAnswer } from '../today.js'

const todayPanelNameShape = z.enum(TODAY_PANELS) satisfies z.ZodType<TodayPanelName>

const todayFigureNameShape = z.enum(TODAY_FIGURES) satisfies z.ZodType<TodayFigureName>

const todayFigureShape = z.object({
  name: todayFigureNameShape,
  count: z.number().optional(),
  stockValue: withheldCost(z.string()),
  spendValue: withheldCost(z.string()),
  accuracy: z.number().optional().nullable(),
  warehouseCode: z.string().optional(),
  query: z.record(z.string(), z.string())
}) satisfies z.ZodType<TodayFigure>

const todayPanelShape = z.object({
  panel: todayPanelNameShape,
  figures: z.array(todayFigureShape)
}) satisfies z.ZodType<TodayPanel>

export const todayAnswerShape = z.object({
  day: z.string(),
  panels: z.array(todayPanelShape)
}) satisfies z.ZodType<TodayAnswer>
