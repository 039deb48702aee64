/** Chromium for the browser journeys: Debian's build, headless, a fresh profile per launch. */
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { expect } from 'vitest';
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export const DEMO_PASSWORD = 'bench-demo-2026';
export const DEMO_ACCOUNTS = {
  restorer: 'restorer@leadbench.test',
  instructor: 'instructor@leadbench.test',
  trainee: 'trainee@leadbench.test',
  admin: 'admin@leadbench.test',
} as const;
export type DemoRole = keyof typeof DEMO_ACCOUNTS;

const ARTIFACTS = join(process.cwd(), 'tests', '.artifacts');

export interface BrowserSession {
  context: BrowserContext;
  page: Page;
  close(): Promise<void>;
}

export async function openBrowser(
  executablePath: string,
  viewport = { width: 1280, height: 800 },
  colorScheme: 'light' | 'dark' = 'light',
): Promise<BrowserSession> {
  const profile = mkdtempSync(join(tmpdir(), 'leadbench-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath,
    headless: true,
    viewport,
    colorScheme,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(ARTIFACTS, { recursive: true });
  await page.screenshot({ path: join(ARTIFACTS, `${name}.png`) });
}

export async function signIn(
  page: Page,
  baseUrl: string,
  email: string,
  password = DEMO_PASSWORD,
): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** A fresh address per call, so journeys that sign up never collide across runs or files. */
export function uniqueEmail(prefix = 'journey'): string {
  return `${prefix}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}@leadbench.test`;
}

export interface NewAccount {
  displayName: string;
  email: string;
  password: string;
}

export function newAccount(prefix = 'journey', displayName = 'Journey Tester'): NewAccount {
  return { displayName, email: uniqueEmail(prefix), password: 'copper-pair-lamp-relay' };
}

export async function signUp(page: Page, baseUrl: string, account: NewAccount): Promise<void> {
  await page.goto(`${baseUrl}/sign-up`);
  await page.getByLabel('Your name').fill(account.displayName);
  await page.getByLabel('E-mail').fill(account.email);
  await page.getByLabel('Password').fill(account.password);
  await page.getByRole('button', { name: 'Create account' }).click();
}

/** Opens the account menu in the top bar and picks "Sign out"; resolves once the landing page shows. */
export async function signOut(page: Page): Promise<void> {
  await page.getByTestId('user-menu').click();
  await page.getByText('Sign out', { exact: true }).click();
  await page.getByRole('link', { name: 'Sign in' }).first().waitFor();
}

/** The labels of the top bar's main navigation, in order. */
export async function navLabels(page: Page): Promise<string[]> {
  const nav = page.getByRole('navigation', { name: 'Main' });
  await nav.waitFor();
  return (await nav.getByRole('link').allInnerTexts()).map((label) => label.trim());
}

/** Waits until the path (without query) is `path`; playwright's own URL wait, never a sleep. */
export async function waitForPath(page: Page, path: string): Promise<void> {
  await page.waitForURL((url) => url.pathname === path);
}

/** Uncaught errors thrown in the page, collected for a journey to assert there were none. */
/** Uncaught page errors, and anything the Content Security Policy refused (Chromium reports those on the console). */
export function collectPageErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  page.on('console', (message) => {
    if (/Content Security Policy/i.test(message.text())) errors.push(message.text());
  });
  return errors;
}

/** Axe's serious and critical violations on the page as it stands, one readable line per element. */
export async function seriousViolations(page: Page, exclude: string[] = []): Promise<string[]> {
  const { AxeBuilder } = await import('@axe-core/playwright');
  // Colours caught halfway through a fade-in would be judged as they never stay; let transitions finish.
  await page.waitForFunction(() =>
    document
      .getAnimations()
      .every((a) => a.playState !== 'running' || a.effect?.getTiming().iterations === Infinity),
  );
  // Toasts fade in and out over their few seconds on screen; judge the page once they have gone.
  await page.locator('.n-message').first().waitFor({ state: 'detached', timeout: 15_000 });
  let builder = new AxeBuilder({ page });
  for (const selector of exclude) builder = builder.exclude(selector);
  const results = await builder.analyze();
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .flatMap((v) =>
      v.nodes.map(
        (node) =>
          `[${v.impact}] ${v.id}: ${v.help} at ${node.target.join(' ')} ${node.html.slice(0, 160)}` +
          (node.failureSummary ? ` (${node.failureSummary.replace(/\s+/g, ' ').trim()})` : ''),
      ),
    );
}

/** One journey's browser: the session, its page, and the page errors collected from the start. */
export interface Journey {
  session: BrowserSession;
  page: Page;
  errors: string[];
}

export async function startJourney(
  executablePath: string,
  viewport?: { width: number; height: number },
): Promise<Journey> {
  const session = await openBrowser(executablePath, viewport);
  return { session, page: session.page, errors: collectPageErrors(session.page) };
}

/** Signs up a fresh account and waits for the plans page a new account lands on. */
export async function signUpToPlans(page: Page, baseUrl: string, prefix: string): Promise<void> {
  await signUp(page, baseUrl, newAccount(prefix));
  await waitForPath(page, '/plans');
}

/** From the plans page: a new empty plan with this name, opened on the Bench. */
export async function createBlankPlan(page: Page, name: string): Promise<void> {
  await page.getByTestId('new-plan').click();
  await page.getByTestId('start-blank').click();
  await page.getByLabel('Plan name').fill(name);
  await page.getByRole('button', { name: 'Create and open' }).click();
  await page.waitForURL(/\/plans\/[^/]+$/);
}

/** Picks up a line on a set (its line key, then the handset) and checks the line's lamp goes from dark to steady. */
export async function expectPickUpLightsLine(page: Page, set: string, line: number): Promise<void> {
  const key = page.getByTestId(`key-${set}-${line}`);
  const lamp = key.locator('[data-cadence]');
  // An idle line is dark; a line picked up on a set lights steady (common practice, no published source).
  expect(await lamp.getAttribute('data-cadence')).toBe('dark');
  await key.click();
  await page.getByTestId(`handset-${set}`).click();
  await expect.poll(() => lamp.getAttribute('data-cadence'), { timeout: 10_000 }).toBe('steady');
}

/** A new restorer account's demo plan open on the Bench, its drawing's parts drawn (the view may still be fitting). */
export async function openDemoBench(
  executablePath: string,
  baseUrl: string,
  prefix: string,
  viewport?: { width: number; height: number },
  colorScheme: 'light' | 'dark' = 'light',
): Promise<BrowserSession> {
  const session = await openBrowser(executablePath, viewport, colorScheme);
  const { page } = session;
  await signUpToPlans(page, baseUrl, prefix);
  await page.getByTestId('plan-row').getByRole('link').first().click();
  await page.waitForURL(/\/plans\/[^/]+$/);
  await page.locator('[data-testid^="node-"]').first().waitFor();
  return session;
}
