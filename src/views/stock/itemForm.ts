// The item form's state: every field as the inputs hold it (text, so a field can be blank), and the
// conversions to and from the API's item record.
import type { ItemRecordView } from '@shared/schemas/catalog'

export interface ItemFormState {
  sku: string
  name: string
  family: string
  stockUnit: string
  caseQty: string
  palletQty: string
  sellByPack: boolean
  gtin: string
  weightKg: string
  cost: string
  listPrice: string
  active: boolean
  madeToOrder: boolean
  matchLot: boolean
  nominalSize: string
  faceWidthMm: string
  faceHeightMm: string
  depthMm: string
  thicknessClass: string
  pattern: string
  shape: string
  cartridgeMl: string
  groutYieldMl: string
  jointMm: string
  description: string
}

export function blankItemForm(): ItemFormState {
  return {
    sku: '', name: '', family: 'glass_block', stockUnit: 'each', caseQty: '', palletQty: '', sellByPack: false, gtin: '',
    weightKg: '', cost: '', listPrice: '', active: true, madeToOrder: false, matchLot: true, nominalSize: '', faceWidthMm: '',
    faceHeightMm: '', depthMm: '', thicknessClass: '', pattern: '', shape: '', cartridgeMl: '', groutYieldMl: '', jointMm: '', description: '',
  }
}

const text = (v: string | number | null | undefined) => (v === null || v === undefined ? '' : String(v))

export function formFromRecord(r: ItemRecordView): ItemFormState {
  const form = blankItemForm()
  for (const key of Object.keys(form) as (keyof ItemFormState)[]) {
    const value = r[key as keyof ItemRecordView]
    ;(form as unknown as Record<string, unknown>)[key] = typeof form[key] === 'boolean' ? Boolean(value) : text(value as string | number | null)
  }
  return form
}
