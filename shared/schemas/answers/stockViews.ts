// The answers' schemas for the interfaces in shared/schemas/stockViews.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { LotPlace, LotLevel, TransferLineView, TransferView, MinimumRow, LotOption, StockLevelRow, StockLevelsAnswer, BinContentLine, BinContents, BinContentsAnswer, LotLevelsAnswer, LedgerRow, LedgerPage, PlaceBin, ItemOption, LookupAnswer } from '../stockViews.js'
import { binKindShape, codedRefShape, moveTypeShape, stockUnitShape, withheldCost } from './terms.js'

const lotPlaceShape = z.object({
  warehouseId: z.number(),
  warehouseCode: z.string(),
  binId: z.number(),
  binCode: z.string(),
  inTransit: z.boolean(),
  onHand: z.number(),
  reserved: z.number()
}) satisfies z.ZodType<LotPlace>

const lotLevelShape = z.object({
  lotId: z.number().nullable(),
  lotCode: z.string().nullable(),
  receivedAt: z.string().nullable(),
  tintNote: z.string().nullable(),
  onHand: z.number(),
  reserved: z.number(),
  places: z.array(lotPlaceShape)
}) satisfies z.ZodType<LotLevel>

const transferLineViewShape = z.object({
  id: z.number(),
  itemId: z.number(),
  sku: z.string(),
  itemName: z.string(),
  lotId: z.number().nullable(),
  lotCode: z.string().nullable(),
  fromBinId: z.number(),
  fromBinCode: z.string(),
  qty: z.number(),
  receivedQty: z.number()
}) satisfies z.ZodType<TransferLineView>

export const transferViewShape = z.object({
  id: z.number(),
  status: z.union([z.literal('in_transit'), z.literal('received'), z.literal('cancelled')]),
  fromWarehouseId: z.number(),
  fromWarehouseCode: z.string(),
  toWarehouseId: z.number(),
  toWarehouseCode: z.string(),
  note: z.string().nullable(),
  shippedAt: z.string(),
  shippedBy: z.string().nullable(),
  receivedAt: z.string().nullable(),
  receivedBy: z.string().nullable(),
  lines: z.array(transferLineViewShape)
}) satisfies z.ZodType<TransferView>

export const minimumRowShape = z.object({
  itemId: z.number(),
  sku: z.string(),
  warehouseId: z.number(),
  warehouseCode: z.string(),
  minQty: z.number().nullable()
}) satisfies z.ZodType<MinimumRow>

const lotOptionShape = z.object({
  id: z.number(),
  code: z.string(),
  itemId: z.number()
}) satisfies z.ZodType<LotOption>

const stockLevelRowShape = z.object({
  itemId: z.number(),
  sku: z.string(),
  name: z.string(),
  family: z.string(),
  stockUnit: stockUnitShape,
  warehouseId: z.number(),
  warehouseCode: z.string(),
  onHand: z.number(),
  reserved: z.number(),
  available: z.number(),
  inTransit: z.number(),
  minQty: z.number().nullable(),
  low: z.boolean()
}) satisfies z.ZodType<StockLevelRow>

export const stockLevelsAnswerShape = z.object({
  rows: z.array(stockLevelRowShape),
  truncated: z.boolean()
}) satisfies z.ZodType<StockLevelsAnswer>

const binContentLineShape = z.object({
  itemId: z.number(),
  sku: z.string(),
  name: z.string(),
  stockUnit: stockUnitShape,
  lotId: z.number().nullable(),
  lotCode: z.string().nullable(),
  onHand: z.number(),
  reserved: z.number()
}) satisfies z.ZodType<BinContentLine>

const binContentsShape = z.object({
  binId: z.number(),
  code: z.string(),
  kind: binKindShape,
  active: z.boolean(),
  lines: z.array(binContentLineShape)
}) satisfies z.ZodType<BinContents>

export const binContentsAnswerShape = z.object({
  warehouse: codedRefShape,
  bins: z.array(binContentsShape)
}) satisfies z.ZodType<BinContentsAnswer>

export const lotLevelsAnswerShape = z.object({
  item: z.object({
    id: z.number(),
    sku: z.string(),
    name: z.string(),
    stockUnit: stockUnitShape
  }),
  lots: z.array(lotLevelShape)
}) satisfies z.ZodType<LotLevelsAnswer>

const ledgerRowShape = z.object({
  id: z.string(),
  at: z.string(),
  moveType: moveTypeShape,
  itemId: z.number(),
  sku: z.string(),
  itemName: z.string(),
  stockUnit: stockUnitShape,
  warehouseId: z.number(),
  warehouseCode: z.string(),
  binId: z.number(),
  binCode: z.string(),
  lotId: z.number().nullable(),
  lotCode: z.string().nullable(),
  qty: z.number(),
  unitCost: withheldCost(z.string().nullable()),
  docType: z.string().nullable(),
  docId: z.number().nullable(),
  docRef: z.string().nullable(),
  docLineId: z.number().nullable(),
  reason: z.string().nullable(),
  note: z.string().nullable(),
  batchId: z.string(),
  userName: z.string().nullable()
}) satisfies z.ZodType<LedgerRow>

export const ledgerPageShape = z.object({
  rows: z.array(ledgerRowShape),
  total: z.number(),
  page: z.number(),
  pageSize: z.number()
}) satisfies z.ZodType<LedgerPage>

const placeBinShape = z.object({
  id: z.number(),
  code: z.string(),
  kind: binKindShape,
  active: z.boolean()
}) satisfies z.ZodType<PlaceBin>

export const itemOptionShape = z.object({
  id: z.number(),
  sku: z.string(),
  name: z.string(),
  stockUnit: stockUnitShape,
  gtin: z.string().nullable(),
  matchLot: z.boolean()
}) satisfies z.ZodType<ItemOption>

export const lookupAnswerShape = z.object({
  item: itemOptionShape.nullable(),
  lot: lotOptionShape.nullable(),
  bin: placeBinShape.and(z.object({
    warehouseId: z.number(),
    warehouseCode: z.string()
  })).nullable()
}) satisfies z.ZodType<LookupAnswer>
