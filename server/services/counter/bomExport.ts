// A saved bill as a workbook through the one writer (exports/xlsxWriter.ts): the lines (quantities stay
// numbers), each line's explanation, the cautions and the job, each sheet printable on its own.
import type { BomLineRecord, BomRecord } from '../../../shared/schemas/counter.js'
import type { Caution } from '../../../shared/takeoff/cautions.js'
import { buildXlsx, fieldsSheet, sheet, wallClockIn } from '../exports/xlsxWriter.js'

const explained = (l: BomLineRecord) => l.explanation !== null

/** The bill as a workbook; times (when it was saved) are written as wall-clock time in `zone`. */
export async function bomWorkbook(bom: BomRecord, zone = 'UTC'): Promise<Buffer> {
  const doc = `${bom.job.customerCode} ${bom.job.name}, revision ${bom.revision}`
  return buildXlsx(
    sheet<BomLineRecord>({
      name: 'Bill of materials',
      title: `Bill of materials: ${doc}`,
      rows: bom.lines,
      columns: [
        { header: 'Line', kind: 'integer', value: (l) => l.lineNo },
        { header: 'SKU', kind: 'text', value: (l) => l.sku },
        { header: 'Description', kind: 'text', width: 48, value: (l) => l.description },
        { header: 'Quantity', kind: 'integer', value: (l) => l.qty },
        { header: 'Unit', kind: 'text', value: (l) => l.unit },
        { header: 'Made to order', kind: 'boolean', value: (l) => l.madeToOrder },
        { header: 'Exact need', kind: 'decimal', value: (l) => (l.explanation ? Number(l.explanation.needed.toFixed(3)) : null) },
        { header: 'Walls', kind: 'text', width: 28, value: (l) => (l.explanation?.walls ?? []).join(', ') },
      ],
    }),
    sheet<BomLineRecord>({
      name: 'Explanations',
      title: `Explanations: ${doc}`,
      rows: bom.lines.filter(explained),
      columns: [
        { header: 'Line', kind: 'integer', value: (l) => l.lineNo },
        { header: 'Rule', kind: 'text', width: 40, value: (l) => l.explanation!.rule },
        { header: 'Inputs', kind: 'text', width: 36, value: (l) => Object.entries(l.explanation!.inputs).map(([k, v]) => `${k} = ${v}`).join('; ') },
        { header: 'Formula', kind: 'text', width: 46, value: (l) => l.explanation!.formula },
        { header: 'Rounding', kind: 'text', width: 36, value: (l) => l.explanation!.rounding },
      ],
    }),
    sheet<Caution>({
      name: 'Cautions',
      title: `Cautions: ${doc}`,
      rows: bom.cautions,
      columns: [
        { header: 'Level', kind: 'text', value: (c) => c.level },
        { header: 'Code section', kind: 'text', width: 20, value: (c) => c.code },
        { header: 'Wall', kind: 'text', width: 20, value: (c) => c.wall },
        { header: 'Caution', kind: 'text', width: 80, value: (c) => c.message },
      ],
    }),
    fieldsSheet({
      name: 'Job',
      title: `Job: ${doc}`,
      fields: [
        { label: 'Customer', kind: 'text', value: `${bom.job.customerCode} ${bom.job.customerName}` },
        { label: 'Job', kind: 'text', value: bom.job.name },
        { label: 'Site', kind: 'text', value: bom.job.siteAddress },
        { label: 'Takeoff', kind: 'text', value: bom.takeoffName },
        { label: 'Revision', kind: 'integer', value: bom.revision },
        { label: 'Saved', kind: 'datetime', value: wallClockIn(zone)(new Date(bom.createdAt)) },
        { label: 'Saved by', kind: 'text', value: bom.createdBy },
        { label: 'Time zone', kind: 'text', value: zone },
      ],
    }),
  )
}

export function bomFileName(bom: BomRecord): string {
  const safe = `${bom.job.customerCode}-${bom.job.name}`.replace(/[^A-Za-z0-9-]+/g, '-').replace(/-+/g, '-').slice(0, 60)
  return `bill-${safe}-rev${bom.revision}.xlsx`
}
