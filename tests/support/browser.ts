/** Chromium for the browser journeys: Debian's build, headless, a fresh profile per launch. */
import { chromium, type BrowserContext, type Page } from 'playwright-core';
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

export async function signIn(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}
