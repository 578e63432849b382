// Requests that change stock. The server parses with these; the client's forms validate with them.
import { z } from 'zod'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import { ADJUSTMENT_REASONS } from '../catalog.js'

/** The most units one stock change may carry. */
const MAX_UNITS = 1_000_000

/**
 * A record's id. On a form it is always picked from a list (a bin, an item, a warehouse), so every way of
 * getting it wrong, nothing picked included, reads "choose one of the options", not a rule about numbers.
 */
const choose = issueCode('invalid_choice')
export const idSchema = z.coerce.number(choose).int(choose).positive(choose)
export const lotIdSchema = z.union([idSchema, z.null()]).default(null)
export const qtySchema = z.coerce
  .number()
  .int()
  .positive()
  .max(MAX_UNITS)
const noteSchema = z.string().trim().max(200).optional().nullable()
const costSchema = z
  .string()
  .trim()
  .regex(/^\d{1,8}(\.\d{1,4})?$/, issueCode('cost_format'))

export const adjustmentSchema = z
  .object({
    itemId: idSchema,
    binId: idSchema,
    lotId: lotIdSchema,
    delta: z.coerce.number().int()
      .refine((v) => v !== 0, issueCode('not_zero'))
      .refine((v) => Math.abs(v) <= MAX_UNITS, issueOf('change_too_large', { max: MAX_UNITS })),
    reason: z.enum(ADJUSTMENT_REASONS),
    note: noteSchema,
  })
  .refine((v) => !(v.reason === 'found' && v.delta < 0), { path: ['delta'], ...issueOf('found_adds_units') })
  .refine((v) => !((v.reason === 'damaged' || v.reason === 'written_off') && v.delta > 0), {
    path: ['delta'],
    ...issueOf('loss_removes_units'),
  })
export type AdjustmentInput = z.infer<typeof adjustmentSchema>

export const binMoveSchema = z.object({
  itemId: idSchema,
  lotId: lotIdSchema,
  fromBinId: idSchema,
  toBinId: idSchema,
  qty: qtySchema,
  note: noteSchema,
})
export type BinMoveInput = z.infer<typeof binMoveSchema>

export const issueSchema = z.object({
  lines: z.array(z.object({ itemId: idSchema, binId: idSchema, lotId: lotIdSchema, qty: qtySchema })).min(1).max(500),
  reason: z.string().trim().max(20).optional().nullable(),
  note: noteSchema,
})

export const receiptSchema = z.object({
  warehouseId: idSchema,
  lines: z
    .array(
      z.object({
        itemId: idSchema,
        binId: idSchema,
        lotId: lotIdSchema.optional(),
        lotCode: z.string().trim().min(1).max(20).regex(/^[A-Za-z0-9._/-]+$/, issueCode('lot_code_chars')).optional().nullable(),
        qty: qtySchema,
        unitCost: costSchema,
      }),
    )
    .min(1)
    .max(500),
  note: noteSchema,
})

export const transferShipSchema = z.object({
  fromWarehouseId: idSchema,
  toWarehouseId: idSchema,
  lines: z.array(z.object({ itemId: idSchema, lotId: lotIdSchema, fromBinId: idSchema, qty: qtySchema })).min(1).max(500),
  note: noteSchema,
})
export type TransferShipInput = z.infer<typeof transferShipSchema>

export const transferReceiveSchema = z.object({
  lines: z.array(z.object({ lineId: idSchema, toBinId: idSchema, qty: qtySchema })).min(1).max(500),
})
export type TransferReceiveInput = z.infer<typeof transferReceiveSchema>
