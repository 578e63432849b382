// A handover ticket as a printable PDF, through the same PDF sheet (pdfkit, shipped Open Sans) as purchase
// orders and quotes: what leaves, by bin and lot, with weights, the lifting and handling cautions, and the
// signature drawn on the tablet (or an empty line to sign on paper while it is open).
import type { DataSource } from 'typeorm'
import type { HandlingCaution } from '../../../shared/picking/handling.js'
import type { TicketDetail } from '../../../shared/schemas/handover.js'
import { companyLogo, companyProfile } from '../companyProfile.js'
import { INK, MARGIN, openPdfSheet, pdfFacts, pdfTable, SOFT, type PdfColumn } from '../exports/pdfSheet.js'
import { ticketDetail, ticketSignature } from './handoverRead.js'

export { PDF_TYPE } from '../exports/pdfSheet.js'

const CAUTION_WORDS: Record<HandlingCaution, string> = {
  team_lift: 'two-person lift',
  use_cart: 'use a cart',
  pallet_equipment: 'pallet: forklift or pallet jack',
  glass_edges: 'glass edges: wear cut-resistant gloves',
}

/** Printed on every ticket; lifting advice follows the NIOSH lifting equation's 23 kg load constant. */
export const HANDOVER_CAUTIONS =
  'Glass block and pre-made sections are heavy: anything over 23 kg is lifted by two people or with equipment, and loads are strapped for the road. ' +
  'Follow your own safe-handling practice; installation must follow local building codes and licensed professional practice.'

export async function ticketPdfFile(ds: DataSource, id: number): Promise<{ name: string; bytes: Buffer }> {
  const ticket = await ticketDetail(ds, id)
  const signature = ticket.hasSignature ? await ticketSignature(ds, id) : null
  const company = await companyProfile(ds)
  return { name: `${ticket.number}.pdf`, bytes: await ticketPdf(ticket, company.legalName, signature, await companyLogo(ds)) }
}

export function ticketPdf(ticket: TicketDetail, companyName: string, signature: Buffer | null, logo?: Parameters<typeof openPdfSheet>[2]): Promise<Buffer> {
  const title = `${ticket.kind === 'delivery' ? 'Delivery' : 'Pickup'} ticket ${ticket.number}`
  const sheet = openPdfSheet(title, companyName || 'Lumenyard', logo)
  const { doc, width } = sheet
  doc.font('bold').fontSize(18).fillColor(INK).text(title)
  doc.font('bold').fontSize(11).text(companyName || '—')
  doc.moveDown(0.8)
  pdfFacts(sheet, [
    ['Sales order', ticket.orderNumber],
    ['For', ticket.customerName],
    ['Job', ticket.jobName],
    ['From', ticket.warehouseCode],
    ['Deliver to', ticket.deliverTo],
    ['Note', ticket.note],
    ['Made', `${ticket.createdAt.slice(0, 10)}${ticket.createdBy ? ` by ${ticket.createdBy}` : ''}`],
  ])
  const columns: PdfColumn[] = [
    { header: '#', width: 22, align: 'left' },
    { header: 'SKU', width: 90, align: 'left' },
    { header: 'Description', width: width - 22 - 90 - 60 - 70 - 56 - 60, align: 'left' },
    { header: 'Bin', width: 60, align: 'left' },
    { header: 'Lot', width: 70, align: 'left' },
    { header: 'Quantity', width: 56, align: 'right' },
    { header: 'Weight', width: 60, align: 'right' },
  ]
  const { row, rule, header, keepRoom } = pdfTable(sheet, columns)
  header()
  for (const l of ticket.lines) {
    keepRoom(80)
    const cautions = l.cautions.map((c) => CAUTION_WORDS[c]).join('; ')
    row([String(l.lineNo), l.sku, l.itemName + (cautions ? ` (${cautions})` : ''), l.binCode, l.lotCode ?? '—', `${l.qty} ${l.stockUnit}`, `${l.totalKg} kg`], 'body')
    rule()
    doc.y += 3
  }
  doc.font('bold').fontSize(10).fillColor(INK).text(`Total weight about ${ticket.totalKg} kg`, MARGIN, doc.y + 2, { width, align: 'right' })
  doc.moveDown(0.8)
  doc.font('bold').fontSize(9).fillColor(INK).text(ticket.heavy ? 'Heavy load: lifting caution' : 'Handling', MARGIN, doc.y, { width })
  doc.font('body').fontSize(9).fillColor(SOFT).text(HANDOVER_CAUTIONS, { width })
  doc.moveDown(1)
  if (doc.y > doc.page.height - MARGIN - 140) doc.addPage()
  doc.font('bold').fontSize(9).fillColor(INK).text('Received in good order by', MARGIN, doc.y, { width })
  const top = doc.y + 4
  if (signature) {
    doc.image(signature, MARGIN, top, { fit: [240, 80] })
    doc.y = top + 84
    doc.font('body').fontSize(10).fillColor(INK).text(`${ticket.signerName ?? ''}, signed ${ticket.signedAt?.slice(0, 16).replace('T', ' ')} UTC`, MARGIN, doc.y, { width })
  } else {
    doc.moveTo(MARGIN, top + 60).lineTo(MARGIN + 240, top + 60).strokeColor(SOFT).lineWidth(0.8).stroke()
    doc.y = top + 64
    doc.font('body').fontSize(9).fillColor(SOFT).text('Signature and printed name', MARGIN, doc.y, { width })
  }
  return sheet.finish(ticket.number)
}
