// The answers' schemas for the interfaces in shared/schemas/catalog.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import { BLOCK_SHAPES, THICKNESS_CLASSES } from '../../catalog.js'
import type { ItemRecord, ItemRecordView, ItemWarehouseStock, ItemBinStock, ItemVendorSource, ItemDetail, ImportPreviewRow, ImportPreview, ItemPage, LotRow } from '../catalog.js'
import { itemFamilyShape, rowProblemShape, stockUnitShape, withheldCost } from './terms.js'

const text = z.string()
const textOrNull = z.string().nullable()
const itemRecordFields = {
  id: z.number(),
  sku: text,
  name: text,
  family: itemFamilyShape,
  stockUnit: stockUnitShape,
  caseQty: z.number().nullable(),
  palletQty: z.number().nullable(),
  sellByPack: z.boolean(),
  gtin: textOrNull,
  weightKg: text,
  listPrice: text,
  active: z.boolean(),
  madeToOrder: z.boolean(),
  matchLot: z.boolean(),
  nominalSize: textOrNull,
  faceWidthMm: textOrNull,
  faceHeightMm: textOrNull,
  depthMm: textOrNull,
  thicknessClass: z.enum(THICKNESS_CLASSES).nullable(),
  pattern: textOrNull,
  shape: z.enum(BLOCK_SHAPES).nullable(),
  cartridgeMl: textOrNull,
  groutYieldMl: textOrNull,
  jointMm: textOrNull,
  description: textOrNull,
  createdAt: text,
  updatedAt: text,
  version: z.number().int(),
}
export const itemRecordShape = z.object({ ...itemRecordFields, cost: text }) satisfies z.ZodType<ItemRecord>

/** The standard cost is absent for roles that do not see costs. */
export const itemRecordViewShape = z.object({ ...itemRecordFields, cost: withheldCost(text) }) satisfies z.ZodType<ItemRecordView>

const itemWarehouseStockShape = z.object({
  warehouseId: z.number(),
  warehouseCode: z.string(),
  warehouseName: z.string(),
  onHand: z.number(),
  reserved: z.number(),
  avgCost: withheldCost(z.string().nullable()),
  minQty: z.number().nullable()
}) satisfies z.ZodType<ItemWarehouseStock>

const itemBinStockShape = z.object({
  warehouseId: z.number(),
  warehouseCode: z.string(),
  binId: z.number(),
  binCode: z.string(),
  binKind: z.string(),
  lotId: z.number().nullable(),
  lotCode: z.string().nullable(),
  lotReceivedAt: z.string().nullable(),
  tintNote: z.string().nullable(),
  onHand: z.number(),
  reserved: z.number()
}) satisfies z.ZodType<ItemBinStock>

const itemVendorSourceShape = z.object({
  vendorId: z.number(),
  vendorCode: z.string(),
  vendorName: z.string(),
  vendorSku: z.string(),
  packQty: z.number(),
  minOrderQty: z.number(),
  unitCost: withheldCost(z.string()),
  leadTimeDays: z.number().nullable(),
  preferred: z.boolean()
}) satisfies z.ZodType<ItemVendorSource>

export const itemDetailShape = z.object({
  item: itemRecordViewShape,
  warehouses: z.array(itemWarehouseStockShape),
  bins: z.array(itemBinStockShape),
  vendors: z.array(itemVendorSourceShape)
}) satisfies z.ZodType<ItemDetail>

const importPreviewRowShape = z.object({
  row: z.number(),
  sku: z.string().nullable(),
  name: z.string().nullable(),
  action: z.union([z.literal('create'), z.literal('update')]),
  errors: z.array(rowProblemShape)
}) satisfies z.ZodType<ImportPreviewRow>

export const importPreviewShape = z.object({
  filename: z.string(),
  total: z.number(),
  creates: z.number(),
  updates: z.number(),
  errorRows: z.number(),
  rows: z.array(importPreviewRowShape)
}) satisfies z.ZodType<ImportPreview>

/** A row of the item list: the item's own fields the list shows, its stock, and the standard cost (absent for roles that do not see costs). */
const itemListRowShape = z.object(itemRecordFields).pick({
  id: true, sku: true, name: true, family: true, stockUnit: true, nominalSize: true, pattern: true, shape: true, thicknessClass: true,
  gtin: true, caseQty: true, palletQty: true, listPrice: true, active: true, madeToOrder: true, matchLot: true,
}).extend({ cost: withheldCost(text), onHand: z.number(), available: z.number() })

/** Typed as the list's interface (whose family, unit and shape are plain text) rather than the stricter row above. */
export const itemPageShape: z.ZodType<ItemPage> = z.object({
  rows: z.array(itemListRowShape),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
})

export const lotRowShape = z.object({
  id: z.number().int(),
  itemId: z.number().int(),
  code: text,
  receivedAt: text,
  vendorId: z.number().int().nullable(),
  tintNote: textOrNull,
  onHand: z.number(),
}) satisfies z.ZodType<LotRow>
export const lotRowsShape = z.array(lotRowShape)
