/**
 * `npm run -s admin:create -- person@example.org [Display name]`: makes the first (or another) admin.
 * Prints a one-time password that must be changed at first sign-in; the account must also enrol an
 * authenticator app before the admin pages open.
 */
import { randomBytes } from 'node:crypto';
import { EmailSchema, DisplayNameSchema } from '../../shared/schemas/auth.schema';
import { hashPassword } from '../auth/password';
import { loadConfig } from '../config';
import { migrateLatest, openDatabase } from '../db/database';
import { usersRepo } from '../users/users.repo';

const [emailArg, ...nameParts] = process.argv.slice(2);
const email = EmailSchema.safeParse(emailArg ?? '');
if (!email.success) {
  console.error('Usage: npm run -s admin:create -- person@example.org [Display name]');
  process.exit(2);
}
const name = DisplayNameSchema.safeParse(nameParts.join(' ') || 'Administrator');
const config = loadConfig();
const db = openDatabase(config.databaseFile);
try {
  await migrateLatest(db);
  // 18 random bytes: 24 base64url characters, 144 bits.
  const password = randomBytes(18).toString('base64url');
  const user = await usersRepo(db).create({
    email: email.data,
    displayName: name.success ? name.data : 'Administrator',
    role: 'admin',
    passwordHash: await hashPassword(password),
    mustChangePassword: true,
  });
  if (!user) {
    console.error(`An account with ${email.data} already exists; nothing was changed.`);
    process.exitCode = 1;
  } else {
    console.log(`Admin ${user.email} created. One-time password (change it at first sign-in):`);
    console.log(password);
  }
} finally {
  await db.destroy();
}
