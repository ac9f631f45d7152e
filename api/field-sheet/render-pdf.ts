import { createRequire } from 'node:module';
import path from 'node:path';
import PDFDocument from 'pdfkit';
import { REBIND_NOTE_SHEET } from '@shared/reuse/rebind-note';
import { MARK_SWATCHES } from '@shared/reuse/receiver-fields';
import type { ReviewState } from '../review-state';
import type { FieldSheet, SheetReceiver } from './field-sheet-data';

// The field sheet as an A4 PDF: what a pilot takes to the bench and the field. Set in
// the app's own typefaces (shipped with it as font packages), ink on white, with the
// words carrying every meaning so it prints the same in black and white. The WOFF 1
// files: the PDF library's subsetter mishandles composite glyphs of the WOFF 2 ones,
// and the monospaced face's space glyph, so figures are set in the sans face too.

const require = createRequire(import.meta.url);
const fontFile = (pkg: string, file: string) => path.join(path.dirname(require.resolve(pkg)), 'files', file);
const FONTS = {
  sans: fontFile('@fontsource/ibm-plex-sans', 'ibm-plex-sans-latin-400-normal.woff'),
  bold: fontFile('@fontsource/ibm-plex-sans', 'ibm-plex-sans-latin-600-normal.woff'),
};

const INK = '#1c2230';
const MUTED = '#5b6372';
const RULE = '#c9b797';
const BAND = '#f5f0e6';

const PAGE = { width: 595.28, height: 841.89, margin: 36 };
const CONTENT_WIDTH = PAGE.width - 2 * PAGE.margin;
const ROW = 12.5;

const REVIEW_WORDS: Record<ReviewState, string> = {
  none: 'Not reviewed',
  pending: 'Review pending',
  approved: 'Approved',
  stale: 'Approval stale',
  'changes-requested': 'Changes requested',
};

const failsafeText = (failsafe: number | string | null | undefined) =>
  failsafe === null || failsafe === undefined ? 'not set' : typeof failsafe === 'number' ? `${failsafe} µs` : failsafe;

interface Column {
  title: string;
  width: number;
}

type Doc = PDFKit.PDFDocument;

class SheetWriter {
  y = PAGE.margin;

  constructor(readonly doc: Doc) {}

  /** Starts a new page when a block of this height would not fit on this one. */
  room(height: number): void {
    if (this.y + height <= PAGE.height - PAGE.margin - 14) return;
    this.doc.addPage();
    this.y = PAGE.margin;
  }

  heading(text: string, x = PAGE.margin, width = CONTENT_WIDTH): number {
    this.doc.font('bold').fontSize(10.5).fillColor(INK).text(text, x, this.y, { width, lineBreak: false });
    return this.y + 16;
  }

  table(x: number, y: number, columns: Column[], rows: string[][]): number {
    const doc = this.doc;
    const width = columns.reduce((sum, column) => sum + column.width, 0);
    doc.rect(x, y, width, ROW).fill(BAND);
    let cx = x;
    for (const column of columns) {
      doc
        .font('bold')
        .fontSize(7.5)
        .fillColor(MUTED)
        .text(column.title, cx + 3, y + 3, { width: column.width - 6, lineBreak: false });
      cx += column.width;
    }
    let ry = y + ROW;
    for (const row of rows) {
      cx = x;
      row.forEach((cell, index) => {
        const column = columns[index];
        doc
          .font('sans')
          .fontSize(8)
          .fillColor(INK)
          .text(cell, cx + 3, ry + 2.5, { width: column.width - 6, lineBreak: false, ellipsis: true });
        cx += column.width;
      });
      doc
        .moveTo(x, ry + ROW)
        .lineTo(x + width, ry + ROW)
        .lineWidth(0.4)
        .strokeColor(RULE)
        .stroke();
      ry += ROW;
    }
    return ry;
  }
}

function header(w: SheetWriter, sheet: FieldSheet): void {
  const { doc } = w;
  doc
    .font('bold')
    .fontSize(8)
    .fillColor(MUTED)
    .text('BINDERY FIELD SHEET', PAGE.margin, w.y, { characterSpacing: 1, lineBreak: false });
  doc
    .font('sans')
    .fontSize(8)
    .fillColor(MUTED)
    .text(`Printed ${new Date().toISOString().slice(0, 10)}`, PAGE.margin, w.y, {
      width: CONTENT_WIDTH,
      align: 'right',
      lineBreak: false,
    });
  w.y += 13;
  doc
    .font('bold')
    .fontSize(18)
    .fillColor(INK)
    .text(sheet.model.name, PAGE.margin, w.y, { width: CONTENT_WIDTH, lineBreak: false, ellipsis: true });
  w.y += 25;

  const facts: [string, string][] = [
    ['Revision', String(sheet.revision.number)],
    ['Hash', sheet.revision.short_hash],
    ['Review', REVIEW_WORDS[sheet.review_state]],
    [
      'Link',
      `${sheet.link.channels} channels${sheet.link.packet_rate_hz ? ` at ${sheet.link.packet_rate_hz} Hz` : ''}`,
    ],
    [
      'Checks',
      `${sheet.counts.errors} error${sheet.counts.errors === 1 ? '' : 's'}, ${sheet.counts.warnings} warning${sheet.counts.warnings === 1 ? '' : 's'}`,
    ],
  ];
  let x = PAGE.margin;
  for (const [label, value] of facts) {
    doc.font('sans').fontSize(7.5).fillColor(MUTED).text(label, x, w.y, { lineBreak: false });
    doc
      .font('bold')
      .fontSize(9.5)
      .fillColor(INK)
      .text(value, x, w.y + 9, { lineBreak: false });
    x += Math.max(70, doc.widthOfString(value) + 22);
  }
  w.y += 26;
  const about = [
    sheet.model.airframe,
    sheet.model.wingspan_mm ? `span ${sheet.model.wingspan_mm} mm` : null,
    sheet.model.weight_g ? `${sheet.model.weight_g} g` : null,
    sheet.receiver_supply ? `receiver supply: ${sheet.receiver_supply}` : null,
    sheet.revision.author
      ? `saved by ${sheet.revision.author.name} on ${sheet.revision.created_at.slice(0, 10)}`
      : null,
  ].filter(Boolean);
  doc
    .font('sans')
    .fontSize(8)
    .fillColor(MUTED)
    .text(about.join(' · '), PAGE.margin, w.y, { width: CONTENT_WIDTH, lineBreak: false, ellipsis: true });
  w.y += 12;
  doc
    .moveTo(PAGE.margin, w.y)
    .lineTo(PAGE.margin + CONTENT_WIDTH, w.y)
    .lineWidth(0.8)
    .strokeColor(INK)
    .stroke();
  w.y += 10;
}

function channelPlan(w: SheetWriter, sheet: FieldSheet): void {
  const half = Math.ceil(sheet.channels.length / 2);
  const halves =
    sheet.channels.length > 8 ? [sheet.channels.slice(0, half), sheet.channels.slice(half)] : [sheet.channels];
  w.room(16 + ROW * (1 + half));
  const top = w.heading('Channel plan');
  const gap = 12;
  const width = (CONTENT_WIDTH - gap) / 2;
  const columns: Column[] = [
    { title: 'Ch', width: 26 },
    { title: 'Function', width: width - 26 - 130 },
    { title: 'Role', width: 70 },
    { title: 'Notes', width: 60 },
  ];
  let bottom = top;
  halves.forEach((channels, index) => {
    const rows = channels.map((channel) => [
      String(channel.ch),
      channel.function,
      channel.side ? `${channel.role} (${channel.side})` : channel.role,
      [channel.reverse ? 'reversed' : '', channel.cut ? 'cut, below' : ''].filter(Boolean).join(', '),
    ]);
    bottom = Math.max(bottom, w.table(PAGE.margin + index * (width + gap), top, columns, rows));
  });
  w.y = bottom + 6;
  // Each cut in full under the plan: the table's notes column is too narrow for the switch, position and value.
  for (const channel of sheet.channels) {
    if (!channel.cut) continue;
    w.room(ROW);
    w.doc
      .font('sans')
      .fontSize(8)
      .fillColor(INK)
      .text(`Cut on ch ${channel.ch} (${channel.function}): ${channel.cut.words}.`, PAGE.margin, w.y, {
        width: CONTENT_WIDTH,
        lineBreak: false,
        ellipsis: true,
      });
    w.y += ROW;
  }
  w.y += 8;
}

function receiverBlockHeight(receiver: SheetReceiver): number {
  return 44 + (receiver.unit ? 11 : 0) + ROW * (1 + Math.max(1, receiver.pins.length));
}

function receiverBlock(w: SheetWriter, receiver: SheetReceiver, x: number, width: number, top: number): number {
  const { doc } = w;
  const title = receiver.label ? `${receiver.label} · slot ${receiver.id}` : `Slot ${receiver.id}`;
  doc.font('bold').fontSize(10.5).fillColor(INK).text(title, x, top, { width, lineBreak: false, ellipsis: true });
  const role = `${receiver.role}, ${receiver.outputs} outputs, telemetry: ${receiver.telemetry ? 'sends' : 'silent (off)'}`;
  doc
    .font('sans')
    .fontSize(8)
    .fillColor(MUTED)
    .text(role, x, top + 14, { width, lineBreak: false });
  let unitX = x;
  doc.font('sans').fontSize(8).fillColor(INK);
  if (receiver.unit) {
    const prefix = `Unit: ${receiver.unit.label}`;
    doc.text(prefix, unitX, top + 25, { lineBreak: false });
    unitX += doc.widthOfString(prefix) + 6;
    if (receiver.unit.mark_colour) {
      doc
        .circle(unitX + 3.5, top + 29, 3.5)
        .lineWidth(0.5)
        .fillAndStroke(MARK_SWATCHES[receiver.unit.mark_colour], INK);
      unitX += 10;
    }
    doc
      .fillColor(INK)
      .text(receiver.unit.mark ? `mark: ${receiver.unit.mark}` : 'no mark', unitX, top + 25, { lineBreak: false });
    doc
      .fillColor(MUTED)
      .fontSize(7.5)
      .text(REBIND_NOTE_SHEET, x, top + 36, { width, lineBreak: false, ellipsis: true });
  } else {
    doc.fillColor(MUTED).text('Unit: none on the shelf is installed here', unitX, top + 25, { lineBreak: false });
  }
  const columns: Column[] = [
    { title: 'Pin', width: 24 },
    { title: 'Ch', width: 22 },
    { title: 'Function', width: width - 24 - 22 - 52 - 84 },
    { title: 'Failsafe', width: 52 },
    { title: 'Link lost', width: 84 },
  ];
  const rows =
    receiver.pins.length > 0
      ? receiver.pins.map((pin) => [
          String(pin.pin),
          String(pin.ch),
          pin.function ?? '(no plan entry)',
          failsafeText(pin.failsafe),
          pin.link_loss.words,
        ])
      : [['', '', 'No pins mapped', '', '']];
  return w.table(x, top + (receiver.unit ? 49 : 38), columns, rows);
}

function receivers(w: SheetWriter, sheet: FieldSheet): void {
  const gap = 12;
  const width = (CONTENT_WIDTH - gap) / 2;
  for (let i = 0; i < sheet.receivers.length; i += 2) {
    const pair = sheet.receivers.slice(i, i + 2);
    w.room(Math.max(...pair.map(receiverBlockHeight)));
    const top = w.y;
    const bottom = Math.max(
      ...pair.map((receiver, index) => receiverBlock(w, receiver, PAGE.margin + index * (width + gap), width, top)),
    );
    w.y = bottom + 14;
  }
}

function wrappedHeight(doc: Doc, text: string, font: string, size: number, width: number): number {
  return doc.font(font).fontSize(size).heightOfString(text, { width });
}

function findings(w: SheetWriter, sheet: FieldSheet): void {
  const { doc } = w;
  if (sheet.findings.length === 0) return;
  const lines = sheet.findings.map(
    (finding) => `${finding.severity === 'error' ? 'ERROR' : 'Warning'} (${finding.rule}): ${finding.message}`,
  );
  w.room(16 + wrappedHeight(doc, lines[0], 'sans', 8, CONTENT_WIDTH));
  w.y = w.heading('Check findings to settle before flying');
  for (const line of lines) {
    const height = wrappedHeight(doc, line, 'sans', 8, CONTENT_WIDTH);
    w.room(height);
    doc.font('sans').fontSize(8).fillColor(INK).text(line, PAGE.margin, w.y, { width: CONTENT_WIDTH });
    w.y += height + 2;
  }
  w.y += 10;
}

function cautions(w: SheetWriter, sheet: FieldSheet): void {
  const { doc } = w;
  const { heading, items } = sheet.cautions;
  w.room(16 + 30);
  w.y = w.heading(heading);
  for (const item of items) {
    const height =
      wrappedHeight(doc, item.title, 'bold', 8, CONTENT_WIDTH - 8) +
      wrappedHeight(doc, item.body, 'sans', 7.5, CONTENT_WIDTH - 8);
    w.room(height);
    doc
      .moveTo(PAGE.margin, w.y)
      .lineTo(PAGE.margin, w.y + height)
      .lineWidth(1.2)
      .strokeColor(RULE)
      .stroke();
    doc
      .font('bold')
      .fontSize(8)
      .fillColor(INK)
      .text(item.title, PAGE.margin + 8, w.y, { width: CONTENT_WIDTH - 8 });
    doc
      .font('sans')
      .fontSize(7.5)
      .fillColor(MUTED)
      .text(item.body, PAGE.margin + 8, doc.y, { width: CONTENT_WIDTH - 8 });
    w.y = doc.y + 5;
  }
}

function footer(doc: Doc, sheet: FieldSheet): void {
  const range = doc.bufferedPageRange();
  for (let index = range.start; index < range.start + range.count; index += 1) {
    doc.switchToPage(index);
    const text = `${sheet.model.name} · revision ${sheet.revision.number} · ${sheet.revision.content_hash} · page ${index + 1} of ${range.count}`;
    // Written inside the bottom margin on purpose, so it must not push a new page.
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc
      .font('sans')
      .fontSize(6.5)
      .fillColor(MUTED)
      .text(text, PAGE.margin, PAGE.height - PAGE.margin + 8, {
        width: CONTENT_WIDTH,
        align: 'center',
        lineBreak: false,
      });
    doc.page.margins.bottom = bottom;
  }
}

/** The sheet as PDF bytes. */
export function renderFieldSheetPdf(sheet: FieldSheet): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: PAGE.margin,
    bufferPages: true,
    info: {
      Title: `Field sheet: ${sheet.model.name}, revision ${sheet.revision.number}`,
      Creator: 'Bindery',
      Subject: sheet.revision.content_hash,
    },
  });
  doc.registerFont('sans', FONTS.sans);
  doc.registerFont('bold', FONTS.bold);
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const w = new SheetWriter(doc);
  header(w, sheet);
  channelPlan(w, sheet);
  receivers(w, sheet);
  findings(w, sheet);
  cautions(w, sheet);
  footer(doc, sheet);
  doc.end();
  return done;
}
