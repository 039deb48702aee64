/**
 * Building on the Bench quickly: a plan from empty with two intercom stations and two sets from the tray, saved with
 * no validation fault; Tidy as one undoable step; an add-on spliced into a set's cable by dropping it on the set;
 * and a finding whose conductor path alone stays lit on the drawing. One browser, steps in order.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import {
  createBlankPlan,
  openBrowser,
  screenshot,
  signUpToPlans,
  startJourney,
  type BrowserSession,
} from '../support/browser';

const baseUrl = inject('baseUrl');
const chromiumPath = inject('chromiumPath');

type Box = { x: number; y: number; width: number; height: number };

/** Where each part's node is drawn, by part id (the node wrapper's transform, in drawing units). */
function positions(page: Page): Promise<Record<string, string>> {
  return page.evaluate(() =>
    Object.fromEntries(
      [...document.querySelectorAll<HTMLElement>('.vue-flow__node')].map((n) => [
        n.dataset.id ?? '',
        n.style.transform,
      ]),
    ),
  );
}

/** Every node's box, read in one go (the view may be panning to a part just placed). */
async function nodeBoxes(page: Page): Promise<Box[]> {
  return page.evaluate(() =>
    [...document.querySelectorAll('.vue-flow__node')].map((n) => {
      const r = n.getBoundingClientRect();
      return { x: r.x, y: r.y, width: r.width, height: r.height };
    }),
  );
}

const apart = (a: Box, b: Box) =>
  a.x + a.width <= b.x || b.x + b.width <= a.x || a.y + a.height <= b.y || b.y + b.height <= a.y;

async function centre(page: Page, testid: string) {
  const box = await page.getByTestId(testid).boundingBox();
  if (!box) throw new Error(`${testid} is not on screen`);
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
}

/** Draws a cable from one port handle to another with the mouse. */
async function cable(page: Page, from: string, to: string) {
  const a = await centre(page, from);
  const b = await centre(page, to);
  await page.mouse.move(a.x, a.y);
  await page.mouse.down();
  await page.mouse.move((a.x + b.x) / 2, (a.y + b.y) / 2, { steps: 8 });
  await page.mouse.move(b.x, b.y, { steps: 8 });
  await page.mouse.up();
}

describe.skipIf(!chromiumPath)('building on the Bench', () => {
  let session: BrowserSession;
  let page: Page;
  let errors: string[];

  beforeAll(async () => {
    ({ session, page, errors } = await startJourney(chromiumPath, { width: 1440, height: 900 }));
    await signUpToPlans(page, baseUrl, 'build');
  });

  afterAll(async () => {
    await session?.close();
  });

  it('builds a plan from empty with the tray and sees it saved with no validation fault', async () => {
    await createBlankPlan(page, 'Built from the tray');
    await page.getByTestId('node-ksu').waitFor();

    for (const code of ['21', '22']) {
      const form = page.getByTestId('palette-ksu');
      await form
        .locator('[aria-label="New station code"] input, input[aria-label="New station code"]')
        .fill(code);
      await form.getByRole('button', { name: 'Add', exact: true }).click();
      await page.getByRole('button', { name: `Remove intercom station ${code}` }).waitFor();
    }
    await page.getByTestId('palette-six-key-hf').click();
    await page.getByTestId('node-set-1').waitFor();
    await page.getByTestId('palette-six-key-hf').click();
    await page.getByTestId('node-set-2').waitFor();

    // The KSU and two sets, none drawn over another.
    const boxes = await nodeBoxes(page);
    expect(boxes).toHaveLength(3);
    for (let i = 0; i < boxes.length; i += 1)
      for (let j = i + 1; j < boxes.length; j += 1) expect(apart(boxes[i], boxes[j])).toBe(true);
    // Each part placed is shown: the view pans to one whose free spot lay beyond it.
    const inView = () =>
      page.evaluate(() => {
        const view = document.querySelector('.vue-flow')!.getBoundingClientRect();
        const r = document.querySelector('[data-testid="node-set-2"]')!.getBoundingClientRect();
        return r.left >= view.left && r.right <= view.right && r.top >= view.top && r.bottom <= view.bottom;
      });
    await expect.poll(inView).toBe(true);

    await expect.poll(() => page.getByTestId('save-state').innerText(), { timeout: 15_000 }).toMatch(/Saved/);
    expect(await page.getByTestId('plan-issues').count()).toBe(0);
    await screenshot(page, 'build-1-from-tray');
  });

  it('tidies the drawing in one step and one undo puts every part back', async () => {
    await page.getByTestId('fit-view').click();
    await page.waitForTimeout(400);
    await cable(page, 'port-set-1-cord', 'port-ksu-port-1');
    await expect.poll(() => page.locator('.vue-flow__edge').count()).toBe(1);
    await cable(page, 'port-set-2-cord', 'port-ksu-port-2');
    await expect.poll(() => page.locator('.vue-flow__edge').count()).toBe(2);

    const before = await positions(page);
    await page.getByTestId('tidy').click();
    await expect.poll(async () => JSON.stringify(await positions(page))).not.toBe(JSON.stringify(before));
    await expect
      .poll(() => page.getByTestId('undo').getAttribute('aria-label'))
      .toBe('Undo: Tidy the drawing');
    const tidied = await nodeBoxes(page);
    for (let i = 0; i < tidied.length; i += 1)
      for (let j = i + 1; j < tidied.length; j += 1) expect(apart(tidied[i], tidied[j])).toBe(true);
    await screenshot(page, 'build-2-tidied');

    await page.getByTestId('undo').click();
    await expect.poll(async () => positions(page)).toEqual(before);
  });

  it('splices a hands-free add-on into a set’s cable when dropped on the set', async () => {
    expect(await page.getByTestId('palette-addon-hint').innerText()).toContain(
      "Drop on a set to splice it into the set's cable",
    );
    await page.getByTestId('fit-view').click();
    await page.getByTestId('palette-hands-free-unit').dragTo(page.getByTestId('node-set-1'));
    await page.getByTestId('node-addon-1').waitFor();
    // Set cord → add-on jack, add-on plug → where the set's cable went: one more cable than before.
    await expect.poll(() => page.locator('.vue-flow__edge').count()).toBe(3);
    expect(await page.getByTestId('port-addon-1-set').getAttribute('class')).toContain('lb-port--used');
    expect(await page.getByTestId('port-addon-1-cord').getAttribute('class')).toContain('lb-port--used');
    expect(await page.getByTestId('undo').getAttribute('aria-label')).toMatch(/^Undo: Splice /);
    await screenshot(page, 'build-3-spliced');

    await page.getByTestId('undo').click();
    await expect.poll(() => page.locator('.vue-flow__edge').count()).toBe(2);
    expect(await page.getByTestId('node-addon-1').count()).toBe(0);
  });

  it('lights only the chosen finding’s conductor path and fades the rest', async () => {
    const guest = await openBrowser(chromiumPath, { width: 1440, height: 900 });
    try {
      const p = guest.page;
      await p.goto(`${baseUrl}/try`);
      // The demo installation: four cables; its hands-free private-lead warning runs over three of them
      // (counter cord, speaker cord, workroom cord), not the station cable to the KSU.
      const finding = p.getByTestId('finding-PRIVATE_LEAD_SHARED').first();
      await finding.waitFor();
      expect(await p.locator('.vue-flow__edge').count()).toBe(4);
      await finding.click();
      await p.getByTestId('finding-sentence').waitFor();
      await expect.poll(() => p.locator('.vue-flow__edge.lb-lit').count()).toBe(3);
      expect(await p.locator('.vue-flow__edge.lb-dimmed').count()).toBe(1);
      expect(await p.locator('.vue-flow__node.lb-dimmed').count()).toBe(1);
      expect(await p.locator('.vue-flow__node.lb-dimmed [data-testid="node-ksu"]').count()).toBe(1);
      await screenshot(p, 'build-4-finding-path');

      await finding.click();
      await expect.poll(() => p.locator('.vue-flow__edge.lb-dimmed').count()).toBe(0);
    } finally {
      await guest.close();
    }
    expect(errors).toEqual([]);
  });
});
