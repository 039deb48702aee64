/** Account logic behind the auth routes: hashing, the constant-ish sign-in, welcome mail, demo plan. */
import type { Logger } from 'pino';
import type { ChangePassword, SignIn, SignUp, User } from '../../shared/schemas/auth.schema';
import { HttpError } from '../http/http-error';
import type { Mailer } from '../mail/mailer';
import { loadDemoPlan } from '../plans/demo-plan';
import type { PlansRepo } from '../plans/plans.repo';
import { toUser, type UsersRepo } from '../users/users.repo';
import { hashPassword, verifyAgainstDummy, verifyPassword } from './password';

// One answer for an unknown e-mail and a wrong password, so the form does not reveal who has an account.
const badCredentials = (): HttpError =>
  new HttpError(401, 'BAD_CREDENTIALS', 'That e-mail and password do not match an account.');

export interface AuthServiceDeps {
  users: UsersRepo;
  plans: PlansRepo;
  mailer: Mailer;
  logger: Logger;
  publicOrigin: string;
}

export function authService({ users, plans, mailer, logger, publicOrigin }: AuthServiceDeps) {
  /** Gives an account the demo installation to open. A missing demo file must not block sign-up. */
  async function addDemoPlan(user: User): Promise<void> {
    try {
      await plans.create(user.id, loadDemoPlan());
    } catch (err) {
      logger.warn({ err, userId: user.id }, 'demo plan not added');
    }
  }

  function sendWelcome(user: User): void {
    const text = [
      `Hello ${user.displayName},`,
      '',
      'Your Leadbench account is ready. A demonstration installation is waiting in your plans:',
      'open it, lift a few handsets and see which leads cause trouble.',
      '',
      `Sign in at ${publicOrigin}/ with ${user.email}.`,
    ].join('\n');
    // Sign-up does not wait for the mail server; a failure is logged, the account stays.
    mailer
      .send({ to: user.email, subject: 'Welcome to Leadbench', text })
      .catch((err: unknown) => logger.error({ err, userId: user.id }, 'welcome mail not sent'));
  }

  return {
    async signUp(input: SignUp): Promise<User> {
      const user = await users.create({
        email: input.email,
        displayName: input.displayName,
        role: 'restorer',
        passwordHash: await hashPassword(input.password),
      });
      if (!user) {
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
      sendWelcome(user);
      return user;
    },

    async signIn(input: SignIn): Promise<User> {
      const row = await users.findByEmail(input.email);
      if (!row) {
        await verifyAgainstDummy(input.password);
        throw badCredentials();
      }
      if (!(await verifyPassword(row.password_hash, input.password))) throw badCredentials();
      return toUser(row);
    },

    async changePassword(userId: string, input: ChangePassword): Promise<void> {
      const row = await users.findById(userId);
      if (!row) throw new HttpError(401, 'UNAUTHENTICATED', 'Sign in to continue.');
      if (!(await verifyPassword(row.password_hash, input.currentPassword))) {
        throw new HttpError(400, 'VALIDATION_FAILED', 'The current password is not right.', {
          currentPassword: ['The current password is not right'],
        });
      }
      await users.setPasswordHash(userId, await hashPassword(input.newPassword));
    },
  };
}

export type AuthService = ReturnType<typeof authService>;
