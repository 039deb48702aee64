/**
 * A visitor tries the Bench without an account: from the landing page straight onto the demo installation, where
 * the sets operate in the browser; nothing asks them to sign in. Creating an account from the offer on the Bench
 * keeps what they changed as a plan of the new account.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import {
  expectPickUpLightsLine,
  newAccount,
  screenshot,
  startJourney,
  waitForPath,
  type BrowserSession,
} from '../support/browser';

const baseUrl = inject('baseUrl');
const chromiumPath = inject('chromiumPath');

const GUEST_NAME = 'Counter by the door';

describe.skipIf(!chromiumPath)('the guest bench', () => {
  let session: BrowserSession;
  let page: Page;
  let errors: string[];

  beforeAll(async () => {
    ({ session, page, errors } = await startJourney(chromiumPath, { width: 1440, height: 900 }));
  });

  afterAll(async () => {
    await session?.close();
  });

  it('starts the demo installation from the landing page without an account', async () => {
    await page.goto(`${baseUrl}/`);
    await page.getByTestId('landing-cta').click();
    await waitForPath(page, '/try');
    await page.getByTestId('guest-banner').waitFor();
    await page.getByTestId('node-front-counter').waitFor();
    expect(await page.getByRole('heading', { name: 'Sign in to Leadbench' }).count()).toBe(0);
    await screenshot(page, 'guest-bench-1-demo');
  });

  it('lifts a handset and the line lamp changes', async () => {
    await expectPickUpLightsLine(page, 'front-counter', 1);
    expect(new URL(page.url()).pathname).toBe('/try');
  });

  it('keeps the changed drawing as a plan after creating an account from the offer', async () => {
    await page.getByTestId('node-front-counter').click({ position: { x: 12, y: 12 } });
    await page.getByTestId('panel-tab-card').click();
    const name = page.locator('#lb-part-name');
    await name.fill(GUEST_NAME);
    await name.press('Enter');
    await page.getByTestId('node-front-counter').getByText(GUEST_NAME).waitFor();

    await page.getByTestId('guest-keep').click();
    await waitForPath(page, '/sign-up');
    const account = newAccount('guest');
    await page.getByLabel('Your name').fill(account.displayName);
    await page.getByLabel('E-mail').fill(account.email);
    await page.getByLabel('Password').fill(account.password);
    await page.getByRole('button', { name: 'Create account' }).click();

    await page.waitForURL((url) => /^\/plans\/[^/]+$/.test(url.pathname));
    await page.getByTestId('node-front-counter').getByText(GUEST_NAME).waitFor();
    expect(await page.getByTestId('guest-banner').count()).toBe(0);
    await page.getByTestId('save-state').waitFor();
    await screenshot(page, 'guest-bench-2-kept');
    expect(errors).toEqual([]);
  });
});
