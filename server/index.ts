/**
 * Starts Leadbench: config → database (migrate, seed when empty) → mail → HTTP.
 * Stops cleanly on SIGINT/SIGTERM.
 */
import type { AddressInfo } from 'node:net';
import { pino } from 'pino';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../db/seeds/demo-accounts.seed';
import { createApp } from './app';
import { sessionService } from './auth/sessions';
import { sessionsRepo } from './auth/sessions.repo';
import { ConfigError, loadConfig, type Config } from './config';
import { isDatabaseEmpty, migrateLatest, openDatabase } from './db/database';
import { startFakeSmtp, type FakeSmtp } from './mail/fake-smtp';
import { createMailer } from './mail/mailer';
import { usersRepo } from './users/users.repo';
import { seedDemo } from './seed-demo';

let config: Config;
try {
  config = loadConfig();
} catch (err) {
  if (err instanceof ConfigError) {
    console.error(err.message);
    process.exit(1);
  }
  throw err;
}

const logger = pino({ level: config.logLevel });
const db = openDatabase(config.databaseFile);

const applied = await migrateLatest(db);
if (applied.length) logger.info({ migrations: applied }, 'database migrated');

const empty = await isDatabaseEmpty(db);
if (config.seedDemo && empty) {
  const result = await seedDemo(db);
  logger.info({ accounts: result.accounts }, 'demo accounts created');
  if (result.planSkipped) logger.warn(`demo plan not added: ${result.planSkipped}`);
}

let fakeSmtp: FakeSmtp | undefined;
if (!config.mail) {
  fakeSmtp = await startFakeSmtp((mail) =>
    logger.info({ to: mail.to, subject: mail.subject, message: mail.raw }, 'fake mail received'),
  );
  logger.info(
    { port: fakeSmtp.port },
    'MAIL_HOST not set: fake SMTP server keeps mail in memory and logs it',
  );
}
const mailTarget = config.mail ?? { host: fakeSmtp!.host, port: fakeSmtp!.port };
const mailer = createMailer({ ...mailTarget, from: config.mailFrom, plain: !config.mail });

// Expired sessions are refused anyway; sweeping them keeps the table small.
const sessions = sessionService(sessionsRepo(db), usersRepo(db), {
  absoluteHours: config.sessionAbsoluteHours,
  idleHours: config.sessionIdleHours,
  secure: config.sessionSecure,
});
const sweepSessions = () =>
  sessions.sweep().catch((err: unknown) => logger.error({ err }, 'expired sessions not removed'));
await sweepSessions();
const sessionSweep = setInterval(sweepSessions, 60 * 60_000);
sessionSweep.unref();

const app = createApp({ db, config, mailer, logger, clientDir: config.clientDir });
const server = app.listen(config.port, config.host, () => {
  const { port } = server.address() as AddressInfo;
  const loopback = ['0.0.0.0', '::', '127.0.0.1', '::1', 'localhost'].includes(config.host);
  const shown = loopback ? 'localhost' : config.host;
  console.log(`\nLeadbench is running at http://${shown}:${port}/`);
  if (empty && !config.seedDemo) {
    console.log(
      'The database has no accounts. Create the first admin: npm run -s admin:create -- you@example.org',
    );
  }
  if (config.seedDemo) {
    console.log(`Demo sign-ins (password ${DEMO_PASSWORD}):`);
    for (const a of DEMO_ACCOUNTS) console.log(`  ${a.role.padEnd(10)} ${a.email}`);
  }
  console.log('');
});
server.on('error', (err) => {
  logger.fatal({ err }, 'could not start the HTTP server');
  process.exit(1);
});

let stopping = false;
async function shutdown(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'shutting down');
  clearInterval(sessionSweep);
  const force = setTimeout(() => process.exit(1), 10_000);
  force.unref();
  const closed = new Promise<void>((resolve) => server.close(() => resolve()));
  server.closeIdleConnections();
  await closed;
  mailer.close();
  await fakeSmtp?.close();
  await db.destroy();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
