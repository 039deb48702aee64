/**
 * Automated accessibility checks (axe-core, WCAG 2.x rules plus axe's best practices) on the pages a new user
 * meets first, in both themes: nothing rated 'serious' or 'critical' may remain. Axe cannot judge everything
 * (keyboard flow, wording); those are walked in the other journeys.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import {
  openBrowser,
  screenshot,
  seriousViolations,
  signUpToPlans,
  type BrowserSession,
} from '../support/browser';

const baseUrl = inject('baseUrl');
const chromiumPath = inject('chromiumPath');

for (const scheme of ['light', 'dark'] as const) {
  describe.skipIf(!chromiumPath)(`accessibility of the first pages (${scheme} theme)`, () => {
    let session: BrowserSession;

    beforeAll(async () => {
      session = await openBrowser(chromiumPath, undefined, scheme);
    });

    afterAll(async () => {
      await session?.close();
    });

    it('landing page', async () => {
      const { page } = session;
      await page.goto(`${baseUrl}/`);
      await page.getByRole('heading', { level: 1 }).waitFor();
      // Level "serious" and "critical" are axe-core's own impact ratings (axe-core rule descriptions).
      expect(await seriousViolations(page)).toEqual([]);
    });

    it('sign-in page, also with a field error showing', async () => {
      const { page } = session;
      await page.goto(`${baseUrl}/sign-in`);
      await page.getByRole('heading', { name: 'Sign in to Leadbench' }).waitFor();
      expect(await seriousViolations(page)).toEqual([]);

      await page.getByLabel('E-mail').fill('not-an-address');
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByText('Enter a valid e-mail address').waitFor();
      expect(await seriousViolations(page)).toEqual([]);
    });

    it('plans page of a new account', async () => {
      const { page } = session;
      await signUpToPlans(page, baseUrl, `a11y-${scheme}`);
      await page.getByTestId('plan-row').first().waitFor();
      expect(await seriousViolations(page)).toEqual([]);
    });

    it('the Bench with the demo plan open', async () => {
      const { page } = session;
      await page.getByTestId('plan-row').getByRole('link').first().click();
      await page.waitForURL(/\/plans\/[^/]+$/);
      await page.getByRole('heading', { name: /^Findings/ }).waitFor();
      await page.locator('[data-testid^="node-"]').first().waitFor();
      expect(await page.locator('[data-testid^="node-"]').count()).toBeGreaterThan(1);
      await screenshot(page, `bench-demo-${scheme}`);
      expect(await seriousViolations(page)).toEqual([]);
    });

    it('the Bench with sweep results, a chosen finding and a proposed cure', async () => {
      const { page } = session;
      await page.getByTestId('panel-tab-sweep').click();
      await page.getByTestId('sweep-run').click();
      await page.getByTestId('sweep-summary').waitFor({ timeout: 60_000 });
      expect(await seriousViolations(page)).toEqual([]);

      // Put the drawing into the first listed fault's state and open it in Findings with its path.
      await page.getByTestId('sweep-show-0').click();
      await page.getByTestId('panel-tab-findings').click();
      await page.getByTestId('finding-hops-toggle').click();
      await page.getByRole('list', { name: 'Conductor path' }).waitFor();
      await screenshot(page, `bench-demo-traced-${scheme}`);
      expect(await seriousViolations(page)).toEqual([]);

      await page.getByTestId('panel-tab-cure').click();
      await page.getByTestId('cure-run').click();
      await page.getByTestId('cure-message').waitFor({ timeout: 60_000 });
      expect(await seriousViolations(page)).toEqual([]);
    });
  });
}
