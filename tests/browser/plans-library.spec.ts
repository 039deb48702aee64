/**
 * The plans library, walked as a restorer would: create, rename, duplicate, delete and take it back, export a
 * plan and import the file again (and a broken one), compare two revisions and restore one, share by link and
 * open that link as another person. One browser, each test continues where the previous one left off.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import {
  createBlankPlan,
  newAccount,
  signOut,
  signUp,
  signUpToPlans,
  startJourney,
  waitForPath,
  type BrowserSession,
} from '../support/browser';

const baseUrl = inject('baseUrl');
const chromiumPath = inject('chromiumPath');

const FIRST_NAME = 'Parlour workshop';
const NEW_NAME = 'Parlour workshop, rewired';

describe.skipIf(!chromiumPath)('the plans library', () => {
  let session: BrowserSession;
  let page: Page;
  let errors: string[];
  let linkPath = '';
  let sharedPlanId = '';
  const files = mkdtempSync(join(tmpdir(), 'leadbench-plan-files-'));

  const rows = () => page.getByTestId('plan-row');
  const row = (name: string): Locator =>
    rows().filter({ has: page.getByRole('link', { name, exact: true }) });
  // The tab bar draws its tabs as plain elements, not with the tab role.
  const tab = (name: string) => page.locator('.n-tabs-tab').filter({ hasText: name });
  const toast = (text: string | RegExp) => page.locator('.n-message').filter({ hasText: text });

  /** Opens the row's action menu and picks one entry. */
  async function act(name: string, action: string): Promise<void> {
    // A menu closed a moment ago fades out for a while; wait until it has gone so only the new one is picked from.
    await expect.poll(() => page.locator('.n-dropdown-menu:visible').count(), { timeout: 10_000 }).toBe(0);
    await row(name)
      .getByRole('button', { name: `Actions for ${name}` })
      .click();
    await page
      .locator('.n-dropdown-option:visible')
      .filter({ hasText: new RegExp(`^${action.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}$`) })
      .last()
      .click();
  }

  async function expectRows(count: number): Promise<void> {
    await expect.poll(() => rows().count(), { timeout: 10_000 }).toBe(count);
  }

  beforeAll(async () => {
    ({ session, page, errors } = await startJourney(chromiumPath));
    await signUpToPlans(page, baseUrl, 'library');
  });

  afterAll(async () => {
    await session?.close();
    rmSync(files, { recursive: true, force: true });
  });

  it('creates an empty plan and finds it in the table', async () => {
    // A new account holds one copy of the demo installation (server/auth/auth.service.ts).
    await expectRows(1);
    await createBlankPlan(page, FIRST_NAME);
    await page.goto(`${baseUrl}/plans`);
    await row(FIRST_NAME).waitFor();
    await expectRows(2);
    await expect.poll(() => page.getByTestId('plans-usage').innerText()).toMatch(/^2 of \d+ plans/);
  });

  it('on a phone keeps plan names on one line and scrolls the table sideways', async () => {
    await page.setViewportSize({ width: 390, height: 844 });
    try {
      await page.goto(`${baseUrl}/plans`);
      const name = row(FIRST_NAME).getByRole('link', { name: FIRST_NAME, exact: true });
      await name.waitFor();
      const box = await name.boundingBox();
      const lineHeight = await name.evaluate((el) => parseFloat(getComputedStyle(el).lineHeight) || 20);
      // "Parlour workshop" fits one line at 180 px; a column squeezed to a few letters wraps it over many lines.
      expect(box!.height).toBeLessThan(lineHeight * 1.5);
      // The table is wider than the phone, yet the page itself does not scroll sideways: the table does.
      const tableWidth = await page.locator('table').first().evaluate((el) => el.getBoundingClientRect().width);
      expect(tableWidth).toBeGreaterThan(390);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    } finally {
      await page.setViewportSize({ width: 1280, height: 800 });
    }
  });

  it('finds plans by a server-side search and sorts by name', async () => {
    await page.getByLabel('Search plans').fill('parlour');
    await expectRows(1);
    await page.getByLabel('Search plans').fill('no such plan anywhere');
    await page.getByText('No plans match').waitFor();
    await page.getByLabel('Search plans').fill('');
    await expectRows(2);
    const names = async () => (await rows().getByRole('link').allInnerTexts()).map((t) => t.trim());
    // The demo installation's name is in shared/engine/examples/demo-plan.json.
    const byName = ['Harbour Street Bindery', FIRST_NAME];
    const asked = page.waitForRequest(/\/api\/plans\?.*sort=name/, { timeout: 5000 });
    await page.getByRole('columnheader', { name: 'Name' }).click();
    await asked;
    // The table's first click on a column sorts it descending, the second ascending.
    await expect.poll(names, { timeout: 10_000 }).toEqual([...byName].reverse());
    await page.getByRole('columnheader', { name: 'Name' }).click();
    await expect.poll(names, { timeout: 10_000 }).toEqual(byName);
  });

  it('renames a plan', async () => {
    await act(FIRST_NAME, 'Rename…');
    await page.getByLabel('Plan name').fill(NEW_NAME);
    await page.getByRole('button', { name: 'Rename', exact: true }).click();
    await row(NEW_NAME).waitFor();
    expect(await row(FIRST_NAME).count()).toBe(0);
  });

  it('duplicates a plan, deletes the copy, takes the delete back and restores from Recently deleted', async () => {
    const copy = `Copy of ${NEW_NAME}`; // server/plans/plans.routes.ts names copies this way
    await act(NEW_NAME, 'Duplicate');
    await row(copy).waitFor();
    await expectRows(3);

    await act(copy, 'Delete');
    await expectRows(2);
    await toast('moved to Recently deleted').getByRole('button', { name: 'Undo' }).click();
    await row(copy).waitFor();
    await expectRows(3);

    await act(copy, 'Delete');
    await expectRows(2);
    await tab('Recently deleted').click();
    await expectRows(1);
    await rows().getByRole('button', { name: 'Restore' }).click();
    await toast('is back in My plans').last().waitFor();
    await page.getByTestId('plans-empty').waitFor();
    await tab('My plans').click();
    await expectRows(3);
  });

  it('compares two revisions and restores the first', async () => {
    // Created, then renamed: two revisions.
    await act(NEW_NAME, 'Revisions…');
    const drawer = page.locator('.n-drawer');
    await expect.poll(() => drawer.getByTestId('revision-row').count()).toBeGreaterThanOrEqual(2);
    const changes = drawer.getByTestId('compare-changes');
    await changes.getByText(`Renamed from “${FIRST_NAME}” to “${NEW_NAME}”`).waitFor();
    await drawer.getByRole('button', { name: 'Restore revision 1' }).click();
    await toast(/Revision 1 restored as revision \d+/).waitFor();
    await page.keyboard.press('Escape');
    await row(FIRST_NAME).waitFor();
  });

  it('shares a plan by link and opens it as another person', async () => {
    await act(FIRST_NAME, 'Share…');
    await page.getByTestId('share-link').click();
    const url = await page.getByLabel('New share link').inputValue();
    // Link secrets are 32 random bytes in base64url, 43 characters (shared/schemas/plan-shares.schema.ts).
    expect(url).toMatch(/\/shared\/[A-Za-z0-9_-]{43}$/);
    linkPath = new URL(url).pathname;
    await page.getByTestId('share-item').first().waitFor();
    await page.keyboard.press('Escape');
    sharedPlanId = (await row(FIRST_NAME).getAttribute('data-plan-id')) ?? '';
    expect(sharedPlanId).not.toBe('');
    await row(FIRST_NAME).getByText('Shared', { exact: true }).waitFor();

    await signOut(page);
    await signUp(page, baseUrl, newAccount('library-guest', 'Guest Viewer'));
    await waitForPath(page, '/plans');
    await page.goto(`${baseUrl}${linkPath}`);
    await waitForPath(page, `/plans/${sharedPlanId}`);

    await page.goto(`${baseUrl}/plans`);
    await tab('Shared with me').click();
    await row(FIRST_NAME).waitFor();
    await expectRows(1);
  });

  it('as the other person, exports the shared plan and imports the file into their own plans; a broken file is refused with the place named', async () => {
    await tab('Shared with me').click();
    await row(FIRST_NAME).waitFor();
    const download = page.waitForEvent('download');
    await row(FIRST_NAME)
      .getByRole('button', { name: `Actions for ${FIRST_NAME}` })
      .click();
    await page.locator('.n-dropdown-option:visible').filter({ hasText: 'Export file' }).locator('a').click();
    const file = await download;
    const exported = join(files, file.suggestedFilename());
    await file.saveAs(exported);
    const document = JSON.parse(readFileSync(exported, 'utf8')) as { name: string };
    expect(document.name).toBe(FIRST_NAME);

    await tab('My plans').click();
    // The guest's own copy of the demo installation.
    await expectRows(1);
    await page.getByTestId('import-file').setInputFiles(exported);
    await toast(`Imported “${FIRST_NAME}”`).waitFor();
    await expectRows(2);
    await row(FIRST_NAME).waitFor();

    const broken = join(files, 'broken.json');
    writeFileSync(broken, JSON.stringify({ ...document, name: '' }));
    await page.getByTestId('import-file').setInputFiles(broken);
    const refusal = page.locator('.n-dialog').filter({ hasText: 'broken.json was not imported' });
    await refusal.getByText(/^The file was not imported\. name: /).waitFor();
    await refusal.getByRole('button', { name: 'OK' }).click();
    await expectRows(2);
  });

  it('threw no errors in the page', () => {
    expect(errors).toEqual([]);
  });
});
