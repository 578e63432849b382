// The first-run checklist of a new installation: the steps a supplier takes to go live, each done or
// left, and the two small settings the checklist asks for itself (units, GS1 company prefix).
import { z } from 'zod'
import { issueCode } from '../errors/zodProblems.js'

export const SETUP_STEPS = ['company', 'units', 'warehouses', 'gs1', 'items', 'opening_stock', 'vendors', 'accounts', 'purchase_orders', 'usage_history'] as const
export type SetupStep = (typeof SETUP_STEPS)[number]

export interface SetupState {
  /** The checklist opens by itself: a production installation whose administrators have not dismissed it. */
  show: boolean
  dismissed: boolean
  steps: { key: SetupStep; done: boolean; figures?: Record<string, number | string | null> }[]
}

export const setupUnitsSchema = z.object({
  lengthUnit: z.enum(['in', 'mm']),
  weightUnit: z.enum(['lb', 'kg']),
}).strict()
export type SetupUnitsInput = z.infer<typeof setupUnitsSchema>

/**
 * A GS1 Company Prefix is 4 to 12 digits (GS1 General Specifications, "GS1 Company Prefix"; the section
 * number from memory). null: the supplier has none (its items carry the makers' GTINs).
 */
export const setupGs1Schema = z.object({
  prefix: z.string().trim().regex(/^\d{4,12}$/, issueCode('gs1_prefix_digits')).nullable(),
}).strict()
export type SetupGs1Input = z.infer<typeof setupGs1Schema>

/** The checklist as the server answers it (checked by the client in development and tests). */
export const setupStateSchema: z.ZodType<SetupState> = z.object({
  show: z.boolean(),
  dismissed: z.boolean(),
  steps: z.array(z.object({
    key: z.enum(SETUP_STEPS),
    done: z.boolean(),
    figures: z.record(z.string(), z.union([z.number(), z.string(), z.null()])).optional(),
  })),
})
