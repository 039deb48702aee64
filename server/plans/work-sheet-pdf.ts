/**
 * The work sheet as a PDF, made on the server from the same data as the page (shared/work-sheet): the safety
 * caution, the parts as found, each step with its tick-off and notes, and the checks. Sections follow each other
 * without a page break; every page carries the plan's name and "page N of M" (pages are buffered for that).
 */
import PDFDocument from 'pdfkit';
import type { Plan } from '../../shared/engine/index';
import type { AsFoundPart, WorkEntry } from '../../shared/schemas/work-record.schema';
import { SAFETY_COMPACT, SAFETY_TITLE } from '../../shared/work-sheet/safety-words';
import { buildWorkSheet, type WorkSheet } from '../../shared/work-sheet/work-sheet';

export interface WorkSheetPdfInput {
  plan: Plan;
  asFound: AsFoundPart[];
  recordedAt: string | null;
  entries: WorkEntry[];
  /** Tests turn compression off to read the text of the pages. */
  compress?: boolean;
}

const MARGIN = 50;
const day = (iso: string) => iso.slice(0, 10);
const count = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

type Doc = InstanceType<typeof PDFDocument>;

function heading(doc: Doc, text: string) {
  doc.moveDown(0.8).font('Helvetica-Bold').fontSize(13).text(text).moveDown(0.3);
  doc.font('Helvetica').fontSize(10);
}

function tickLine(doc: Doc, entry: WorkEntry | undefined) {
  const done = entry?.done
    ? `[x] done ${day(entry.doneAt ?? entry.updatedAt)} by ${entry.initials}`
    : '[  ] done ____  initials ____';
  doc.font('Helvetica-Oblique').text(done, { indent: 14 });
  if (entry?.note) doc.text(`Found: ${entry.note}`, { indent: 14 });
  doc.font('Helvetica');
}

function asFoundSection(
  doc: Doc,
  parts: AsFoundPart[],
  recordedAt: string | null,
  notes: Map<string, WorkEntry>,
) {
  heading(doc, 'As found, before any lead change');
  doc.text(
    recordedAt
      ? `Recorded ${day(recordedAt)}. Put these leads back to undo the work.`
      : 'Not recorded yet: these are the leads as the plan has them before its lead changes.',
  );
  for (const part of parts) {
    doc.moveDown(0.4).font('Helvetica-Bold').text(`${part.name} (${part.templateTitle})`).font('Helvetica');
    doc.moveDown(0.2);
    leadTable(doc, part);
    const note = notes.get(`part:${part.partId}`)?.note;
    if (note) doc.font('Helvetica-Oblique').text(`Found: ${note}`).font('Helvetica');
  }
}

const HEAD = { type: 'TH' as const, backgroundColor: '#eef1f4', font: { src: 'Helvetica-Bold' } };

/** One part's leads as a table, as the page draws them: pair and colour, tip, ring, pins, what they carry. */
function leadTable(doc: Doc, part: AsFoundPart) {
  doc.fontSize(9);
  const table = doc.table({
    columnStyles: [88, 44, 44, 52, '*'],
    defaultStyle: { border: 0.5, borderColor: '#b8c2cc', padding: [2, 4] },
  });
  table.row(['Pair', 'Tip', 'Ring', 'Pins (T, R)', 'Carries'].map((text) => ({ text, ...HEAD })));
  for (const l of part.leads)
    table.row([
      { text: `${l.pair} ${l.colour}`, font: { src: 'Helvetica-Bold' } },
      l.tip ?? '—',
      l.ring ?? '—',
      `${l.pins.tip}, ${l.pins.ring}`,
      l.purpose ?? '',
    ]);
  table.end();
  doc.x = MARGIN;
  doc.fontSize(10);
}

function stepsSection(doc: Doc, sheet: WorkSheet, entries: Map<string, WorkEntry>) {
  heading(doc, 'Steps');
  if (!sheet.stepCount) doc.text('No lead changes in this plan: nothing to change at the bench.');
  for (const part of sheet.parts) {
    doc.moveDown(0.4).font('Helvetica-Bold').text(`${part.name}: ${part.station}`).font('Helvetica');
    for (const step of part.steps) {
      doc.text(`Step ${step.step}. ${step.action} Cost: ${step.cost}`);
      tickLine(doc, entries.get(step.key));
    }
  }
  for (const row of sheet.crossConnect) {
    doc.text(`Step ${row.step}. KSU cross-connect: ${row.action}`);
    tickLine(doc, entries.get(row.key));
  }
  for (const kept of sheet.crossConnectKept)
    doc.text(
      `KSU port ${kept.port}, pair ${kept.pair} (${kept.colour.name}) differs from the standard station plan ` +
        `(${kept.planned.join('; ') || 'nothing'}), but changing it cures nothing: leave it as wired.`,
    );
}

function checksSection(doc: Doc, sheet: WorkSheet) {
  heading(doc, 'Check afterwards');
  for (const f of sheet.findings) doc.text(`${f.severity === 'fault' ? 'Fault' : 'Warning'}: ${f.message}`);
  for (const m of sheet.requiredFailures) doc.text(`Still failing: ${m}`);
  for (const c of sheet.handChecks) doc.text(`${c.subject}: ${c.text}  [  ] works  initials ____`);
  if (!sheet.handChecks.length) doc.text('The plan requires no function to test.');
}

export function workSheetPdf(input: WorkSheetPdfInput): Promise<Buffer> {
  const { plan, compress = true } = input;
  const sheet = buildWorkSheet(plan);
  const entries = new Map(input.entries.map((e) => [e.key, e]));
  const doc = new PDFDocument({
    size: 'A4',
    margin: MARGIN,
    bufferPages: true,
    compress,
    info: { Title: `Work sheet: ${plan.name}`, Creator: 'Leadbench' },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  doc.font('Helvetica-Bold').fontSize(18).text(`Work sheet: ${plan.name}`);
  doc
    .font('Helvetica')
    .fontSize(10)
    .text(
      `${count(sheet.setCount, 'set')}, ${count(sheet.addOnCount, 'add-on')}, ${count(sheet.stepCount, 'step')}`,
    );
  doc.moveDown(0.6).font('Helvetica-Bold').text(SAFETY_TITLE).font('Helvetica').text(SAFETY_COMPACT);
  asFoundSection(doc, input.asFound, input.recordedAt, entries);
  stepsSection(doc, sheet, entries);
  checksSection(doc, sheet);

  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    // The footer sits in the bottom margin; with the margin at zero pdfkit does not start a new page for it.
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc
      .fontSize(8)
      .text(
        `${plan.name} · page ${i + 1 - range.start} of ${range.count}`,
        MARGIN,
        doc.page.height - MARGIN + 16,
        {
          width: doc.page.width - 2 * MARGIN,
          align: 'center',
          lineBreak: false,
        },
      );
    doc.page.margins.bottom = bottom;
  }
  doc.end();
  return done;
}
