/**
 * Accounts in Chromium, against the real server with e-mail verification on and its mail going to a fake SMTP
 * server this file starts (links are read from the mail): signing up and confirming the address, the sessions
 * list and "sign out everywhere else", a forgotten password reset, and an admin (after enrolling an
 * authenticator app) disabling and enabling an account, sending a reset link, inviting someone with a role,
 * deleting an account, and finding every one of those in the audit log.
 * Checks follow OWASP ASVS 4.0.3: V2.7.3 (a mailed token works once), V3.3.4 (see and end other sessions),
 * V2.5.6 (reset by a mailed, single-use token), V2.8.1 (TOTP, RFC 6238), V4.1.1 (only admins administer)
 * and V7.2.2 (administrative actions are logged).
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
  navLabels,
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
function linkFrom(smtp: FakeSmtp, to: string, path: string, subject?: RegExp): string | undefined {
  const mail = smtp.messages.filter((m) => m.to.includes(to) && (!subject || subject.test(m.subject))).at(-1);
  const raw = mail?.raw.replace(/=\r?\n/g, '').replace(/=3D/gi, '=');
  return raw && new RegExp(`(http://localhost:\\d+${path}\\?token=[A-Za-z0-9_-]{43})`).exec(raw)?.[1];
}

/** Waits for the mail and gives its link. */
async function mailedLink(smtp: FakeSmtp, to: string, path: string, subject?: RegExp): Promise<string> {
  await expect.poll(() => linkFrom(smtp, to, path, subject), { timeout: 10_000 }).toBeTruthy();
  return linkFrom(smtp, to, path, subject)!;
}

async function signedInAway(page: Page): Promise<void> {
  await page.waitForURL((url) => url.pathname !== '/sign-in');
}

/** Confirms the open dialog with its button and waits until it has faded, so the next one is the only one. */
async function confirmDialog(page: Page, button: string): Promise<void> {
  await page.locator('.n-dialog').last().getByRole('button', { name: button, exact: true }).click();
  await expect.poll(() => page.locator('.n-dialog:visible').count(), { timeout: 10_000 }).toBe(0);
}

describe.skipIf(!chromiumPath)(
  'accounts: verification, sessions, password reset by mail, admin actions in the audit log',
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
    /** The member's password after the reset journey. */
    const resetPassword = 'bridged-tip-ring-lamp-2026';

    beforeAll(async () => {
      smtp = await startFakeSmtp();
      dir = mkdtempSync(join(tmpdir(), 'leadbench-accounts-browser-'));
      const clientDir = join(dir, 'client');
      buildClient(clientDir);
      ({ baseUrl, child } = await startServer(clientDir, join(dir, 'accounts.sqlite'), {
        MAIL_HOST: smtp.host,
        MAIL_PORT: String(smtp.port),
        EMAIL_VERIFICATION: 'true',
      }));
    });

    afterAll(async () => {
      for (const session of open) await session.close();
      if (child) await stopServer(child);
      await smtp?.close();
      rmSync(dir, { recursive: true, force: true });
    });

    // ASVS 4.0.3 V2.7.3 (the mailed token works once, for this account only).
    it('signs up, refuses sign-in until the mailed link confirms the address, and the link works once', async () => {
      const { page } = await browser();
      const errors = collectPageErrors(page);
      await signUp(page, baseUrl, member);
      await page.getByTestId('verification-sent').waitFor();
      expect(await page.getByTestId('verification-sent').innerText()).toContain(member.email);

      // Not confirmed yet: the password alone does not sign in, and a fresh link replaces the first.
      const confirmMails = () =>
        smtp.messages.filter(
          (m) => m.to.includes(member.email) && /Confirm your Leadbench e-mail/.test(m.subject),
        );
      await expect.poll(() => confirmMails().length, { timeout: 10_000 }).toBe(1);
      await signIn(page, baseUrl, member.email, member.password);
      await page.getByTestId('form-error').filter({ hasText: 'Confirm your e-mail address first' }).waitFor();
      expect(page.url()).toContain('/sign-in');
      await expect.poll(() => confirmMails().length, { timeout: 10_000 }).toBe(2);

      const link = await mailedLink(smtp, member.email, '/verify-email', /Confirm your Leadbench e-mail/);
      await page.goto(link);
      await page.getByTestId('email-verified').waitFor();
      // ASVS 4.0.3 V2.7.3: the same link a second time confirms nothing.
      await page.goto(link);
      await page.getByRole('alert').filter({ hasText: 'The address was not confirmed' }).waitFor();

      await signIn(page, baseUrl, member.email, member.password);
      await waitForPath(page, '/plans');
      expect(errors).toEqual([]);
    });

    // ASVS 4.0.3 V3.3.4 (the user sees their active sessions and can end them).
    it('lists both sessions of one account and ends the other one with "sign out everywhere else"', async () => {
      const laptop = await browser();
      const workshop = await browser();
      const errors = collectPageErrors(laptop.page);
      await signIn(laptop.page, baseUrl, member.email, member.password);
      await waitForPath(laptop.page, '/plans');
      await signIn(workshop.page, baseUrl, member.email, member.password);
      await waitForPath(workshop.page, '/plans');

      await laptop.page.goto(`${baseUrl}/account`);
      const rows = laptop.page.getByTestId('session-row');
      // This file's two browsers; the verification journey's session is still open too.
      await expect.poll(() => rows.count()).toBe(3);
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

    // ASVS 4.0.3 V2.5.6 (recovery by a mailed, single-use token).
    it('resets a forgotten password from the mailed link, once', async () => {
      const { page } = await browser();
      const errors = collectPageErrors(page);
      await page.goto(`${baseUrl}/sign-in`);
      await page.getByRole('link', { name: 'Forgot password?' }).click();
      await waitForPath(page, '/forgot-password');
      await page.getByLabel('E-mail').fill(member.email);
      await page.getByRole('button', { name: 'Send reset link' }).click();
      await page.getByTestId('reset-sent').waitFor();

      const link = await mailedLink(smtp, member.email, '/reset-password');
      await page.goto(link);
      await page.getByLabel('New password', { exact: true }).fill(resetPassword);
      await page.getByRole('button', { name: 'Save new password' }).click();
      await page.getByTestId('reset-done').waitFor();

      // Single use: the same link is refused the second time.
      await page.goto(link);
      await page.getByLabel('New password', { exact: true }).fill('another-pair-of-leads-9');
      await page.getByRole('button', { name: 'Save new password' }).click();
      await page.getByTestId('form-error').waitFor();

      await signIn(page, baseUrl, member.email, member.password);
      await page.getByTestId('form-error').waitFor();
      await signIn(page, baseUrl, member.email, resetPassword);
      await waitForPath(page, '/plans');
      expect(errors).toEqual([]);
    });

    // ASVS 4.0.3 V2.8.1 (TOTP before administration), V4.1.1 and V7.2.2 (administrative actions are logged).
    it('lets an admin with an authenticator disable, enable, reset, invite and delete, each in the audit log', async () => {
      const { page } = await browser();
      const errors = collectPageErrors(page);
      await signIn(page, baseUrl, DEMO_ACCOUNTS.admin);
      await signedInAway(page);

      // Administration needs a second factor: People says so at once and leads to the Account page's card;
      // enrol one there from the secret shown as text.
      await page.goto(`${baseUrl}/people`);
      await page.getByTestId('set-up-second-factor').click();
      await waitForPath(page, '/account');
      await page.getByTestId('totp-start').click();
      const secret = (await page.getByTestId('totp-secret').innerText()).trim();
      expect(await page.getByTestId('totp-uri').innerText()).toMatch(/^otpauth:\/\/totp\//);
      await page.getByLabel('Authenticator code').fill(await generate({ secret }));
      await page.getByRole('button', { name: 'Turn on' }).click();
      await page.getByTestId('totp-on').waitFor();

      await page.goto(`${baseUrl}/people`);
      const table = page.getByTestId('people-table');
      await page.getByLabel('Search people').fill(member.email);
      const row = table.locator('tr', { hasText: member.email });

      // Disable: the account cannot sign in.
      await row.getByRole('button', { name: `Disable: ${member.email}` }).click();
      await confirmDialog(page, 'Disable');
      await row.getByText('Disabled', { exact: true }).waitFor();
      const other = await browser();
      await signIn(other.page, baseUrl, member.email, resetPassword);
      await other.page.getByTestId('form-error').waitFor();

      // Enable again: it can.
      await row.getByRole('button', { name: `Enable: ${member.email}` }).click();
      await confirmDialog(page, 'Enable');
      await row.getByText('Active', { exact: true }).waitFor();
      await signIn(other.page, baseUrl, member.email, resetPassword);
      await waitForPath(other.page, '/plans');

      // Send a reset link: a new mail with a working link reaches the member.
      const resetMails = () =>
        smtp.messages.filter((m) => m.to.includes(member.email) && /new Leadbench password/.test(m.subject))
          .length;
      const before = resetMails();
      await row.getByRole('button', { name: `Send reset: ${member.email}` }).click();
      await confirmDialog(page, 'Send link');
      await expect.poll(resetMails, { timeout: 10_000 }).toBe(before + 1);

      // Invite someone as an instructor; they choose a password from the mail and arrive with Drills.
      const invitee = newAccount('invited', 'Ivy Invited');
      await page.getByText('Invite someone', { exact: true }).click();
      const invite = page.getByTestId('invite-form');
      await invite.getByLabel('Name', { exact: true }).fill(invitee.displayName);
      await invite.getByLabel('E-mail', { exact: true }).fill(invitee.email);
      await invite.getByLabel('Role of the invited person').fill('Instructor');
      await page.locator('.n-base-select-option:visible', { hasText: 'Instructor' }).click();
      await expect
        .poll(() => page.locator('.n-base-select-menu:visible').count(), { timeout: 10_000 })
        .toBe(0);
      await invite.getByRole('button', { name: 'Invite' }).click();
      await page.getByText(`${invitee.displayName} is invited as instructor`).waitFor();
      const welcome = await mailedLink(smtp, invitee.email, '/reset-password', /invited/);
      const guest = await browser();
      await guest.page.goto(welcome);
      await guest.page.getByLabel('New password', { exact: true }).fill(invitee.password);
      await guest.page.getByRole('button', { name: 'Save new password' }).click();
      await guest.page.getByTestId('reset-done').waitFor();
      await signIn(guest.page, baseUrl, invitee.email, invitee.password);
      await waitForPath(guest.page, '/plans');
      // Our own role design (src/router/nav-items.ts): instructors get Drills, not People.
      expect(await navLabels(guest.page)).toEqual(['Plans', 'Drills', 'Account']);

      // Delete the invited account: it leaves the table and cannot sign in.
      await page.getByLabel('Search people').fill(invitee.email);
      const invitedRow = table.locator('tr', { hasText: invitee.email });
      await invitedRow.getByRole('button', { name: `Delete: ${invitee.email}` }).click();
      await confirmDialog(page, 'Delete');
      await expect.poll(() => invitedRow.count(), { timeout: 10_000 }).toBe(0);
      await signIn(guest.page, baseUrl, invitee.email, invitee.password);
      await guest.page.getByTestId('form-error').waitFor();

      // ASVS 4.0.3 V7.2.2: every one of those actions is in the audit log, newest first, with who did it.
      await page.locator('.n-tabs-tab', { hasText: 'Audit log' }).click();
      const entries = page.getByTestId('audit-table').locator('tbody tr');
      await expect.poll(() => entries.count(), { timeout: 10_000 }).toBeGreaterThanOrEqual(5);
      const lines = (await entries.allInnerTexts()).slice(0, 5);
      const labels = ['Account deleted', 'Invited', 'Reset link sent', 'Account enabled', 'Account disabled'];
      lines.forEach((line, i) => {
        expect(line).toContain(labels[i]); // our own labels, src/pages/people/audit-columns.ts
        expect(line).toContain(DEMO_ACCOUNTS.admin);
      });
      expect(lines[0]).toContain(invitee.email);
      expect(lines[1]).toContain('instructor'); // the invited role as the detail
      expect(lines.slice(2).every((line) => line.includes(member.email))).toBe(true);
      await screenshot(page, 'accounts-audit');
      expect(errors).toEqual([]);
    });
  },
);
