/**
 * A plan shared to view, opened on the Bench by the person it is shared with: the owner (a demo account) shares the
 * demo plan with another demo account by e-mail through the API; the viewer opens it read-only, operates a set,
 * finds no way to add a part, and duplicates it into their own plans, where it can be changed.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import demo from '../../shared/engine/examples/demo-plan.json';
import {
  DEMO_ACCOUNTS,
  DEMO_PASSWORD,
  expectPickUpLightsLine,
  screenshot,
  signIn,
  startJourney,
  waitForPath,
  type BrowserSession,
} from '../support/browser';

const baseUrl = inject('baseUrl');
const chromiumPath = inject('chromiumPath');

/** Signs the owner in through the API and returns the session cookie for the next calls. */
async function apiSignIn(email: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  expect(res.status).toBe(200);
  const cookie = res.headers.getSetCookie().find((c) => c.includes('session'));
  if (!cookie) throw new Error('The sign-in answer set no session cookie');
  return cookie.split(';')[0]!;
}

describe.skipIf(!chromiumPath)('a plan shared to view, on the Bench', () => {
  let session: BrowserSession;
  let page: Page;
  let errors: string[];
  let planId = '';
  let planName = '';

  beforeAll(async () => {
    const cookie = await apiSignIn(DEMO_ACCOUNTS.restorer);
    const list = await fetch(`${baseUrl}/api/plans?scope=mine&pageSize=100`, { headers: { cookie } });
    const { items } = (await list.json()) as { items: { id: string; name: string }[] };
    // Every demo account starts with the demo installation (server/seed-demo.ts).
    const shared = items.find((p) => p.name === demo.name) ?? items[0]!;
    planId = shared.id;
    planName = shared.name;
    const share = await fetch(`${baseUrl}/api/plans/${planId}/shares`, {
      method: 'POST',
      headers: { cookie, 'Content-Type': 'application/json' },
      body: JSON.stringify({ kind: 'user', email: DEMO_ACCOUNTS.instructor }),
    });
    expect(share.status).toBe(201);

    ({ session, page, errors } = await startJourney(chromiumPath, { width: 1440, height: 900 }));
    await signIn(page, baseUrl, DEMO_ACCOUNTS.instructor);
    await waitForPath(page, '/plans');
  });

  afterAll(async () => {
    await session?.close();
  });

  it('opens read-only with a banner that says so', async () => {
    await page.goto(`${baseUrl}/plans/${planId}`);
    const banner = page.getByTestId('read-only-banner');
    await banner.waitFor();
    expect(await banner.innerText()).toMatch(/shared this plan with you to view/);
    expect(await page.getByTestId('save-state').count()).toBe(0);
    await screenshot(page, 'bench-viewer-1-read-only');
  });

  it('operates a set: a line key and the handset light the line', async () => {
    await expectPickUpLightsLine(page, 'front-counter', 1);
    expect(await page.getByTestId('handset-front-counter').getAttribute('aria-pressed')).toBe('true');
  });

  it('offers no way to add a part', async () => {
    expect(await page.locator('[data-testid^="palette-"]').count()).toBe(0);
    // Nodes cannot be dragged or cabled either (vue-flow marks draggable nodes with this class).
    expect(await page.locator('.vue-flow__node.draggable').count()).toBe(0);
  });

  it('duplicates it into the viewer’s own plans, which open for changes', async () => {
    await page.getByTestId('duplicate-plan').click();
    await page.waitForURL((url) => /^\/plans\/[^/]+$/.test(url.pathname) && !url.pathname.endsWith(planId));
    await page.getByTestId('palette-six-key').waitFor();
    expect(await page.getByTestId('read-only-banner').count()).toBe(0);
    expect(await page.locator('.lb-toolbar__name').innerText()).toBe(`Copy of ${planName}`);
    await screenshot(page, 'bench-viewer-2-own-copy');
    expect(errors).toEqual([]);
  });
});
