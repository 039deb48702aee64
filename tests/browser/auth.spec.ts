/**
 * Sign-in, sign-up, sign-out and roles, walked in Chromium against the real server with its seeded demo accounts.
 * The expected navigation per role comes from src/navigation/nav-items.ts and src/router/role-home.ts (our own design).
 */
import { afterEach, describe, expect, inject, it } from 'vitest';
import {
  DEMO_ACCOUNTS,
  DEMO_PASSWORD,
  collectPageErrors,
  navLabels,
  newAccount,
  openBrowser,
  screenshot,
  signIn,
  signOut,
  signUp,
  waitForPath,
  type BrowserSession,
  type DemoRole,
} from '../support/browser';

const baseUrl = inject('baseUrl');
const chromiumPath = inject('chromiumPath');

// Our own role design (src/router/role-home.ts and nav-items.ts), no published source.
const ROLE_EXPECTATIONS: Record<DemoRole, { home: string; heading: string; nav: string[] }> = {
  restorer: { home: '/plans', heading: 'Plans', nav: ['Plans', 'Account'] },
  instructor: { home: '/plans', heading: 'Plans', nav: ['Plans', 'Drills', 'Account'] },
  trainee: { home: '/drills', heading: 'Drills', nav: ['Plans', 'Drills', 'Account'] },
  admin: { home: '/people', heading: 'People', nav: ['Plans', 'Drills', 'People', 'Account'] },
};

describe.skipIf(!chromiumPath)('accounts and roles in the browser', () => {
  let session: BrowserSession | undefined;

  afterEach(async () => {
    await session?.close();
    session = undefined;
  });

  it('shows the landing page and the sign-in page to a visitor, in light and dark', async () => {
    for (const scheme of ['light', 'dark'] as const) {
      session = await openBrowser(chromiumPath, undefined, scheme);
      const { page } = session;
      const errors = collectPageErrors(page);

      const response = await page.goto(`${baseUrl}/`);
      // The built client runs under a policy that allows only its own scripts (helmet's CSP, server/app.ts).
      expect(response?.headers()['content-security-policy']).toContain("script-src 'self'");
      await page.getByRole('heading', { level: 1 }).waitFor();
      // The theme follows the system's colour scheme on a first visit (src/stores/theme.store.ts).
      expect(await page.evaluate(() => document.documentElement.dataset.theme)).toBe(scheme);
      expect(await page.getByRole('navigation', { name: 'Main' }).count()).toBe(0);
      await screenshot(page, `landing-${scheme}`);

      await page.getByRole('link', { name: 'Sign in' }).first().click();
      await waitForPath(page, '/sign-in');
      await page.getByRole('heading', { name: 'Sign in to Leadbench' }).waitFor();
      await screenshot(page, `sign-in-${scheme}`);

      expect(errors).toEqual([]);
      await session.close();
      session = undefined;
    }
  });

  for (const role of Object.keys(DEMO_ACCOUNTS) as DemoRole[]) {
    it(`signs the demo ${role} in to their home with the right navigation`, async () => {
      const want = ROLE_EXPECTATIONS[role];
      for (const scheme of ['light', 'dark'] as const) {
        session = await openBrowser(chromiumPath, undefined, scheme);
        const { page } = session;
        const errors = collectPageErrors(page);

        await signIn(page, baseUrl, DEMO_ACCOUNTS[role]);
        await waitForPath(page, want.home);
        await page.getByRole('heading', { level: 1, name: want.heading }).waitFor();
        expect(await navLabels(page)).toEqual(want.nav);
        expect(await page.evaluate(() => document.documentElement.dataset.theme)).toBe(scheme);
        await screenshot(page, `home-${role}-${scheme}`);

        expect(errors).toEqual([]);
        await session.close();
        session = undefined;
      }
    });
  }

  it('on a phone folds the areas into one menu that names the current one and reaches every area', async () => {
    session = await openBrowser(chromiumPath, { width: 390, height: 844 });
    const { page } = session;
    const errors = collectPageErrors(page);
    await signIn(page, baseUrl, DEMO_ACCOUNTS.admin);
    await waitForPath(page, '/people');
    const fold = page.getByTestId('nav-fold');
    await expect.poll(() => fold.innerText()).toBe('People');
    // Nothing in the top bar runs past the screen's edge.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await fold.click();
    const options = page.locator('.n-dropdown-option:visible');
    await expect.poll(() => options.allInnerTexts()).toEqual(ROLE_EXPECTATIONS.admin.nav);
    await options.filter({ hasText: 'Drills' }).click();
    await waitForPath(page, '/drills');
    await expect.poll(() => fold.innerText()).toBe('Drills');
    expect(errors).toEqual([]);
  });

  it('keeps a restorer out of People even by typing its address', async () => {
    session = await openBrowser(chromiumPath);
    const { page } = session;
    await signIn(page, baseUrl, DEMO_ACCOUNTS.restorer);
    await waitForPath(page, '/plans');
    await page.goto(`${baseUrl}/people`);
    await waitForPath(page, '/forbidden');
    await page.getByText('This page is not open to your account').waitFor();
    expect(await page.getByText('Search people').count()).toBe(0);
  });

  it('signs up a new account as a restorer with the demo plan, then signs out', async () => {
    session = await openBrowser(chromiumPath);
    const { page } = session;
    const account = newAccount('sign-up');

    await signUp(page, baseUrl, account);
    await waitForPath(page, '/plans');
    await page.getByText(`Welcome, ${account.displayName}.`).waitFor(); // our own copy (sign-up page)
    // New accounts are restorers (server/auth/auth.service.ts): Plans and Account only.
    expect(await navLabels(page)).toEqual(ROLE_EXPECTATIONS.restorer.nav);
    // Every new account starts with one copy of the demo installation.
    const rows = page.getByTestId('plan-row');
    await rows.first().waitFor();
    expect(await rows.count()).toBe(1);

    await page.getByTestId('user-menu').click();
    await page.getByText('Restorer', { exact: true }).waitFor(); // role label, src/navigation/role-labels.ts
    await page.keyboard.press('Escape');

    await signOut(page);
    await waitForPath(page, '/');
    expect(await page.getByRole('navigation', { name: 'Main' }).count()).toBe(0);
    // Signed out for real: a member page sends us to sign in again.
    await page.goto(`${baseUrl}/plans`);
    await waitForPath(page, '/sign-in');
  });

  it('refuses a second account with an e-mail already in use, beside the field', async () => {
    session = await openBrowser(chromiumPath);
    const { page } = session;
    await signUp(page, baseUrl, { ...newAccount(), email: DEMO_ACCOUNTS.trainee });
    // Our own copy (src/components/forms/SignUpForm.vue), shown on the field rather than in a banner.
    await page.getByText('An account with this e-mail already exists.').waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-up');
  });

  it('says so when the password is wrong, and stays on sign-in', async () => {
    session = await openBrowser(chromiumPath);
    const { page } = session;
    await signIn(page, baseUrl, DEMO_ACCOUNTS.restorer, `${DEMO_PASSWORD}-not`);
    const alert = page.getByTestId('form-error');
    await alert.waitFor();
    // Wording from src/api/error-messages.ts (our own copy).
    expect((await alert.innerText()).trim()).toBe('E-mail or password is wrong.');
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    expect(await page.getByRole('navigation', { name: 'Main' }).count()).toBe(0);
  });

  it('marks a malformed e-mail beside the field before anything is sent', async () => {
    session = await openBrowser(chromiumPath);
    const { page } = session;
    const requests: string[] = [];
    page.on('request', (request) => {
      if (request.url().includes('/api/auth/sign-in')) requests.push(request.url());
    });
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('not-an-address');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    // Message from shared/schemas/auth.schema.ts (our own copy).
    await page.getByText('Enter a valid e-mail address').waitFor();
    expect(await page.getByLabel('E-mail').getAttribute('aria-invalid')).toBe('true');
    expect(requests).toEqual([]);
    // Our message only: the browser's own validation bubble would say the same thing a second time.
    expect(await page.getByLabel('E-mail').evaluate((el) => (el as HTMLInputElement).form?.noValidate)).toBe(true);
  });

  it('sends a visitor from a member page to sign in and back there afterwards', async () => {
    session = await openBrowser(chromiumPath);
    const { page } = session;
    await page.goto(`${baseUrl}/plans`);
    await waitForPath(page, '/sign-in');
    expect(new URL(page.url()).searchParams.get('next')).toBe('/plans');

    // The admin's own home is People, so landing on Plans proves the way back was followed.
    await page.getByLabel('E-mail').fill(DEMO_ACCOUNTS.admin);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await waitForPath(page, '/plans');
    await page.getByRole('heading', { level: 1, name: 'Plans' }).waitFor();
  });
});
