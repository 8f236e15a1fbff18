// A printable A4 sheet made with pdfkit: DejaVu Sans embedded (pdfkit's built-in Helvetica has no Ω; DejaVu has
// Ω, µ, ±, –, °, ✓ and ✗), black text on white with thin rules only, so a bench printer spends little ink. The
// TrueType files, not WOFF: fontkit inflates a WOFF's tables again on every use, which made a sheet take seconds.
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import { cautions, cautionsDeferral } from '@bumperline/contracts/bench-cautions';
import type { CautionKind } from '@bumperline/contracts/bench-vocabulary';

const require = createRequire(import.meta.url);
const REGULAR = require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans.ttf');
const BOLD = require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans-Bold.ttf');

export const MARGIN = 40;
const RULE = '#888888';
const MUTED = '#444444';

export type Doc = PDFKit.PDFDocument;
export type Cell = string | PDFKit.Mixins.CellOptions;

export interface Sheet {
  doc: Doc;
  /** Ends the document and gives its bytes. */
  finish(): Promise<Buffer>;
}

export function newSheet(title: string): Sheet {
  const doc = new PDFDocument({ size: 'A4', margin: MARGIN, info: { Title: title, Creator: 'Bumperline' }, bufferPages: true });
  doc.registerFont('body', REGULAR);
  doc.registerFont('bold', BOLD);
  doc.font('body').fontSize(10).fillColor('black');
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const ended = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  return {
    doc,
    finish() {
      // Page numbers on every page, now that the count is known.
      const range = doc.bufferedPageRange();
      for (let i = range.start; i < range.start + range.count; i++) {
        doc.switchToPage(i);
        const bottom = doc.page.margins.bottom;
        doc.page.margins.bottom = 0;
        doc
          .font('body')
          .fontSize(8)
          .fillColor(MUTED)
          .text(`${title} — page ${i + 1} of ${range.count}`, MARGIN, doc.page.height - 28, {
            width: contentWidth(doc),
            align: 'right',
            lineBreak: false,
          });
        doc.page.margins.bottom = bottom;
      }
      doc.end();
      return ended;
    },
  };
}

export const contentWidth = (doc: Doc) => doc.page.width - doc.page.margins.left - doc.page.margins.right;

/** Starts a new page when less than `height` points are left. */
export function keepSpace(doc: Doc, height: number): void {
  if (doc.y + height > doc.page.height - doc.page.margins.bottom) doc.addPage();
}

export function title(doc: Doc, text: string, subtitle?: string): void {
  doc.font('bold').fontSize(16).fillColor('black').text(text, MARGIN, doc.y);
  if (subtitle) doc.font('body').fontSize(10).fillColor(MUTED).text(subtitle);
  doc.fillColor('black').moveDown(0.6);
}

/** A thin line across the page at `y`. */
function ruleAcross(doc: Doc, y: number): void {
  doc
    .moveTo(MARGIN, y)
    .lineTo(MARGIN + contentWidth(doc), y)
    .lineWidth(0.5)
    .strokeColor(RULE)
    .stroke();
}

export function heading(doc: Doc, text: string): void {
  keepSpace(doc, 60);
  doc.moveDown(0.4);
  doc.font('bold').fontSize(12).fillColor('black').text(text, MARGIN, doc.y);
  ruleAcross(doc, doc.y + 2);
  doc.moveDown(0.4);
}

export function paragraph(doc: Doc, text: string, opts: { bold?: boolean; muted?: boolean; size?: number } = {}): void {
  doc
    .font(opts.bold ? 'bold' : 'body')
    .fontSize(opts.size ?? 10)
    .fillColor(opts.muted ? MUTED : 'black')
    .text(text, MARGIN, doc.y, { width: contentWidth(doc) });
  doc.fillColor('black');
}

/** Label: value pairs on one line each. */
export function facts(doc: Doc, rows: [string, string][]): void {
  for (const [label, value] of rows) {
    doc.font('bold').fontSize(10).text(`${label}: `, MARGIN, doc.y, { continued: true }).font('body').text(value);
  }
  doc.moveDown(0.4);
}

/** A ruled table; column widths as fractions of the content width. Empty strings leave boxes to write in. */
export function table(doc: Doc, header: string[], rows: Cell[][], widths: number[], minRowHeight = 0): void {
  keepSpace(doc, 40);
  const width = contentWidth(doc);
  doc.font('body').fontSize(9);
  doc.table({
    position: { x: MARGIN, y: doc.y },
    columnStyles: widths.map((w) => ({ width: w * width })),
    rowStyles: (i) => (i === 0 ? undefined : { minHeight: minRowHeight }),
    defaultStyle: { border: 0.5, borderColor: RULE, padding: 3 },
    data: [header.map((h) => ({ text: h, font: { src: 'bold' }, type: 'TH' as const })), ...rows],
  });
  doc.x = MARGIN;
  doc.moveDown(0.5);
}

/** A record's short form: the cautions' titles and whether they were acknowledged (the wording is on the blank sheet). */
export function cautionsAcknowledged(doc: Doc, kinds: readonly CautionKind[], acknowledged: boolean): void {
  if (!kinds.length) return;
  const titles = kinds.map((kind) => cautions[kind].title).join(', ');
  doc
    .font('bold')
    .fontSize(9)
    .text(`⚠ ${titles} — ${acknowledged ? '✓ cautions acknowledged' : '✗ cautions NOT acknowledged'}`, MARGIN, doc.y, {
      width: contentWidth(doc),
    });
  doc.moveDown(0.2);
}

/** Each caution's title and wording, then the deferral to local codes. */
export function cautionList(doc: Doc, kinds: readonly CautionKind[]): void {
  if (!kinds.length) return;
  for (const kind of kinds) {
    const caution = cautions[kind];
    keepSpace(doc, 40);
    doc
      .font('bold')
      .fontSize(9)
      .text(`⚠ ${caution.title}`, MARGIN + 8, doc.y, { width: contentWidth(doc) - 8, continued: true })
      .font('body')
      .text(` — ${caution.text}`);
  }
  doc
    .font('body')
    .fontSize(8)
    .fillColor(MUTED)
    .text(cautionsDeferral, MARGIN + 8, doc.y, { width: contentWidth(doc) - 8 });
  doc.fillColor('black');
  doc.moveDown(0.3);
}

/** An empty box with a label, to tick by hand. */
export function tickBox(doc: Doc, label: string): void {
  keepSpace(doc, 20);
  const y = doc.y;
  doc.rect(MARGIN, y, 10, 10).lineWidth(0.7).strokeColor('black').stroke();
  doc
    .font('body')
    .fontSize(10)
    .text(label, MARGIN + 16, y, { width: contentWidth(doc) - 16 });
  doc.moveDown(0.3);
}

/** Lines to write on. */
export function writingLines(doc: Doc, label: string, count: number): void {
  keepSpace(doc, 18 * count + 14);
  doc.font('body').fontSize(9).fillColor(MUTED).text(label, MARGIN, doc.y);
  doc.fillColor('black');
  for (let i = 0; i < count; i++) {
    const y = doc.y + 16;
    ruleAcross(doc, y);
    doc.y = y + 2;
  }
  doc.moveDown(0.5);
}

/** A file name without characters a browser or a shell would stumble on. */
export const pdfFileName = (text: string) =>
  text
    .normalize('NFKD')
    .replace(/[^A-Za-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .toLowerCase() || 'sheet';
