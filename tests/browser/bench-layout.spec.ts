/**
 * The Bench on a phone, on tablets both ways round, by keyboard alone, and legible at the default fit: the demo
 * plan (an invented installation of two six-key sets, a hands-free add-on, a bridging adapter and a KSU) as a
 * new account finds it.
 */
import type { Page } from 'playwright-core';
import { afterEach, describe, expect, inject, it } from 'vitest';
import {
  openDemoBench,
  screenshot,
  seriousViolations,
  type BrowserSession,
} from '../support/browser';

const baseUrl = inject('baseUrl');
const chromiumPath = inject('chromiumPath');

/** WCAG 2.2 success criterion 2.5.8 (Target Size, Minimum): 24 by 24 CSS pixels. */
const MIN_TARGET = 24;
/** Smallest rendered text we allow on the drawing: 11 px (common practice, no published source). */
const MIN_TEXT = 11;

let session: BrowserSession | undefined;
afterEach(async () => {
  await session?.close();
  session = undefined;
});

async function openDemo(viewport: { width: number; height: number }, scheme: 'light' | 'dark' = 'light') {
  session = await openDemoBench(chromiumPath, baseUrl, 'layout', viewport, scheme);
  const { page } = session;
  await settledZoom(page);
  return page;
}

/** The canvas zoom, once the opening fit has stopped changing it. */
async function settledZoom(page: Page): Promise<number> {
  const zoom = () =>
    page.evaluate(() => {
      const pane = document.querySelector<HTMLElement>('.vue-flow__transformationpane');
      return Number(/scale\(([\d.]+)\)/.exec(pane?.style.transform ?? '')?.[1] ?? 0);
    });
  let previous = -1;
  await expect
    .poll(
      async () => {
        const now = await zoom();
        const same = now === previous && now > 0;
        previous = now;
        return same;
      },
      { interval: 250, timeout: 10_000 },
    )
    .toBe(true);
  return previous;
}

/** True when the element's box lies wholly inside the window. */
async function onScreen(page: Page, testid: string): Promise<boolean> {
  const box = await page.getByTestId(testid).boundingBox();
  const size = page.viewportSize();
  return (
    !!box &&
    !!size &&
    box.x >= 0 &&
    box.y >= 0 &&
    box.x + box.width <= size.width + 0.5 &&
    box.y + box.height <= size.height + 0.5
  );
}

describe.skipIf(!chromiumPath)('the Bench layouts, keyboard path and legibility', () => {
  it('on a phone (390×844) reaches every panel from a visible button and every tool from one menu', async () => {
    const page = await openDemo({ width: 390, height: 844 });
    expect(await onScreen(page, 'open-panels')).toBe(true);
    expect(await onScreen(page, 'tool-menu')).toBe(true);
    await screenshot(page, 'layout-phone');

    await page.getByTestId('open-panels').click();
    const sheet = page.getByTestId('panels-sheet');
    await sheet.waitFor();
    for (const [tab, heading] of [
      ['findings', /^Findings/],
      ['sweep', /^Sweep/],
      ['cure', /^Cure/],
      ['card', /^Lead card|^Nothing selected|^Select/],
    ] as const) {
      await sheet.getByTestId(`panel-tab-${tab}`).click();
      expect(await onScreen(page, `panel-tab-${tab}`)).toBe(true);
      if (tab !== 'card') await sheet.getByRole('heading', { name: heading }).first().waitFor();
      expect(await sheet.getByRole('tabpanel').filter({ visible: true }).count()).toBe(1);
    }
    await screenshot(page, 'layout-phone-sheet');
    await page.keyboard.press('Escape');
    await sheet.waitFor({ state: 'detached' });

    await page.getByTestId('tool-menu').click();
    for (const key of ['tray', 'panels', 'undo', 'redo', 'fit', 'reset-sim', 'sheet', 'help']) {
      await page.getByTestId(`tool-menu-${key}`).waitFor();
      expect(await onScreen(page, `tool-menu-${key}`)).toBe(true);
    }
    await screenshot(page, 'layout-phone-menu');
    await page.getByTestId('tool-menu-help').click();
    await page.getByTestId('shortcut-help').waitFor();
  });

  for (const viewport of [
    { width: 1024, height: 768 },
    { width: 768, height: 1024 },
  ]) {
    it(`on a tablet (${viewport.width}×${viewport.height}) shows the whole toolbar and opens the panels`, async () => {
      const page = await openDemo(viewport);
      for (const testid of [
        'undo',
        'redo',
        'fit-view',
        'reset-sim',
        'open-work-sheet',
        'shortcut-help-open',
        'show-panels',
      ])
        expect(await onScreen(page, testid), testid).toBe(true);
      await page.getByTestId('show-panels').click();
      await page.getByTestId('panel-tab-findings').waitFor();
      // The drawer slides in; measure once it has arrived.
      await page.waitForFunction(() => document.getAnimations().every((a) => a.playState !== 'running'));
      await page.waitForTimeout(400);
      for (const tab of ['findings', 'card', 'handset', 'sweep', 'cure'])
        expect(await onScreen(page, `panel-tab-${tab}`), tab).toBe(true);
      await screenshot(page, `layout-tablet-${viewport.width}x${viewport.height}`);
    });
  }

  it('by keyboard: from page load a set is lifted within ten Tab or arrow presses', async () => {
    const page = await openDemo({ width: 1280, height: 800 });
    await page.reload();
    await page.locator('[data-testid^="node-"]').first().waitFor();
    await settledZoom(page);
    let moves = 0;
    const press = async (key: string) => {
      if (key === 'Tab' || key.startsWith('Arrow')) moves += 1;
      await page.keyboard.press(key);
    };
    const focused = () =>
      page.evaluate(() => {
        const el = document.activeElement as HTMLElement | null;
        return el?.dataset.testid ?? el?.dataset.partStop ?? el?.tagName ?? '';
      });

    // Past the top bar to the Bench's first tab stop, its skip link to the drawing.
    while ((await focused()) !== 'skip-drawing') {
      expect(moves).toBeLessThan(10);
      await press('Tab');
    }
    await press('Enter');
    // The drawing is one tab stop: it lands on a part, and arrow keys walk the parts to the front-counter set.
    expect(await page.evaluate(() => document.activeElement?.hasAttribute('data-part-stop'))).toBe(true);
    const seen = new Set<string>();
    while (
      (await page.evaluate(() => (document.activeElement as HTMLElement).dataset.partStop)) !==
      'front-counter'
    ) {
      const at = await page.evaluate(() => (document.activeElement as HTMLElement).dataset.partStop ?? '');
      expect(seen.has(at)).toBe(false);
      seen.add(at);
      await press('ArrowRight');
    }
    await press('Enter');
    expect(await focused()).toBe('operate-handset-front-counter');
    await press('Enter');
    expect(moves).toBeLessThanOrEqual(10);
    expect(await page.getByTestId('handset-front-counter').getAttribute('aria-pressed')).toBe('true');
    expect(await page.getByTestId('operate-status-front-counter').innerText()).toMatch(/^Off hook/);
    await screenshot(page, 'layout-keyboard-open-set');

    // Escape closes the panel and gives focus back to the set on the drawing.
    await press('Escape');
    await page.getByTestId('operating-panel').waitFor({ state: 'detached' });
    expect(await focused()).toBe('node-front-counter');
  });

  it('by keyboard: the help lists the drawing keys, and Space then Shift+arrows move a part as it says', async () => {
    const page = await openDemo({ width: 1280, height: 800 });
    const part = page.locator('[data-part-stop="workroom"]');
    await part.focus();
    await page.keyboard.press('?');
    const help = page.getByTestId('shortcut-help');
    await help.waitFor();
    // The help's words for the drawing's keys (the Bench's own, src/components/bench/bench-keys.ts).
    for (const row of [
      'Right arrow or Down arrow | Go to the next part',
      'Space | Select the part (its Lead card shows it)',
      'Shift+Arrow keys | Move the selected part (each step can be undone)',
      'Escape | Close it and go back to the set on the drawing',
    ]) {
      const [keys, does] = row.split(' | ');
      await help
        .locator('tr', { has: page.locator('kbd', { hasText: keys }) })
        .getByText(does)
        .waitFor();
    }
    await screenshot(page, 'layout-shortcut-help');
    // Level "serious" and "critical" are axe-core's own impact ratings (axe-core rule descriptions); the dialog's
    // title is judged too (the kit's card header is levelled by src/components/card-heading.ts).
    expect(await seriousViolations(page)).toEqual([]);
    expect(await help.getByRole('heading', { level: 2, name: 'Keyboard shortcuts' }).count()).toBe(1);
    await page.keyboard.press('Escape');
    await help.waitFor({ state: 'detached' });

    await part.focus();
    await page.keyboard.press(' ');
    await expect.poll(() => part.getAttribute('class')).toContain('lb-node--selected');
    const left = async () => (await part.boundingBox())?.x ?? Number.NaN;
    const before = await left();
    await page.keyboard.press('Shift+ArrowRight');
    await expect.poll(left).toBeGreaterThan(before);
    await expect.poll(() => page.getByTestId('undo').getAttribute('aria-label')).toBe('Undo: Move Workroom');
  });

  it('at 1280×800 and the default fit every canvas label renders at 11 px or more and every key is 24×24 or more', async () => {
    const page = await openDemo({ width: 1280, height: 800 });
    const zoom = await settledZoom(page);
    const small = await page.evaluate(
      ({ zoom, min }) => {
        const found: string[] = [];
        const roots = document.querySelectorAll(
          '.vue-flow__nodes, .vue-flow__edge-labels, .vue-flow__edgelabel-renderer',
        );
        for (const root of roots) {
          const walker = document.createTreeWalker(root, NodeFilter.SHOW_TEXT);
          for (let n = walker.nextNode(); n; n = walker.nextNode()) {
            const el = n.parentElement;
            if (!el || !n.textContent?.trim() || el.closest('.lb-sr-only') || !el.getClientRects().length)
              continue;
            const size = parseFloat(getComputedStyle(el).fontSize) * zoom;
            if (size < min) found.push(`${n.textContent.trim()} (${size.toFixed(1)} px)`);
          }
        }
        return found;
      },
      { zoom, min: MIN_TEXT },
    );
    expect(small).toEqual([]);
    const targets = page.locator('.vue-flow__nodes button');
    expect(await targets.count()).toBeGreaterThan(12);
    for (const target of await targets.all()) {
      const box = await target.boundingBox();
      expect(box, (await target.getAttribute('aria-label')) ?? '').not.toBeNull();
      expect(
        Math.min(box!.width, box!.height),
        (await target.getAttribute('aria-label')) ?? '',
      ).toBeGreaterThanOrEqual(MIN_TARGET);
    }
    await screenshot(page, 'layout-desktop-fit');
  });

  for (const scheme of ['light', 'dark'] as const) {
    it(`axe finds nothing serious on the Bench with a set open (${scheme} theme)`, async () => {
      const page = await openDemo({ width: 1280, height: 800 }, scheme);
      await page.getByTestId('node-workroom').dblclick();
      await page.getByTestId('operating-panel').waitFor();
      await settledZoom(page);
      await screenshot(page, `layout-open-set-${scheme}`);
      // Level "serious" and "critical" are axe-core's own impact ratings (axe-core rule descriptions).
      expect(await seriousViolations(page)).toEqual([]);
    });
  }
});
