/**
 * Accounts in Chromium: the sessions list and "sign out everywhere else", a forgotten password reset through
 * the link read from a fake SMTP server this file starts, and an admin (after enrolling an authenticator app)
 * disabling an account and finding it in the audit log.
 * Checks follow OWASP ASVS 4.0.3: V3.3.4 (see and end other sessions), V2.5.6 (reset by a mailed, single-use
 * token), V2.8 (TOTP, RFC 6238) and V7.2.2 (administrative actions are logged).
 */
import type { ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { generate } from 'otplib';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp';
import { buildClient, startServer, stopServer } from './global-setup';
import {
  DEMO_ACCOUNTS,
  collectPageErrors,
  newAccount,
  openBrowser,
  screenshot,
  signIn,
  signUp,
  waitForPath,
  type BrowserSession,
} from '../support/browser';

const chromiumPath = inject('chromiumPath');

/** The first link to `path` in the newest mail to `to`, quoted-printable soft breaks and `=3D` undone. */
function linkFrom(smtp: FakeSmtp, to: string, path: string): string | undefined {
  const mail = smtp.messages.filter((m) => m.to.includes(to)).at(-1);
  const raw = mail?.raw.replace(/=\r?\n/g, '').replace(/=3D/gi, '=');
  return raw && new RegExp(`(http://localhost:\\d+${path}\\?token=[A-Za-z0-9_-]{43})`).exec(raw)?.[1];
}

async function signedInAway(page: Page): Promise<void> {
  await page.waitForURL((url) => url.pathname !== '/sign-in');
}

describe.skipIf(!chromiumPath)(
  'accounts: sessions, password reset by mail, admin actions in the audit log',
  () => {
    let smtp: FakeSmtp;
    let child: ChildProcess | undefined;
    let dir = '';
    let baseUrl = '';
    const open: BrowserSession[] = [];
    const browser = async () => {
      const session = await openBrowser(chromiumPath);
      open.push(session);
      return session;
    };
    const member = newAccount('accounts', 'Session Keeper');

    beforeAll(async () => {
      smtp = await startFakeSmtp();
      dir = mkdtempSync(join(tmpdir(), 'leadbench-accounts-browser-'));
      const clientDir = join(dir, 'client');
      buildClient(clientDir);
      ({ baseUrl, child } = await startServer(clientDir, join(dir, 'accounts.sqlite'), {
        MAIL_HOST: smtp.host,
        MAIL_PORT: String(smtp.port),
      }));
    });

    afterAll(async () => {
      for (const session of open) await session.close();
      if (child) await stopServer(child);
      await smtp?.close();
      rmSync(dir, { recursive: true, force: true });
    });

    it('lists both sessions of one account and ends the other one with "sign out everywhere else"', async () => {
      const laptop = await browser();
      const workshop = await browser();
      const errors = collectPageErrors(laptop.page);
      await signUp(laptop.page, baseUrl, member);
      await waitForPath(laptop.page, '/plans');
      await signIn(workshop.page, baseUrl, member.email, member.password);
      await waitForPath(workshop.page, '/plans');

      await laptop.page.goto(`${baseUrl}/account`);
      const rows = laptop.page.getByTestId('session-row');
      await expect.poll(() => rows.count()).toBe(2);
      expect(await rows.filter({ hasText: 'This device' }).count()).toBe(1);
      await screenshot(laptop.page, 'accounts-sessions');

      await laptop.page.getByTestId('sign-out-others').click();
      await expect.poll(() => rows.count()).toBe(1);
      expect(await rows.first().innerText()).toContain('This device');

      // The other browser's session is gone: its next page needing a user goes to sign-in.
      await workshop.page.goto(`${baseUrl}/account`);
      await waitForPath(workshop.page, '/sign-in');
      expect(errors).toEqual([]);
    });

    it('resets a forgotten password from the mailed link, once', async () => {
      const { page } = await browser();
      const errors = collectPageErrors(page);
      await page.goto(`${baseUrl}/sign-in`);
      await page.getByRole('link', { name: 'Forgot password?' }).click();
      await waitForPath(page, '/forgot-password');
      await page.getByLabel('E-mail').fill(member.email);
      await page.getByRole('button', { name: 'Send reset link' }).click();
      await page.getByTestId('reset-sent').waitFor();

      await expect.poll(() => linkFrom(smtp, member.email, '/reset-password')).toBeTruthy();
      const link = linkFrom(smtp, member.email, '/reset-password')!;
      const fresh = 'bridged-tip-ring-lamp-2026';
      await page.goto(link);
      await page.getByLabel('New password', { exact: true }).fill(fresh);
      await page.getByRole('button', { name: 'Save new password' }).click();
      await page.getByTestId('reset-done').waitFor();

      // Single use: the same link is refused the second time.
      await page.goto(link);
      await page.getByLabel('New password', { exact: true }).fill('another-pair-of-leads-9');
      await page.getByRole('button', { name: 'Save new password' }).click();
      await page.getByTestId('form-error').waitFor();

      await signIn(page, baseUrl, member.email, member.password);
      await page.getByTestId('form-error').waitFor();
      await signIn(page, baseUrl, member.email, fresh);
      await waitForPath(page, '/plans');
      expect(errors).toEqual([]);
    });

    it('lets an admin with an authenticator disable an account and see it in the audit log', async () => {
      const { page } = await browser();
      const errors = collectPageErrors(page);
      await signIn(page, baseUrl, DEMO_ACCOUNTS.admin);
      await signedInAway(page);

      // Administration needs a second factor: enrol one from the secret shown as text.
      await page.goto(`${baseUrl}/account`);
      await page.getByTestId('totp-start').click();
      const secret = (await page.getByTestId('totp-secret').innerText()).trim();
      expect(await page.getByTestId('totp-uri').innerText()).toMatch(/^otpauth:\/\/totp\//);
      await page.getByLabel('Authenticator code').fill(await generate({ secret }));
      await page.getByRole('button', { name: 'Turn on' }).click();
      await page.getByTestId('totp-on').waitFor();

      await page.goto(`${baseUrl}/people`);
      await page.getByLabel('Search people').fill(member.email);
      const row = page.getByTestId('people-table').locator('tr', { hasText: member.email });
      await row.getByRole('button', { name: `Disable: ${member.email}` }).click();
      await page.getByRole('button', { name: 'Disable', exact: true }).click();
      await row.getByText('Disabled', { exact: true }).waitFor();

      await page.locator('.n-tabs-tab', { hasText: 'Audit log' }).click();
      const entry = page.getByTestId('audit-table').locator('tr', { hasText: member.email });
      await entry.first().waitFor();
      expect(await entry.first().innerText()).toContain('Account disabled');
      expect(await entry.first().innerText()).toContain(DEMO_ACCOUNTS.admin);
      await screenshot(page, 'accounts-audit');

      // A disabled account cannot sign in.
      const other = await browser();
      await signIn(other.page, baseUrl, member.email, 'bridged-tip-ring-lamp-2026');
      await other.page.getByTestId('form-error').waitFor();
      expect(errors).toEqual([]);
    });
  },
);
