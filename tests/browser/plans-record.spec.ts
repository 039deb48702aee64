/**
 * The work record and the photos, walked as a restorer would: attach a photo of a set's wiring and see its
 * thumbnail, have a text file posing as a picture refused with nothing kept, open the work sheet, see the sets as
 * found, tick a step off with initials and find it still ticked after a reload, and download the PDF sheet.
 */
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import demoPlan from '../../shared/engine/examples/demo-plan.json';
import { screenshot, signUpToPlans, startJourney, type BrowserSession } from '../support/browser';

const baseUrl = inject('baseUrl');
const chromiumPath = inject('chromiumPath');

describe.skipIf(!chromiumPath)('the work record and photos', () => {
  let session: BrowserSession;
  let page: Page;
  let errors: string[];
  let planId = '';
  const photoItems = () => page.getByTestId('part-photos').getByTestId('photo-item');

  beforeAll(async () => {
    ({ session, page, errors } = await startJourney(chromiumPath));
    await signUpToPlans(page, baseUrl, 'record');
    // The demo installation with the Workroom set's buzzer pair lifted: one lead change, so one step to tick.
    const document = {
      ...demoPlan,
      name: 'Bindery, work in hand',
      sets: demoPlan.sets.map((s) =>
        s.id === 'workroom' ? { ...s, leadChanges: [{ kind: 'lift', pair: 18, conductor: 'both' }] } : s,
      ),
    };
    const created = await page.request.post(`${baseUrl}/api/plans`, { data: { document } });
    expect(created.status()).toBe(201);
    planId = ((await created.json()) as { id: string }).id;
  });

  afterAll(async () => {
    await session?.close();
  });

  it('attaches a photo to a set and shows its thumbnail', async () => {
    await page.goto(`${baseUrl}/plans/${planId}`);
    await page.getByTestId('node-workroom').locator('.lb-node__name').click();
    await page.getByTestId('panel-tab-card').click();
    const gallery = page.getByTestId('part-photos');
    await gallery.waitFor();
    const png = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#9b4a2c' } })
      .png()
      .toBuffer();
    await gallery
      .getByTestId('photo-file')
      .setInputFiles({ name: 'cord-entry.png', mimeType: 'image/png', buffer: png });
    await expect.poll(() => photoItems().count(), { timeout: 10_000 }).toBe(1);
    const thumb = gallery.getByTestId('photo-thumb').first();
    await screenshot(page, 'plans-record-photo');
    // The thumbnail really loaded: the browser decoded a picture with a width.
    await expect
      .poll(() => thumb.evaluate((img) => (img as HTMLImageElement).naturalWidth), { timeout: 10_000 })
      .toBeGreaterThan(0);
  });

  it('refuses a text file named .jpg with a clear message and keeps nothing', async () => {
    const gallery = page.getByTestId('part-photos');
    await gallery.getByTestId('photo-file').setInputFiles({
      name: 'wiring.jpg',
      mimeType: 'image/jpeg',
      buffer: Buffer.from('these are words, not a picture'),
    });
    const problem = gallery.getByTestId('photo-error');
    await problem.waitFor();
    expect(await problem.innerText()).toBe('That file is not a JPEG, PNG or WebP picture.');
    const listed = await page.request.get(`${baseUrl}/api/plans/${planId}/photos?part=workroom`);
    expect(((await listed.json()) as { items: unknown[] }).items).toHaveLength(1);
    expect(await photoItems().count()).toBe(1);
  });

  it('shows the sets as found and keeps a ticked step with its initials after a reload', async () => {
    await page.goto(`${baseUrl}/plans/${planId}/sheet`);
    const asFound = page.getByTestId('sheet-as-found');
    await asFound.waitFor();
    // As wired, before the lift: the Workroom set still lists its buzzer pair 18, yellow-green (ICEA S-80-576).
    expect(await page.getByTestId('as-found-workroom').innerText()).toContain('18 yellow-green');
    expect(await page.getByTestId('sheet-as-found-status').innerText()).toContain('Not recorded yet');

    await page.getByTestId('initials-step:workroom:1').fill('JMK');
    // The box shows what the server kept, so it turns on once the tick is saved (a plain click, not check()).
    await page.getByTestId('tick-step:workroom:1').click();
    await page.getByTestId('done-at-step:workroom:1').waitFor();
    await expect.poll(() => page.getByTestId('sheet-as-found-status').innerText()).toContain('Recorded');

    await screenshot(page, 'plans-record-sheet-ticked');
    await page.reload();
    await page.getByTestId('sheet-as-found').waitFor();
    await page.getByTestId('done-at-step:workroom:1').waitFor();
    expect(await page.getByTestId('tick-step:workroom:1').isChecked()).toBe(true);
    expect(await page.getByTestId('initials-step:workroom:1').inputValue()).toBe('JMK');
  });

  it('downloads the work sheet as a PDF', async () => {
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByTestId('sheet-pdf').click(),
    ]);
    const file = readFileSync((await download.path())!);
    expect(file.subarray(0, 5).toString('latin1')).toBe('%PDF-'); // PDF 1.7 (ISO 32000-1) §7.5.2 file header
    const answer = await page.request.get(`${baseUrl}/api/plans/${planId}/work-sheet.pdf`);
    expect(answer.headers()['content-type']).toBe('application/pdf');
    expect(errors).toEqual([]);
  });
});
