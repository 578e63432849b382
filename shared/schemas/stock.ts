// Requests that change stock. The server parses with these; the client's forms validate with them.
import { z } from 'zod'
import { ADJUSTMENT_REASONS } from '../catalog.js'

export const idSchema = z.coerce.number({ error: 'Choose one' }).int('Choose one').positive('Choose one')
export const lotIdSchema = z.union([idSchema, z.null()]).default(null)
export const qtySchema = z.coerce
  .number({ error: 'Enter a quantity' })
  .int('Whole units only')
  .positive('More than zero')
  .max(1_000_000, 'That is more than a million units')
const noteSchema = z.string().trim().max(200, 'At most 200 characters').optional().nullable()
const costSchema = z
  .string()
  .trim()
  .regex(/^\d{1,8}(\.\d{1,4})?$/, 'A cost like 12.50 (up to 4 decimals)')

export const adjustmentSchema = z
  .object({
    itemId: idSchema,
    binId: idSchema,
    lotId: lotIdSchema,
    delta: z.coerce.number({ error: 'Enter a change' }).int('Whole units only')
      .refine((v) => v !== 0, { message: 'Not zero', params: { code: 'no_change' } })
      .refine((v) => Math.abs(v) <= 1_000_000, { message: 'Too large', params: { code: 'too_large' } }),
    reason: z.enum(ADJUSTMENT_REASONS, { error: 'Choose a reason' }),
    note: noteSchema,
  })
  .refine((v) => !(v.reason === 'found' && v.delta < 0), { path: ['delta'], message: 'Found stock adds units', params: { code: 'found_adds' } })
  .refine((v) => !((v.reason === 'damaged' || v.reason === 'written_off') && v.delta > 0), {
    path: ['delta'],
    message: 'Damaged or written-off stock removes units',
    params: { code: 'removal_takes' },
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
  lines: z.array(z.object({ itemId: idSchema, binId: idSchema, lotId: lotIdSchema, qty: qtySchema })).min(1, 'Add at least one line').max(500),
  reason: z.string().trim().max(20).optional().nullable(),
  note: noteSchema,
})
export type IssueInput = z.infer<typeof issueSchema>

export const receiptSchema = z.object({
  warehouseId: idSchema,
  lines: z
    .array(
      z.object({
        itemId: idSchema,
        binId: idSchema,
        lotId: lotIdSchema.optional(),
        lotCode: z.string().trim().min(1).max(20).regex(/^[A-Za-z0-9._/-]+$/, 'Letters, digits and . _ / - only').optional().nullable(),
        qty: qtySchema,
        unitCost: costSchema,
      }),
    )
    .min(1, 'Add at least one line')
    .max(500),
  note: noteSchema,
})
export type ReceiptInput = z.infer<typeof receiptSchema>

export const transferShipSchema = z.object({
  fromWarehouseId: idSchema,
  toWarehouseId: idSchema,
  lines: z.array(z.object({ itemId: idSchema, lotId: lotIdSchema, fromBinId: idSchema, qty: qtySchema })).min(1, 'Add at least one line').max(500),
  note: noteSchema,
})
export type TransferShipInput = z.infer<typeof transferShipSchema>

export const transferReceiveSchema = z.object({
  lines: z.array(z.object({ lineId: idSchema, toBinId: idSchema, qty: qtySchema })).min(1, 'Add at least one line').max(500),
})
export type TransferReceiveInput = z.infer<typeof transferReceiveSchema>
