import 'server-only';
import { PDFDocument, rgb } from 'pdf-lib';
import type { PDFFont, PDFPage } from 'pdf-lib';
import { PAPER_SIZES_MM, mmToPt } from '@/lib/domain/label-layout';
import { cleanText, embedLora } from './fonts';
import { LINE_HEIGHT, ellipsize, textWidth, wrapText } from './text';

export type ReportSection = { heading: string; columns: string[]; rows: string[][]; note?: string };
export type TableReport = { title: string; subtitle?: string; sections: ReportSection[]; footer?: string };

const PAGE = { width: mmToPt(PAPER_SIZES_MM.a4.widthMm), height: mmToPt(PAPER_SIZES_MM.a4.heightMm) };
const MARGIN = mmToPt(18);
const FOOTER_SPACE = 24;
const BODY = 8.5;
const CELL_PAD_X = 4;
const CELL_PAD_Y = 3;
const MAX_CELL_LINES = 30;
const GREEN = rgb(0.1, 0.29, 0.2); // the product's deep green ink, for structure
const INK = rgb(0.1, 0.1, 0.1);
const RULE = rgb(0.72, 0.72, 0.7);

// Numbers, money, weights and percentages line up on the right (tabular reading).
const NUMERIC = /^[-+−]?[$€£]?\s?\d[\d,.\s]*(%|\s?(g|kg|lb|oz|°C))?$/;

type Fonts = { regular: PDFFont; bold: PDFFont };

class Cursor {
  page!: PDFPage;
  y = 0;
  constructor(private doc: PDFDocument) {
    this.newPage();
  }
  newPage(): void {
    this.page = this.doc.addPage([PAGE.width, PAGE.height]);
    this.y = PAGE.height - MARGIN;
  }
  /** Starts a new page unless `height` still fits above the footer. */
  ensure(height: number): boolean {
    if (this.y - height >= MARGIN + FOOTER_SPACE) return false;
    this.newPage();
    return true;
  }
}

function paragraph(c: Cursor, text: string, font: PDFFont, size: number, color = INK): void {
  for (const line of wrapText(cleanText(text), font, size, PAGE.width - 2 * MARGIN)) {
    c.ensure(size * LINE_HEIGHT);
    c.page.drawText(line, { x: MARGIN, y: c.y - size, size, font, color });
    c.y -= size * LINE_HEIGHT;
  }
}

function columnWidths(columns: string[], rows: string[][], fonts: Fonts, available: number): number[] {
  const natural = columns.map((header, i) => {
    let widest = textWidth(fonts.bold, header, BODY);
    for (const row of rows) widest = Math.max(widest, textWidth(fonts.regular, row[i] ?? '', BODY));
    return Math.min(widest, available * 0.6) + 2 * CELL_PAD_X;
  });
  const sum = natural.reduce((a, b) => a + b, 0);
  return natural.map((w) => (w * available) / sum);
}

function drawRow(
  c: Cursor,
  cells: string[],
  widths: number[],
  font: PDFFont,
  rightAlign: boolean[],
  color = INK,
): void {
  const wrapped = cells.map((cell, i) => {
    const lines = wrapText(cell, font, BODY, widths[i] - 2 * CELL_PAD_X);
    if (lines.length <= MAX_CELL_LINES) return lines;
    return [
      ...lines.slice(0, MAX_CELL_LINES - 1),
      ellipsize(lines[MAX_CELL_LINES - 1], font, BODY, widths[i] - 2 * CELL_PAD_X, true),
    ];
  });
  const height = Math.max(1, ...wrapped.map((l) => l.length)) * BODY * LINE_HEIGHT + 2 * CELL_PAD_Y;
  let x = MARGIN;
  wrapped.forEach((lines, i) => {
    lines.forEach((line, n) => {
      const lineWidth = textWidth(font, line, BODY);
      const lx = rightAlign[i] ? x + widths[i] - CELL_PAD_X - lineWidth : x + CELL_PAD_X;
      c.page.drawText(line, {
        x: lx,
        y: c.y - CELL_PAD_Y - BODY * 0.92 - n * BODY * LINE_HEIGHT,
        size: BODY,
        font,
        color,
      });
    });
    x += widths[i];
  });
  c.y -= height;
}

function rowHeight(cells: string[], widths: number[], font: PDFFont): number {
  const lines = cells.map((cell, i) =>
    Math.min(MAX_CELL_LINES, wrapText(cell, font, BODY, widths[i] - 2 * CELL_PAD_X).length),
  );
  return Math.max(1, ...lines) * BODY * LINE_HEIGHT + 2 * CELL_PAD_Y;
}

function rule(c: Cursor, thickness: number, color: ReturnType<typeof rgb>): void {
  c.page.drawLine({ start: { x: MARGIN, y: c.y }, end: { x: PAGE.width - MARGIN, y: c.y }, thickness, color });
}

function drawSection(c: Cursor, section: ReportSection, fonts: Fonts): void {
  const available = PAGE.width - 2 * MARGIN;
  const columns = section.columns.map(cleanText);
  const rows = section.rows.map((row) => columns.map((_, i) => cleanText(row[i] ?? '')));
  const widths = columnWidths(columns, rows, fonts, available);
  const rightAlign = columns.map(
    (_, i) => rows.some((r) => r[i] !== '') && rows.every((r) => r[i] === '' || NUMERIC.test(r[i])),
  );
  const header = () => {
    drawRow(c, columns, widths, fonts.bold, rightAlign, GREEN);
    rule(c, 0.8, GREEN);
  };
  // Keep the heading with the table's header and first row.
  const firstRow = rows.length > 0 ? rowHeight(rows[0], widths, fonts.regular) : BODY * 2;
  c.ensure(20 + rowHeight(columns, widths, fonts.bold) + firstRow);
  c.y -= 8;
  c.page.drawText(cleanText(section.heading), { x: MARGIN, y: c.y - 12, size: 12, font: fonts.bold, color: GREEN });
  c.y -= 12 * LINE_HEIGHT + 4;
  header();
  if (rows.length === 0) {
    c.y -= 2;
    paragraph(c, 'No rows.', fonts.regular, BODY);
  }
  for (const row of rows) {
    if (c.ensure(rowHeight(row, widths, fonts.regular))) header(); // repeat the header on a new page
    drawRow(c, row, widths, fonts.regular, rightAlign);
    rule(c, 0.3, RULE);
  }
  if (section.note) {
    c.y -= 4;
    paragraph(c, section.note, fonts.regular, BODY - 0.5);
  }
}

/** A4 portrait report of ruled tables with page numbers (packing slips, recall lists, yield reports). */
export async function renderTableReport(report: TableReport): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setTitle(cleanText(report.title));
  doc.setCreator('Combtrace');
  const [regular, bold] = await Promise.all([embedLora(doc, 400), embedLora(doc, 700)]);
  const fonts: Fonts = { regular, bold };
  const c = new Cursor(doc);
  paragraph(c, report.title, bold, 16, GREEN);
  if (report.subtitle) paragraph(c, report.subtitle, regular, 10);
  c.y -= 6;
  for (const section of report.sections) drawSection(c, section, fonts);

  const pages = doc.getPages();
  const footer = cleanText(report.footer ?? '');
  pages.forEach((page, i) => {
    const label = `Page ${i + 1} of ${pages.length}`;
    const labelWidth = textWidth(regular, label, 8);
    page.drawText(label, { x: PAGE.width - MARGIN - labelWidth, y: MARGIN - 4, size: 8, font: regular, color: INK });
    if (footer) {
      page.drawText(ellipsize(footer, regular, 8, PAGE.width - 2 * MARGIN - labelWidth - 12), {
        x: MARGIN,
        y: MARGIN - 4,
        size: 8,
        font: regular,
        color: INK,
      });
    }
  });
  return doc.save();
}
