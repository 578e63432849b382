// The answers' schemas for the interfaces in shared/schemas/picking.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import { PICK_LIST_STATUSES, PICK_MODES, SHORTAGE_ACTIONS, SHORT_REASONS, SHORT_RESOLUTIONS } from '../picking.js'
import type { PickListStatus, ShortReason, ShortageAction, PickMode, ShortResolution, Person, StatusStep, ShortageView, TransferProposalView, ConfirmationView, PickListSummary, PickConfirmAnswer, PickShortResolveAnswer, PickDiscardAnswer, PlannedLine, PlannedList, PlannedShortage, PickPlan, WalkWarehouse, BomForPicking, PickLineView, PickListDetail } from '../picking.js'
import { codedRefShape, handlingCautionShape } from './terms.js'

export const pickListStatusShape = z.enum(PICK_LIST_STATUSES) satisfies z.ZodType<PickListStatus>

const shortReasonShape = z.enum(SHORT_REASONS) satisfies z.ZodType<ShortReason>

const shortageActionShape = z.enum(SHORTAGE_ACTIONS) satisfies z.ZodType<ShortageAction>

const pickModeShape = z.enum(PICK_MODES) satisfies z.ZodType<PickMode>

const shortResolutionShape = z.enum(SHORT_RESOLUTIONS) satisfies z.ZodType<ShortResolution>

const personShape = z.object({
  id: z.number(),
  name: z.string()
}) satisfies z.ZodType<Person>

const statusStepShape = z.object({
  status: pickListStatusShape,
  by: personShape.nullable(),
  at: z.string()
}) satisfies z.ZodType<StatusStep>

const shortageViewShape = z.object({
  id: z.number(),
  bomLineId: z.number().nullable(),
  sku: z.string(),
  description: z.string(),
  qty: z.number(),
  action: shortageActionShape,
  detail: z.string().nullable()
}) satisfies z.ZodType<ShortageView>

const transferProposalViewShape = z.object({
  id: z.number(),
  fromWarehouse: codedRefShape,
  sku: z.string(),
  binCode: z.string(),
  lotCode: z.string().nullable(),
  qty: z.number(),
  status: z.union([z.literal('proposed'), z.literal('shipped'), z.literal('cancelled')]),
  transferId: z.number().nullable()
}) satisfies z.ZodType<TransferProposalView>

const confirmationViewShape = z.object({
  id: z.number(),
  lineId: z.number(),
  qty: z.number(),
  shortQty: z.number(),
  shortReason: shortReasonShape.nullable(),
  by: personShape.nullable(),
  at: z.string(),
  issued: z.boolean()
}) satisfies z.ZodType<ConfirmationView>

export const pickListSummaryShape = z.object({
  id: z.number(),
  number: z.string(),
  status: pickListStatusShape,
  bomId: z.number().nullable(),
  bomRevision: z.number().nullable(),
  jobId: z.number().nullable(),
  jobName: z.string(),
  salesOrderId: z.number().nullable(),
  salesOrderNumber: z.string().nullable(),
  customerName: z.string(),
  warehouse: codedRefShape,
  lineCount: z.number(),
  lineStates: z.object({
    total: z.number(),
    done: z.number(),
    short: z.number(),
    resolved: z.number(),
    left: z.number()
  }),
  qty: z.number(),
  confirmedQty: z.number(),
  shortQty: z.number(),
  issuedQty: z.number(),
  transfersWaiting: z.array(z.object({
    fromWarehouseId: z.number(),
    qty: z.number()
  })),
  createdAt: z.string(),
  updatedAt: z.string()
}) satisfies z.ZodType<PickListSummary>

export const pickConfirmAnswerShape = z.object({
  confirmationId: z.number(),
  lineId: z.number(),
  confirmedQty: z.number(),
  shortQty: z.number(),
  remaining: z.number(),
  listStatus: z.string(),
  replayed: z.boolean()
}) satisfies z.ZodType<PickConfirmAnswer>

export const pickShortResolveAnswerShape = z.object({
  lineId: z.number(),
  action: shortResolutionShape,
  qty: z.number(),
  shortQty: z.number(),
  shortResolvedQty: z.number(),
  remaining: z.number(),
  addedLineIds: z.array(z.number())
}) satisfies z.ZodType<PickShortResolveAnswer>

export const pickDiscardAnswerShape = z.union([z.object({
    discarded: z.literal(true)
  }), z.object({
    discarded: z.literal(false),
    recorded: pickConfirmAnswerShape
  })]) satisfies z.ZodType<PickDiscardAnswer>

const plannedLineShape = z.object({
  bomLineId: z.number(),
  itemId: z.number(),
  sku: z.string(),
  itemName: z.string(),
  binCode: z.string(),
  lotCode: z.string().nullable(),
  qty: z.number()
}) satisfies z.ZodType<PlannedLine>

const plannedListShape = z.object({
  warehouse: codedRefShape,
  lines: z.array(plannedLineShape)
}) satisfies z.ZodType<PlannedList>

const plannedShortageShape = z.object({
  bomLineId: z.number(),
  itemId: z.number(),
  sku: z.string(),
  description: z.string(),
  requested: z.number(),
  shortage: z.number(),
  elsewhere: z.array(z.object({
    warehouseId: z.number(),
    code: z.string(),
    name: z.string(),
    available: z.number()
  })),
  substitutes: z.array(z.object({
    itemId: z.number(),
    sku: z.string(),
    name: z.string(),
    available: z.number()
  })),
  backordered: z.number()
}) satisfies z.ZodType<PlannedShortage>

export const pickPlanShape = z.object({
  bom: z.object({
    id: z.number(),
    revision: z.number(),
    jobId: z.number(),
    jobName: z.string(),
    customerName: z.string()
  }),
  mode: pickModeShape,
  lists: z.array(plannedListShape),
  shortages: z.array(plannedShortageShape),
  notPicked: z.array(z.object({
    bomLineId: z.number(),
    description: z.string(),
    qty: z.number(),
    reason: z.union([z.literal('made_to_order'), z.literal('no_item'), z.literal('done')])
  })),
  explanation: z.array(z.object({
    bomLineId: z.number(),
    lines: z.array(z.string())
  }))
}) satisfies z.ZodType<PickPlan>

export const walkWarehouseShape = z.object({
  id: z.number(),
  code: z.string(),
  name: z.string(),
  binPattern: z.string(),
  aisleOrder: z.array(z.string()),
  walkDirection: z.union([z.literal('serpentine'), z.literal('oneWay')]),
  aisles: z.array(z.string()),
  sampleBins: z.array(z.string()),
  openPickLists: z.number()
}) satisfies z.ZodType<WalkWarehouse>

export const bomForPickingShape = z.object({
  bomId: z.number(),
  revision: z.number(),
  jobId: z.number(),
  jobName: z.string(),
  customerName: z.string(),
  createdAt: z.string(),
  lines: z.number(),
  qty: z.number(),
  pickedQty: z.number(),
  openQty: z.number()
}) satisfies z.ZodType<BomForPicking>

const pickLineViewShape = z.object({
  id: z.number(),
  bomLineId: z.number(),
  itemId: z.number(),
  sku: z.string(),
  itemName: z.string(),
  gtin: z.string().nullable(),
  family: z.string(),
  stockUnit: z.string(),
  weightKg: z.string(),
  caseQty: z.number().nullable(),
  palletQty: z.number().nullable(),
  binId: z.number(),
  binCode: z.string(),
  lotId: z.number().nullable(),
  lotCode: z.string().nullable(),
  qty: z.number(),
  confirmedQty: z.number(),
  shortQty: z.number(),
  shortReasons: z.array(shortReasonShape),
  shortResolvedQty: z.number(),
  shortResolutions: z.array(z.object({
    action: z.union([z.literal('backorder'), z.literal('substitute')]),
    qty: z.number(),
    sku: z.string().nullable()
  })),
  remaining: z.number(),
  issuedQty: z.number(),
  substituteFor: z.object({
    sku: z.string(),
    name: z.string()
  }).nullable(),
  cautions: z.array(handlingCautionShape)
}) satisfies z.ZodType<PickLineView>

export const pickListDetailShape = pickListSummaryShape.extend({
  note: z.string().nullable(),
  lines: z.array(pickLineViewShape),
  history: z.array(statusStepShape),
  shortages: z.array(shortageViewShape),
  transfers: z.array(transferProposalViewShape),
  confirmations: z.array(confirmationViewShape),
  walk: z.object({
    direction: z.union([z.literal('serpentine'), z.literal('oneWay')]),
    aisleOrder: z.array(z.string())
  })
}) satisfies z.ZodType<PickListDetail>
