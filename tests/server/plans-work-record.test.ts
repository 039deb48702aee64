/**
 * The work record and the PDF work sheet: leads as found kept before any change and never overwritten, tick-offs
 * stamped by the server and refused without initials, and a PDF whose pages carry the plan's name and page count.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import type { PlanRecord } from '../../shared/schemas/plans.schema';
import { WorkEntrySchema, WorkRecordSchema } from '../../shared/schemas/work-record.schema';
import { SAFETY_COMPACT, SAFETY_TITLE } from '../../shared/work-sheet/safety-words';
import { workSheetPdf } from '../../server/plans/work-sheet-pdf';
import { planWithSets, signedInAgent, startTestServer, type TestServer } from './server.harness';
import { createPlan, type Agent } from './plans-fixtures';
import { pdfPageCount, pdfText } from './pdf-text';

let server: TestServer;
let owner: Agent;
let plan: PlanRecord;

/** Desk 1 has its line 1 talk pair lifted: the plan's leads differ from the leads as wired. */
function liftedPlan() {
  const doc = planWithSets(2, 'Harbour work');
  doc.sets[0]!.leadChanges = [{ kind: 'lift', pair: 1, conductor: 'both' }];
  return doc;
}

beforeAll(async () => {
  server = await startTestServer();
  owner = (await signedInAgent(server)).agent;
  plan = await createPlan(owner, liftedPlan());
});
afterAll(async () => {
  await server.close();
});

const record = async () =>
  WorkRecordSchema.parse((await owner.get(`/api/plans/${plan.id}/work-record`)).body);
const tick = (key: string, body: object) =>
  owner.put(`/api/plans/${plan.id}/work-record/entries/${key}`).send(body);

describe('work record', () => {
  it('shows every set as wired, with the lifted pair still in place, before anything is recorded', async () => {
    const r = await record();
    expect(r.recordedAt).toBeNull();
    const desk1 = r.asFound.find((p) => p.partId === 'set-1')!;
    // A six-key set carries five lines on pairs 1–15 and its buzzer on pair 18 (templates/README.md pair plan).
    expect(desk1.leads.map((l) => l.pair)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 18]);
    // Pair 1 is white-blue (ICEA S-80-576), tip on pin 26, ring on pin 1 (USOC RJ21X).
    expect(desk1.leads[0]).toMatchObject({ pair: 1, colour: 'white-blue', pins: { tip: 26, ring: 1 } });
    expect(desk1.leads[0]!.tip).not.toBeNull();
  });

  it('refuses a tick without initials, a note too long and a key that names no step', async () => {
    const none = await tick('step:set-1:1', { done: true });
    expect(none.status).toBe(400);
    expect(ErrorBodySchema.parse(none.body).error.details?.initials).toEqual([
      'Write your initials to tick a step off',
    ]);
    expect((await tick('step:set-1:1', { done: false, note: 'x'.repeat(1001) })).status).toBe(400);
    expect((await tick('wiring', { done: false })).status).toBe(400);
    expect((await record()).entries).toEqual([]);
    expect((await record()).recordedAt).toBeNull(); // nothing refused was kept, not even the as-found record
  });

  it('stamps the date of a tick once, keeps initials and notes, and clears the date when unticked', async () => {
    const first = WorkEntrySchema.parse(
      (await tick('step:set-1:1', { done: true, initials: ' JMK ', note: 'Pair 1 was already loose' })).body,
    );
    expect(first).toMatchObject({ done: true, initials: 'JMK', note: 'Pair 1 was already loose' });
    expect(Date.parse(first.doneAt!)).toBeGreaterThan(Date.now() - 60_000);
    const again = WorkEntrySchema.parse((await tick('step:set-1:1', { done: true, initials: 'JMK' })).body);
    expect(again.doneAt).toBe(first.doneAt);
    await tick('part:set-2', { done: false, note: 'Cord replaced at some time, colours faded' });
    const r = await record();
    expect(r.entries.map((e) => e.key)).toEqual(['part:set-2', 'step:set-1:1']);
    const off = WorkEntrySchema.parse((await tick('step:set-1:1', { done: false, initials: 'JMK' })).body);
    expect(off).toMatchObject({ done: false, doneAt: null });
  });

  it('keeps the as-found record from the first tick, whatever the plan becomes later', async () => {
    const kept = await record();
    expect(kept.recordedAt).not.toBeNull();
    const doc = liftedPlan();
    doc.sets[1]!.leadChanges = [{ kind: 'lift', pair: 18, conductor: 'both' }];
    doc.sets.push({ ...doc.sets[1]!, id: 'set-3', name: 'Desk 3', leadChanges: [] });
    const saved = await owner
      .put(`/api/plans/${plan.id}`)
      .send({ document: doc, baseUpdatedAt: plan.updatedAt });
    expect(saved.status).toBe(200);
    const after = await record();
    expect(after.asFound.map((p) => p.partId)).toEqual(['set-1', 'set-2']);
    expect(after.recordedAt).toBe(kept.recordedAt);
    const again = await owner.post(`/api/plans/${plan.id}/work-record/as-found`);
    expect(again.status).toBe(201);
    expect(WorkRecordSchema.parse(again.body).asFound.map((p) => p.partId)).toEqual(['set-1', 'set-2']);
  });
});

describe('PDF work sheet', () => {
  it('answers a PDF with one page object per page', async () => {
    const res = await owner
      .get(`/api/plans/${plan.id}/work-sheet.pdf`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-'); // PDF 1.7 (ISO 32000-1) §7.5.2 file header
    expect(pdfPageCount(pdf)).toBeGreaterThanOrEqual(1);
  });

  it('prints the caution, the as-found leads, the tick-offs and "page N of M" on every page', async () => {
    const doc = planWithSets(12, 'Long sheet');
    for (const s of doc.sets) s.leadChanges = [{ kind: 'lift', pair: 18, conductor: 'both' }];
    const entries = [
      {
        key: 'step:set-1:1',
        done: true,
        doneAt: '2026-03-14T09:30:00.000Z',
        initials: 'AB',
        note: 'Buzzer lead green, not yellow',
        updatedAt: '2026-03-14T09:30:00.000Z',
      },
    ];
    const { asFound } = await import('../../shared/work-sheet/as-found');
    const pdf = await workSheetPdf({
      plan: doc,
      asFound: asFound(doc),
      recordedAt: null,
      entries,
      compress: false,
    });
    const pages = pdfText(pdf);
    // 12 six-key sets list 16 lead pairs each: more than one A4 page, so the footer is checked on several.
    expect(pages.length).toBeGreaterThan(1);
    expect(pdfPageCount(pdf)).toBe(pages.length);
    pages.forEach((text, i) => expect(text).toContain(`Long sheet · page ${i + 1} of ${pages.length}`));
    const all = pages.join('\n');
    expect(all).toContain(SAFETY_TITLE);
    expect(all.replace(/\s+/g, ' ')).toContain(SAFETY_COMPACT.slice(0, 60));
    expect(all).toContain('18 yellow-green'); // pair 18 is yellow-green (ICEA S-80-576)
    expect(all).toContain('Pins (T, R)'); // the as-found leads are a table with its header row
    expect(all).toContain('[x] done 2026-03-14 by AB');
    expect(all).toContain('Found: Buzzer lead green, not yellow');
    // Sections flow on: the steps heading is not alone at the top of a fresh page after the as-found list.
    const stepsPage = pages.findIndex((t) => t.includes('Steps'));
    expect(pages[stepsPage]!.indexOf('Steps')).toBeGreaterThan(0);
  });
});
