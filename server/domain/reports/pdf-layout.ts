import path from 'node:path';
import PDFDocument from 'pdfkit';
import { printable } from './report-text';

/**
 * Page furniture shared by the printed reports (pdfkit): fonts, headings,
 * key–value lists, tables that carry on over pages, the cautions box, and
 * the running head and foot written on every page once all pages exist.
 * Units are PDF points (1/72 in).
 */

export type Paper = 'A4' | 'LETTER' | 'A5';

const FONT_DIR = path.dirname(require.resolve('@expo-google-fonts/barlow/package.json'));
export const FONT = {
  regular: path.join(FONT_DIR, '400Regular', 'Barlow_400Regular.ttf'),
  bold: path.join(FONT_DIR, '600SemiBold', 'Barlow_600SemiBold.ttf'),
  italic: path.join(FONT_DIR, '400Regular_Italic', 'Barlow_400Regular_Italic.ttf'),
} as const;

export const INK = '#1A1A1A';
export const MUTED = '#555555';
export const RULE = '#9A9A9A';
export const STRIPE = '#EFEFEF';

export interface ReportDocument {
  doc: PDFKit.PDFDocument;
  margin: number;
  /** Usable width between the margins. */
  width: number;
  /** Lowest y a body line may reach before a new page. */
  bottom: number;
}

/** A new document with the report fonts registered and room kept for the running head and foot. */
export function newReportDocument(options: { paper: Paper; title: string; subject: string; margin?: number }): ReportDocument {
  const margin = options.margin ?? (options.paper === 'A5' ? 28 : 42);
  const doc = new PDFDocument({
    size: options.paper,
    margins: { top: margin + 16, bottom: margin + 14, left: margin, right: margin },
    bufferPages: true,
    autoFirstPage: true,
    info: { Title: printable(options.title), Subject: printable(options.subject), Creator: 'Kenning', Producer: 'Kenning' },
  });
  doc.registerFont('body', FONT.regular);
  doc.registerFont('bold', FONT.bold);
  doc.registerFont('italic', FONT.italic);
  doc.font('body').fontSize(9).fillColor(INK);
  return {
    doc,
    margin,
    width: doc.page.width - 2 * margin,
    bottom: doc.page.height - doc.page.margins.bottom,
  };
}

/** Starts a new page when fewer than `height` points are left. */
export function ensureSpace(r: ReportDocument, height: number) {
  if (r.doc.y + height > r.bottom) r.doc.addPage();
}

/** A section heading (size 13) or sub-heading (size 10.5). */
export function heading(r: ReportDocument, text: string, level: 1 | 2 = 1) {
  const { doc } = r;
  ensureSpace(r, level === 1 ? 60 : 40);
  if (doc.y > doc.page.margins.top + 4) doc.moveDown(level === 1 ? 0.8 : 0.5);
  doc
    .font('bold')
    .fontSize(level === 1 ? 13 : 10.5)
    .fillColor(INK)
    .text(printable(text), r.margin, doc.y, { width: r.width });
  doc.moveDown(0.25);
  doc.font('body').fontSize(9);
}

/** A paragraph of body text. */
export function paragraph(r: ReportDocument, text: string, options: { size?: number; color?: string; font?: string } = {}) {
  const { doc } = r;
  doc
    .font(options.font ?? 'body')
    .fontSize(options.size ?? 9)
    .fillColor(options.color ?? INK);
  ensureSpace(r, doc.heightOfString(printable(text), { width: r.width }));
  doc.text(printable(text), r.margin, doc.y, { width: r.width });
  doc.font('body').fontSize(9).fillColor(INK);
}

/** Label–value lines, the label in a fixed column. */
export function keyValues(r: ReportDocument, rows: [string, string][], labelWidth = 150) {
  const { doc } = r;
  for (const [label, value] of rows) {
    doc.font('body').fontSize(9);
    const h = Math.max(
      doc.heightOfString(printable(value), { width: r.width - labelWidth }),
      doc.heightOfString(printable(label), { width: labelWidth - 8 }),
    );
    ensureSpace(r, h + 2);
    const y = doc.y;
    doc.fillColor(MUTED).text(printable(label), r.margin, y, { width: labelWidth - 8 });
    doc.fillColor(INK).text(printable(value), r.margin + labelWidth, y, { width: r.width - labelWidth });
    doc.y = y + h + 2;
  }
}

export interface Column {
  title: string;
  /** Share of the table's width (the shares are scaled to fill it). */
  weight: number;
  align?: 'left' | 'right';
}

/** A table with a header row repeated on each page it runs onto; rows are never split. */
export function table(r: ReportDocument, columns: Column[], rows: string[][], options: { size?: number } = {}) {
  const { doc } = r;
  const size = options.size ?? 8;
  const total = columns.reduce((s, c) => s + c.weight, 0);
  const widths = columns.map((c) => (c.weight / total) * r.width);
  const pad = 3;
  const rowHeight = (cells: string[], font: string) => {
    doc.font(font).fontSize(size);
    return Math.max(...cells.map((c, i) => doc.heightOfString(printable(c), { width: widths[i]! - 2 * pad }))) + 2 * pad;
  };
  const drawRow = (cells: string[], font: string, fill: string | null) => {
    const h = rowHeight(cells, font);
    const y = doc.y;
    if (fill) doc.rect(r.margin, y, r.width, h).fill(fill);
    let x = r.margin;
    doc.font(font).fontSize(size).fillColor(INK);
    cells.forEach((cell, i) => {
      doc.text(printable(cell), x + pad, y + pad, { width: widths[i]! - 2 * pad, align: columns[i]!.align ?? 'left' });
      x += widths[i]!;
    });
    doc.y = y + h;
    return h;
  };
  const header = () => {
    drawRow(
      columns.map((c) => c.title),
      'bold',
      null,
    );
    doc
      .moveTo(r.margin, doc.y)
      .lineTo(r.margin + r.width, doc.y)
      .lineWidth(0.6)
      .strokeColor(RULE)
      .stroke();
  };
  ensureSpace(
    r,
    rowHeight(
      columns.map((c) => c.title),
      'bold',
    ) + rowHeight(rows[0] ?? [''], 'body'),
  );
  doc.x = r.margin;
  header();
  rows.forEach((row, index) => {
    if (doc.y + rowHeight(row, 'body') > r.bottom) {
      doc.addPage();
      header();
    }
    drawRow(row, 'body', index % 2 === 1 ? STRIPE : null);
  });
  doc.font('body').fontSize(9).fillColor(INK);
  doc.x = r.margin;
  doc.moveDown(0.4);
}

/** The standing cautions in a ruled box. */
export function cautionsBox(r: ReportDocument, cautions: readonly string[], size = 8.5) {
  const { doc } = r;
  const text = cautions.map((c) => `• ${printable(c)}`).join('\n');
  doc.font('body').fontSize(size);
  const h = doc.heightOfString(text, { width: r.width - 16 }) + 26;
  ensureSpace(r, h);
  const y = doc.y;
  doc.rect(r.margin, y, r.width, h).lineWidth(1).strokeColor(INK).stroke();
  doc
    .font('bold')
    .fontSize(size + 0.5)
    .fillColor(INK)
    .text('Cautions', r.margin + 8, y + 6, { width: r.width - 16 });
  doc
    .font('body')
    .fontSize(size)
    .text(text, r.margin + 8, doc.y + 2, { width: r.width - 16 });
  doc.y = y + h + 6;
  doc.x = r.margin;
}

/**
 * Writes the running head (left: `head`) and foot (`foot` and "page i of n")
 * on every page, and the watermark when one is given, once the pages exist.
 */
export function finishPages(r: ReportDocument, furniture: { head: string; foot: string; watermark?: string | null }) {
  const { doc } = r;
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const { width, height } = doc.page;
    // Writing into the margins must not start new pages.
    const margins = { ...doc.page.margins };
    doc.page.margins = { top: 0, bottom: 0, left: 0, right: 0 };
    if (furniture.watermark) {
      doc.save();
      doc.rotate(-35, { origin: [width / 2, height / 2] });
      doc
        .font('bold')
        .fontSize(width > 500 ? 44 : 30)
        .fillColor('#000000')
        .fillOpacity(0.13)
        .text(printable(furniture.watermark), 0, height / 2 - 24, { width, align: 'center', lineBreak: false });
      doc.restore();
      doc.fillOpacity(1);
    }
    doc.font('body').fontSize(7.5).fillColor(MUTED);
    // The watermark's words in the head too: a faint diagonal can vanish on a poor copy.
    const head = furniture.watermark ? `${furniture.watermark} · ${furniture.head}` : furniture.head;
    doc.text(printable(head), r.margin, r.margin - 6, { width: r.width, lineBreak: false, ellipsis: true });
    doc
      .moveTo(r.margin, r.margin + 5)
      .lineTo(width - r.margin, r.margin + 5)
      .lineWidth(0.4)
      .strokeColor(RULE)
      .stroke();
    const footY = height - r.margin + 2;
    doc.text(printable(furniture.foot), r.margin, footY, { width: r.width - 70, lineBreak: false, ellipsis: true });
    doc.text(`Page ${i + 1 - range.start} of ${range.count}`, width - r.margin - 70, footY, {
      width: 70,
      align: 'right',
      lineBreak: false,
    });
    doc.page.margins = margins;
  }
  doc.fillColor(INK);
}

/** The finished document's bytes. */
export function documentBytes(r: ReportDocument): Promise<Buffer> {
  const { doc } = r;
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.end();
  });
}
