// The one PDF sheet every printed document starts from (purchase orders, quotes): pdfkit with the Open Sans
// shipped in @fontsource (nothing fetched), the page, the colours, a table that repeats its header on a new
// page, and page numbers on every page.
import { createRequire } from 'node:module'
import PDFDocument from 'pdfkit'

const require = createRequire(import.meta.url)
export const FONT = require.resolve('@fontsource/open-sans/files/open-sans-latin-400-normal.woff')
export const FONT_BOLD = require.resolve('@fontsource/open-sans/files/open-sans-latin-700-normal.woff')

export const PDF_TYPE = 'application/pdf'

export const MARGIN = 48
export const INK = '#1d2b2a'
export const SOFT = '#5b6b69'
export const RULE = '#c9d6d4'

export interface PdfColumn {
  header: string
  width: number
  align: 'left' | 'right'
}

export interface PdfSheet {
  doc: PDFKit.PDFDocument
  /** The width between the margins. */
  width: number
  /** Numbers every page (`<reference> · page n of m`) and ends the document. */
  finish(reference: string): Promise<Buffer>
}

/** The company's logo as stored (PNG or JPEG, the two kinds the upload accepts and pdfkit draws). */
export interface PdfLogo {
  type: string
  data: Buffer
}

/** The logo's box at the top right of the first page, in points (about 2 × 0.67 in). */
export const LOGO_BOX: [number, number] = [144, 48]

/**
 * A letter-size sheet with the fonts registered as 'body' and 'bold', collected into a Buffer. With a logo, it is
 * drawn at the top right of the first page, scaled to fit its box; text starts at the top left as before.
 */
export function openPdfSheet(title: string, author: string, logo?: PdfLogo | null): PdfSheet {
  const doc = new PDFDocument({ size: 'LETTER', margin: MARGIN, bufferPages: true, info: { Title: title, Author: author } })
  doc.registerFont('body', FONT)
  doc.registerFont('bold', FONT_BOLD)
  const chunks: Buffer[] = []
  doc.on('data', (c: Buffer) => chunks.push(c))
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)))
    doc.on('error', reject)
  })
  const width = doc.page.width - 2 * MARGIN
  if (logo && (logo.type === 'image/png' || logo.type === 'image/jpeg')) {
    try {
      doc.image(logo.data, MARGIN + width - LOGO_BOX[0], MARGIN, { fit: LOGO_BOX, align: 'right' })
    } catch {
      // An image pdfkit cannot read prints no logo rather than no document.
    }
    doc.x = MARGIN
    doc.y = MARGIN
  }
  return {
    doc,
    width,
    finish(reference) {
      const range = doc.bufferedPageRange()
      for (let i = range.start; i < range.start + range.count; i++) {
        doc.switchToPage(i)
        // Below the bottom margin: without lifting the margin pdfkit would start a new page for the footer.
        doc.page.margins.bottom = 0
        doc.font('body').fontSize(8).fillColor(SOFT)
          .text(`${reference} · page ${i + 1} of ${range.count}`, MARGIN, doc.page.height - MARGIN + 16, { width, align: 'right', lineBreak: false })
      }
      doc.end()
      return done
    },
  }
}

/** A table of `columns` across the sheet: a row of cells (as tall as its tallest cell), a rule, the header. */
export function pdfTable(sheet: PdfSheet, columns: PdfColumn[]) {
  const { doc, width } = sheet
  const row = (cells: string[], font: 'body' | 'bold') => {
    const y = doc.y
    let x = MARGIN
    let tallest = 0
    doc.font(font).fontSize(9).fillColor(INK)
    cells.forEach((text, i) => {
      const c = columns[i]
      tallest = Math.max(tallest, doc.heightOfString(text, { width: c.width - 6 }))
      doc.text(text, x, y, { width: c.width - 6, align: c.align })
      x += c.width
    })
    doc.x = MARGIN
    doc.y = y + tallest + 4
  }
  const rule = () => doc.moveTo(MARGIN, doc.y).lineTo(MARGIN + width, doc.y).strokeColor(RULE).lineWidth(0.6).stroke()
  const header = () => {
    row(columns.map((c) => c.header), 'bold')
    rule()
    doc.y += 4
  }
  /** Starts a new page (with the header again) when less than `room` points are left above the margin. */
  const keepRoom = (room: number) => {
    if (doc.y > doc.page.height - MARGIN - room) {
      doc.addPage()
      header()
    }
  }
  return { row, rule, header, keepRoom }
}

/** Label and value pairs down the sheet (who, for whom, which job…); pairs without a value are left out. */
export function pdfFacts(sheet: PdfSheet, facts: [string, string | null | undefined][]): void {
  const { doc, width } = sheet
  for (const [label, value] of facts) {
    if (!value) continue
    const y = doc.y
    doc.font('bold').fontSize(9).fillColor(SOFT).text(label, MARGIN, y, { width: 80 })
    doc.font('body').fontSize(10).fillColor(INK).text(value, MARGIN + 84, y, { width: width - 84 })
  }
  doc.y += 10
}
