// Four invented vendors and what each sells the demo supplier.
import type { Vendor } from '../entities/Vendor.js'
import type { DemoItem } from './demoItemTypes.js'
import { MoneyDecimal } from '../../shared/money.js'

export const DEMO_VENDORS: Partial<Vendor>[] = [
  { code: 'LARK', name: 'Larkspur Glassworks', contactName: 'Ines Harrow', email: 'orders@larkspur-glass.example', phone: '+1 555 0142',
    address: '17 Furnace Row, Glenmere', terms: 'Net 60', leadTimeDays: 28 },
  { code: 'OSTR', name: 'Ostrander Block & Tile Distributors', contactName: 'Calvin Osei', email: 'sales@ostrander-bt.example', phone: '+1 555 0177',
    address: '410 Depot Street, Ridgeway Falls', terms: 'Net 30', leadTimeDays: 10 },
  { code: 'NGMS', name: 'Northgate Masonry Supply', contactName: 'Rhea Castellanos', email: 'counter@northgate-masonry.example', phone: '+1 555 0193',
    address: '2 Quarry Close, Northgate', terms: 'Net 30', leadTimeDays: 7 },
  { code: 'PELL', name: 'Pell & Daughters Fastener Co.', contactName: 'June Pell', email: 'june@pell-fasteners.example', phone: '+1 555 0108',
    address: '95 Tinsmith Lane, Port Alder', terms: '2% 10, Net 30', leadTimeDays: 5 },
]

export interface DemoVendorItem {
  vendorCode: string
  sku: string
  vendorSku: string
  packQty: number
  minOrderQty: number
  unitCost: string
  leadTimeDays: number | null
  preferred: boolean
}

const scaled = (cost: string, factor: string) => new MoneyDecimal(cost).times(factor).toDecimalPlaces(4).toFixed(4)

function sourcesFor(d: DemoItem): { vendor: string; factor: string; lead: number | null }[] {
  switch (d.row.family) {
    case 'glass_block':
      return [{ vendor: 'LARK', factor: '1', lead: 28 }, { vendor: 'OSTR', factor: '1.08', lead: 10 }]
    case 'wall_section':
    case 'shower_base':
      return [{ vendor: 'OSTR', factor: '1', lead: 14 }]
    case 'spacer':
    case 'arc_spacer':
    case 'grout':
    case 'anchor':
      return [{ vendor: 'NGMS', factor: '1', lead: null }, { vendor: 'PELL', factor: '1.06', lead: null }]
    default:
      return [{ vendor: 'PELL', factor: '1', lead: null }, { vendor: 'NGMS', factor: '1.05', lead: null }]
  }
}

/** Every stocked item has a preferred vendor; most have a second, dearer source. */
export function demoVendorItems(items: readonly DemoItem[]): DemoVendorItem[] {
  const out: DemoVendorItem[] = []
  items.forEach((d, i) => {
    const sources = sourcesFor(d)
    sources.forEach((s, rank) => {
      if (rank > 0 && i % 4 === 3) return // some items have a single source
      const pack = d.row.caseQty ?? 1
      const isBlock = d.row.family === 'glass_block'
      out.push({
        vendorCode: s.vendor,
        sku: d.row.sku,
        vendorSku: `${s.vendor.slice(0, 2)}-${d.row.sku.replaceAll('-', '')}`.slice(0, 40),
        packQty: pack,
        minOrderQty: isBlock && rank === 0 ? pack * 10 : pack,
        unitCost: scaled(d.row.cost, s.factor),
        leadTimeDays: s.lead,
        preferred: rank === 0,
      })
    })
  })
  return out
}
