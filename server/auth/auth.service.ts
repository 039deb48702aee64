/**
 * Account logic behind the auth and account routes: hashing, sign-in with throttling and a second
 * factor, mail links (verify, reset, change of address), welcome mail, demo plan.
 */
import { generateSecret, generateURI, verify as verifyTotp } from 'otplib';
import type { Logger } from 'pino';
import type { ProfileUpdate, ResetPassword, TotpEnrolment } from '../../shared/schemas/account.schema';
import type { ChangePassword, Role, SignIn, SignUp, User } from '../../shared/schemas/auth.schema';
import { HttpError } from '../http/http-error';
import { accountMail, sendInBackground } from '../mail/account-mail';
import type { Mailer, OutgoingMail } from '../mail/mailer';
import { loadDemoPlan } from '../plans/demo-plan';
import type { PlansRepo } from '../plans/plans.repo';
import { toUser, type UserRow, type UsersRepo } from '../users/users.repo';
import { hashPassword, verifyAgainstDummy, verifyPassword } from './password';
import { hashToken, newToken } from './sessions';
import { accountKey, addressKey, type SignInThrottle } from './sign-in-throttle';
import type { TokensRepo } from './tokens.repo';

const VERIFY_TTL_MS = 48 * 3_600_000;
const RESET_TTL_MS = 30 * 60_000;

// One answer for an unknown e-mail and a wrong password, so the form does not reveal who has an account.
const badCredentials = (): HttpError =>
  new HttpError(401, 'BAD_CREDENTIALS', 'That e-mail and password do not match an account.');
const badToken = (): HttpError =>
  new HttpError(400, 'BAD_TOKEN', 'This link has expired or was already used. Ask for a new one.');

export interface AuthServiceDeps {
  users: UsersRepo;
  plans: PlansRepo;
  tokens: TokensRepo;
  throttle: SignInThrottle;
  mailer: Mailer;
  logger: Logger;
  publicOrigin: string;
  emailVerification: boolean;
}

export type SignInOutcome = { user: User; row: UserRow };

export function authService(deps: AuthServiceDeps) {
  const { users, plans, tokens, throttle, mailer, logger } = deps;
  const mail = accountMail(deps.publicOrigin);
  const send = (m: OutgoingMail, what: string) => sendInBackground(mailer, logger, m, what);

  /** Gives an account the demo installation to open. A missing demo file must not block sign-up. */
  async function addDemoPlan(user: User): Promise<void> {
    try {
      await plans.create(user.id, loadDemoPlan());
    } catch (err) {
      logger.warn({ err, userId: user.id }, 'demo plan not added');
    }
  }

  async function issueToken(
    userId: string,
    purpose: 'verify-email' | 'reset-password' | 'change-email',
    ttlMs: number,
    email: string | null = null,
  ): Promise<string> {
    const token = newToken();
    await tokens.issue({
      id: hashToken(token),
      user_id: userId,
      purpose,
      email,
      expires_at: Date.now() + ttlMs,
    });
    return token;
  }

  async function checkPassword(userId: string, password: string, field: string): Promise<UserRow> {
    const row = await users.findById(userId);
    if (!row) throw new HttpError(401, 'UNAUTHENTICATED', 'Sign in to continue.');
    if (!(await verifyPassword(row.password_hash, password))) {
      throw new HttpError(400, 'VALIDATION_FAILED', 'The current password is not right.', {
        [field]: ['The current password is not right'],
      });
    }
    return row;
  }

  return {
    /**
     * Without verification: the account is made and returned (409 when taken). With verification: the
     * same answer for a new and a taken address; the mail tells the owner what happened.
     */
    async signUp(input: SignUp): Promise<User | null> {
      const user = await users.create({
        email: input.email,
        displayName: input.displayName,
        role: 'restorer',
        passwordHash: await hashPassword(input.password),
        verified: !deps.emailVerification,
      });
      if (!user) {
        if (deps.emailVerification) {
          send(mail.alreadyRegistered(input.email), 'already-registered');
          return null;
        }
        throw new HttpError(
          409,
          'EMAIL_TAKEN',
          'An account with that e-mail already exists. Sign in instead.',
          {
            email: ['An account with that e-mail already exists'],
          },
        );
      }
      await addDemoPlan(user);
      if (deps.emailVerification) {
        const token = await issueToken(user.id, 'verify-email', VERIFY_TTL_MS);
        send(mail.verify(user.email, user.displayName, token, VERIFY_TTL_MS), 'verification');
        return null;
      }
      send(mail.welcome(user.email, user.displayName), 'welcome');
      return user;
    },

    async signIn(input: SignIn, address: string): Promise<SignInOutcome> {
      const keys = [accountKey(input.email), addressKey(address)];
      await throttle.check(keys);
      const row = await users.findByEmail(input.email);
      const ok = row
        ? await verifyPassword(row.password_hash, input.password)
        : await verifyAgainstDummy(input.password);
      if (!row || !ok) {
        await throttle.recordFailure(keys);
        throw badCredentials();
      }
      await throttle.clear(accountKey(input.email));
      if (row.disabled_at) {
        throw new HttpError(403, 'ACCOUNT_DISABLED', 'This account is disabled. Ask an administrator.');
      }
      if (!row.email_verified_at) {
        const token = await issueToken(row.id, 'verify-email', VERIFY_TTL_MS);
        send(mail.verify(row.email, row.display_name, token, VERIFY_TTL_MS), 'verification');
        throw new HttpError(
          403,
          'EMAIL_NOT_VERIFIED',
          'Confirm your e-mail address first: we have sent you a new link.',
        );
      }
      return { user: toUser(row), row };
    },

    async recordSignIn(userId: string): Promise<void> {
      await users.recordSignIn(userId);
    },

    /** Checks a TOTP code against the user's active (or, while enrolling, pending) secret. */
    async checkTotp(userId: string, code: string, address: string): Promise<void> {
      const row = await users.findById(userId);
      const keys = [accountKey(row?.email ?? userId), addressKey(address)];
      await throttle.check(keys);
      const valid = row?.totp_secret
        ? (await verifyTotp({ secret: row.totp_secret, token: code, epochTolerance: 30 })).valid
        : false;
      if (!valid) {
        await throttle.recordFailure(keys);
        throw new HttpError(
          400,
          'VALIDATION_FAILED',
          'That code is not right. Check the time on your device.',
          {
            code: ['That code is not right'],
          },
        );
      }
    },

    async startTotpEnrolment(user: User): Promise<TotpEnrolment> {
      const secret = generateSecret();
      await users.setTotpSecret(user.id, secret, false);
      return { secret, uri: generateURI({ issuer: 'Leadbench', label: user.email, secret }) };
    },

    async enableTotp(userId: string): Promise<void> {
      const row = await users.findById(userId);
      if (row?.totp_secret) await users.setTotpSecret(userId, row.totp_secret, true);
    },

    async changePassword(userId: string, input: ChangePassword): Promise<void> {
      const row = await checkPassword(userId, input.currentPassword, 'currentPassword');
      await users.setPasswordHash(userId, await hashPassword(input.newPassword));
      send(mail.passwordChanged(row.email), 'password-changed');
    },

    async verifyEmail(token: string): Promise<string> {
      const now = Date.now();
      const verify = await tokens.consume(hashToken(token), 'verify-email', now);
      if (verify) {
        await users.markVerified(verify.user_id);
        return verify.user_id;
      }
      const change = await tokens.consume(hashToken(token), 'change-email', now);
      if (!change?.email) throw badToken();
      if (!(await users.setEmail(change.user_id, change.email))) {
        throw new HttpError(409, 'EMAIL_TAKEN', 'Another account now uses that address.');
      }
      return change.user_id;
    },

    /** Always the same answer; only an existing, enabled account gets a link. */
    async forgotPassword(email: string): Promise<void> {
      const row = await users.findByEmail(email);
      if (!row || row.disabled_at) return;
      const token = await issueToken(row.id, 'reset-password', RESET_TTL_MS);
      send(mail.reset(row.email, token, RESET_TTL_MS), 'password-reset');
    },

    async sendReset(row: UserRow): Promise<void> {
      const token = await issueToken(row.id, 'reset-password', RESET_TTL_MS);
      send(mail.reset(row.email, token, RESET_TTL_MS), 'password-reset');
    },

    async invite(input: { email: string; displayName: string; role: Role }): Promise<User | null> {
      const user = await users.create({
        ...input,
        // Nobody knows this password; the invited person sets their own through the link.
        passwordHash: await hashPassword(newToken()),
      });
      if (!user) return null;
      const token = await issueToken(user.id, 'reset-password', 7 * 24 * 3_600_000);
      send(mail.invited(user.email, user.displayName, input.role, token, 7 * 24 * 3_600_000), 'invitation');
      return user;
    },

    /** Sets the new password from a mailed link; returns the account it belonged to. */
    async resetPassword(input: ResetPassword): Promise<string> {
      const row = await tokens.consume(hashToken(input.token), 'reset-password', Date.now());
      if (!row) throw badToken();
      await users.setPasswordHash(row.user_id, await hashPassword(input.password));
      // Following the mailed link also proves the address.
      await users.markVerified(row.user_id);
      const user = await users.findById(row.user_id);
      if (user) send(mail.passwordChanged(user.email), 'password-changed');
      return row.user_id;
    },

    /** A new name applies at once; a new address only once its link is followed. */
    async updateProfile(userId: string, input: ProfileUpdate): Promise<{ emailPending: boolean }> {
      if (input.displayName !== undefined) await users.setDisplayName(userId, input.displayName);
      const row = await users.findById(userId);
      if (!row || input.email === undefined || input.email === row.email) return { emailPending: false };
      const taken = await users.findByEmail(input.email);
      if (taken) {
        send(mail.alreadyRegistered(input.email), 'already-registered');
      } else {
        const token = await issueToken(userId, 'change-email', VERIFY_TTL_MS, input.email);
        send(mail.changeEmail(input.email, token, VERIFY_TTL_MS), 'change-email');
      }
      return { emailPending: true };
    },

    async deleteAccount(userId: string, password: string): Promise<void> {
      await checkPassword(userId, password, 'password');
      await users.delete(userId);
    },
  };
}

export type AuthService = ReturnType<typeof authService>;
