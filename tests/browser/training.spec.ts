/**
 * Training in Chromium: the demo instructor makes a class and invites a new trainee (the link read from a fake
 * SMTP server this file starts), the trainee joins, works a puzzle to a correct repair, the instructor sees the
 * score in the gradebook and exports it as CSV; the projector view steps through the seeded demonstration by
 * keyboard. The server is started here (not by the shared setup) so its mail goes to this file's fake SMTP server.
 * The 16 px floor for projected text is our own rule for a room projector at 1920×1080 (no published source).
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp';
import { freePort } from './global-setup';
import {
  DEMO_ACCOUNTS,
  collectPageErrors,
  newAccount,
  openBrowser,
  screenshot,
  signIn,
  waitForPath,
  type BrowserSession,
} from '../support/browser';

const chromiumPath = inject('chromiumPath');

/** Picks an option of a naive-ui select: open it, click the option with this text. */
async function choose(page: Page, select: Locator, option: string | RegExp): Promise<void> {
  await select.click();
  await page.locator('.n-base-select-option:visible', { hasText: option }).first().click();
}

describe.skipIf(!chromiumPath)('training: classes, a fault hunt, the gradebook and the projector', () => {
  let smtp: FakeSmtp;
  let child: ChildProcess | undefined;
  let dir = '';
  let baseUrl = '';
  let instructor: BrowserSession;
  let trainee: BrowserSession;
  const account = newAccount('trainee', 'Journey Trainee');
  const className = `Journey class ${Date.now().toString(36)}`;

  beforeAll(async () => {
    smtp = await startFakeSmtp();
    dir = mkdtempSync(join(tmpdir(), 'leadbench-training-browser-'));
    const clientDir = join(dir, 'client');
    const build = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn', '--outDir', clientDir, '--emptyOutDir'], { stdio: 'inherit' });
    if (build.status !== 0) throw new Error('Building the client failed');
    const port = await freePort();
    baseUrl = `http://localhost:${port}`;
    let log = '';
    child = spawn('npx', ['tsx', 'server/index.ts'], {
      env: {
        ...process.env,
        PORT: String(port),
        DATABASE_FILE: join(dir, 'training.sqlite'),
        CLIENT_DIR: clientDir,
        LOG_LEVEL: 'warn',
        RATE_LIMIT_MAX: '1000',
        MAIL_HOST: smtp.host,
        MAIL_PORT: String(smtp.port),
        PUBLIC_ORIGIN: baseUrl,
        NODE_ENV: 'test',
      },
      stdio: ['ignore', 'pipe', 'pipe'],
      detached: true,
    });
    child.stdout?.on('data', (d) => (log += d));
    child.stderr?.on('data', (d) => (log += d));
    const deadline = Date.now() + 90_000;
    while (!(await fetch(`${baseUrl}/api/health`).catch(() => null))?.ok) {
      if (child.exitCode !== null || Date.now() > deadline) throw new Error(`The server did not start:\n${log}`);
      await new Promise((r) => setTimeout(r, 250));
    }
    instructor = await openBrowser(chromiumPath);
    trainee = await openBrowser(chromiumPath);
  });

  afterAll(async () => {
    await instructor?.close();
    await trainee?.close();
    if (child?.pid && child.exitCode === null) {
      try {
        process.kill(-child.pid, 'SIGTERM');
      } catch {
        // already gone
      }
      await new Promise((r) => setTimeout(r, 500));
    }
    await smtp?.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('lets the instructor create a class, invite a trainee and assign a puzzle', async () => {
    const { page } = instructor;
    const errors = collectPageErrors(page);
    await signIn(page, baseUrl, DEMO_ACCOUNTS.instructor);
    await waitForPath(page, '/plans');
    await page.goto(`${baseUrl}/drills`);
    await page.getByTestId('safety-notice').waitFor();
    await page.getByTestId('new-class-name').locator('input').fill(className);
    await page.getByTestId('create-class').click();
    await page.getByRole('heading', { level: 1, name: className }).waitFor();

    await page.getByTestId('invite-emails').locator('input').fill(account.email);
    await page.getByTestId('invite-send').click();
    await page.getByTestId('roster').getByText('Not joined yet').waitFor();

    await page.locator('.n-tabs-tab', { hasText: 'Assignments' }).click();
    await choose(page, page.getByLabel('What to assign'), 'The lamp that never lights');
    await page.getByRole('button', { name: 'Assign', exact: true }).click();
    await page.getByTestId('assignments').getByText('The lamp that never lights').waitFor();
    await screenshot(page, 'training-class-desk');
    expect(errors).toEqual([]);
  });

  it('lets the invited trainee join from the e-mailed link', async () => {
    await expect.poll(() => smtp.messages.some((m) => m.to.includes(account.email))).toBe(true);
    const raw = smtp.messages.find((m) => m.to.includes(account.email))!.raw.replace(/=\r?\n/g, '');
    const link = /(http:\/\/localhost:\d+\/drills\/join\/[A-Za-z0-9_-]+)/.exec(raw)![1];
    const { page } = trainee;
    await page.goto(link);
    await page.getByTestId('join-summary').waitFor();
    expect(await page.getByTestId('join-summary').innerText()).toContain(className);
    await page.getByTestId('join-name').locator('input').fill(account.displayName);
    await page.getByTestId('join-password').locator('input').fill(account.password);
    await page.getByTestId('join-accept').click();
    await waitForPath(page, '/drills');
    await page.getByRole('heading', { name: className }).waitFor();
  });

  it('lets the trainee operate the sets, see the dark lamp and submit a correct repair', async () => {
    const { page } = trainee;
    const errors = collectPageErrors(page);
    await page.locator('article', { hasText: className }).getByRole('button', { name: 'Work it' }).click();
    await page.getByTestId('hunt-statement').waitFor();
    await page.getByTestId('hunt-key-drawing-room-1').click();
    await page.getByTestId('hunt-handset-drawing-room').click();
    await page.getByTestId('hunt-log').getByText('Drawing room: lifted the handset').waitFor();
    // What a person sees: line 1 lit steady at the drawing room, dark at the front desk (its lamp lead is lifted).
    expect(await page.getByTestId('lamps-drawing-room').locator('[data-cadence]').first().getAttribute('data-cadence')).toBe('steady');
    expect(await page.getByTestId('lamps-front-desk').locator('[data-cadence]').first().getAttribute('data-cadence')).toBe('dark');
    expect(await page.getByTestId('tones-drawing-room').innerText()).toContain('dial');

    const diagnosis = page.getByTestId('diagnosis-0');
    await choose(page, diagnosis.locator('.n-base-selection').nth(0), 'Front desk');
    await diagnosis.locator('input').first().fill('3');
    await choose(page, diagnosis.locator('.n-base-selection').nth(1), 'A lead is lifted that should be on');
    const repair = page.getByTestId('repair-0');
    await choose(page, repair.locator('.n-base-selection').nth(0), 'Put a pair back on');
    await choose(page, repair.locator('.n-base-selection').nth(1), 'Front desk');
    await repair.locator('input').last().fill('3');
    await repair.locator('input').last().blur();
    await page.getByTestId('answer-submit').click();
    await page.getByTestId('score').getByText('Cured').waitFor();
    await page.getByTestId('hunt-explanation').waitFor();
    expect(await page.getByTestId('hunt-status').innerText()).toBe('Passed');
    await screenshot(page, 'training-fault-hunt');
    expect(errors).toEqual([]);
  });

  it('shows the instructor the score in the gradebook and exports it as CSV', async () => {
    const { page } = instructor;
    await page.reload();
    await page.locator('.n-tabs-tab', { hasText: 'Gradebook' }).click();
    const score = Number(await trainee.page.getByTestId('score-total').innerText());
    const row = page.getByTestId('gradebook').locator('tr', { hasText: account.displayName });
    await row.waitFor();
    expect(await row.innerText()).toContain(String(score));
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('gradebook-csv').click()]);
    const csv = readFileSync((await download.path())!, 'utf8');
    expect(csv.split('\n')[0]).toBe('trainee,email,puzzle,level,due,status,best_score,attempts,minutes');
    expect(csv).toContain(`${account.displayName},${account.email},The lamp that never lights,1,,passed,${score},1,`);
  });

  it('steps through the demonstration on the projector with the keyboard', async () => {
    const { page } = instructor;
    await page.setViewportSize({ width: 1920, height: 1080 });
    await page.goto(`${baseUrl}/drills`);
    await page.getByRole('button', { name: 'Present' }).first().click();
    await page.getByTestId('projector-step').waitFor();
    expect(await page.getByTestId('projector-step').innerText()).toBe('Step 1 of 5');
    // The framing shows at least one set whole inside the stage, and the narration is not covered by the drawing.
    const inside = async () =>
      page.evaluate(() => {
        const stage = document.querySelector('.projector__stage')!.getBoundingClientRect();
        const narration = document.querySelector('[data-testid="projector-narration"]')!.getBoundingClientRect();
        const whole = [...document.querySelectorAll('.vue-flow__node-set')].filter((el) => {
          const box = el.getBoundingClientRect();
          return box.left >= stage.left && box.right <= stage.right && box.top >= stage.top && box.bottom <= stage.bottom;
        });
        return { wholeSets: whole.length, clearOfNarration: stage.bottom <= narration.top + 1 };
      });
    await expect.poll(async () => (await inside()).wholeSets).toBeGreaterThanOrEqual(1);
    expect((await inside()).clearOfNarration).toBe(true);
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('PageDown');
    await page.keyboard.press('ArrowRight');
    expect(await page.getByTestId('projector-step').innerText()).toBe('Step 4 of 5');
    expect(await page.getByTestId('projector-cause').count()).toBe(0);
    await page.keyboard.press('r');
    await page.getByTestId('projector-cause').waitFor();
    // The revealed conductor path lights up on the drawing.
    expect(await page.locator('.vue-flow__node').count()).toBeGreaterThan(3);
    await page.keyboard.press('PageUp');
    expect(await page.getByTestId('projector-step').innerText()).toBe('Step 3 of 5');
    expect(await page.getByTestId('projector-cause').count()).toBe(0);
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('r');
    await page.getByTestId('projector-cause').waitFor();

    // No text smaller than 16 px on screen: panel text as computed, drawing text times the canvas zoom.
    const smallest = await page.evaluate(() => {
      const root = document.querySelector('[data-testid="projector"]') as HTMLElement;
      const zoom = Number(root.dataset.zoom);
      let min = Infinity;
      const walker = document.createTreeWalker(root, NodeFilter.SHOW_TEXT);
      for (let n = walker.nextNode(); n; n = walker.nextNode()) {
        const el = n.parentElement;
        if (!el || !n.textContent?.trim()) continue;
        const box = el.getBoundingClientRect();
        if (!box.width || !box.height || getComputedStyle(el).visibility === 'hidden') continue;
        const size = parseFloat(getComputedStyle(el).fontSize) * (el.closest('.vue-flow__viewport') ? zoom : 1);
        min = Math.min(min, size);
      }
      return min;
    });
    expect(smallest).toBeGreaterThanOrEqual(16);
    await screenshot(page, 'training-projector');
  });
  it('records a demonstration on its own copy of a plan, and asks before unsaved steps are lost', async () => {
    const { page } = instructor;
    await page.setViewportSize({ width: 1280, height: 800 });
    // The Bench has the demo plan open; the builder still starts with no drawing until a plan is chosen.
    await page.goto(`${baseUrl}/plans`);
    await page.getByRole('link', { name: 'Harbour Street Bindery' }).first().click();
    await page.locator('.vue-flow__node-set').first().waitFor();
    await page.goto(`${baseUrl}/drills/demonstrations/new`);
    await page.getByTestId('demo-stage-empty').waitFor();
    expect(await page.locator('.vue-flow__node').count()).toBe(0);
    expect(await page.getByTestId('record-step').count()).toBe(0);

    await choose(page, page.getByTestId('demo-plan'), 'Harbour Street Bindery');
    await page.locator('.vue-flow__node-set').first().waitFor();
    await page.getByLabel('Narration').fill('Everything idle');
    await page.getByTestId('record-step').click();
    await page.locator('.builder__steps li', { hasText: 'Everything idle' }).waitFor();

    // Leaving with a recorded step asks first; staying keeps it.
    await page.getByRole('link', { name: 'Plans', exact: true }).click();
    await page.getByRole('button', { name: 'Stay' }).click();
    expect(page.url()).toContain('/drills/demonstrations/new');
    expect(await page.locator('.builder__steps li').count()).toBe(1);

    // Saving goes to the projector without asking.
    await page.getByRole('button', { name: 'Save and present' }).click();
    await page.getByTestId('projector-step').waitFor();
    expect(await page.getByTestId('projector-step').innerText()).toBe('Step 1 of 1');
  });

  it('warns, as soon as a plan is chosen in the puzzle maker, that a plan which already has faults is not healthy', async () => {
    const { page } = instructor;
    await page.setViewportSize({ width: 1280, height: 800 });
    await page.goto(`${baseUrl}/drills/puzzles/new`);
    // The demo plan is faulty on purpose (its sweep finds faults: tests/engine/golden), so it cannot be a puzzle's base.
    await choose(page, page.locator('.n-base-selection').first(), 'Harbour Street Bindery');
    const warning = page.getByTestId('maker-plan-faulty');
    await warning.waitFor({ timeout: 30_000 });
    expect(await warning.innerText()).toMatch(/A sweep finds \d+ faults? in it already/);
    expect(await warning.getByRole('link', { name: 'open it on the Bench' }).getAttribute('href')).toMatch(/^\/plans\//);

    // The seeded healthy copy (the demo plan with its cure made) sweeps clean: no warning once the sweep is done.
    await choose(page, page.locator('.n-base-selection').first(), 'Bindery after the cure');
    await page.getByTestId('maker-plan-healthy').waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('maker-plan-faulty').count()).toBe(0);
  });
});
