/**
 * The account messages (verification, reset, notices) and a send that never holds up the answer.
 * Reusable by any feature that mails a person a link.
 */
import type { Logger } from 'pino';
import type { Mailer, OutgoingMail } from './mailer';

/** Sends after the answer; a failure is logged with the reason, never shown to the caller. */
export function sendInBackground(mailer: Mailer, logger: Logger, mail: OutgoingMail, what: string): void {
  mailer.send(mail).catch((err: unknown) => logger.error({ err }, `${what} mail not sent`));
}

export function accountMail(publicOrigin: string) {
  const link = (path: string, token: string) => `${publicOrigin}${path}?token=${token}`;
  const hours = (ms: number) => Math.round(ms / 3_600_000);
  return {
    verify: (to: string, name: string, token: string, ttlMs: number): OutgoingMail => ({
      to,
      subject: 'Confirm your Leadbench e-mail address',
      text: [
        `Hello ${name},`,
        '',
        'Someone (we hope you) created a Leadbench account with this address. To confirm it, open:',
        link('/verify-email', token),
        '',
        `The link works once and for ${hours(ttlMs)} hours. If this was not you, ignore this message.`,
      ].join('\n'),
    }),
    alreadyRegistered: (to: string): OutgoingMail => ({
      to,
      subject: 'Someone tried to create a Leadbench account with your address',
      text: [
        'Someone tried to create a new Leadbench account with this e-mail address, which already has one.',
        'No new account was made and nothing about yours changed.',
        '',
        `If it was you, sign in at ${publicOrigin}/sign-in, or choose a new password at ${publicOrigin}/forgot-password.`,
      ].join('\n'),
    }),
    reset: (to: string, token: string, ttlMs: number): OutgoingMail => ({
      to,
      subject: 'Choose a new Leadbench password',
      text: [
        'A new password was asked for on your Leadbench account. To choose one, open:',
        link('/reset-password', token),
        '',
        `The link works once and for ${Math.round(ttlMs / 60_000)} minutes. If you did not ask, ignore this message;`,
        'your password stays as it is.',
      ].join('\n'),
    }),
    invited: (to: string, name: string, role: string, token: string, ttlMs: number): OutgoingMail => ({
      to,
      subject: 'You are invited to Leadbench',
      text: [
        `Hello ${name},`,
        '',
        `An administrator made you a Leadbench account as ${role}. To choose your password, open:`,
        link('/reset-password', token),
        '',
        `The link works once and for ${Math.round(ttlMs / 60_000)} minutes.`,
      ].join('\n'),
    }),
    changeEmail: (to: string, token: string, ttlMs: number): OutgoingMail => ({
      to,
      subject: 'Confirm your new Leadbench e-mail address',
      text: [
        'You asked to use this address for your Leadbench account. To confirm, open:',
        link('/verify-email', token),
        '',
        `The link works once and for ${hours(ttlMs)} hours. Until then the old address stays in use.`,
      ].join('\n'),
    }),
    passwordChanged: (to: string): OutgoingMail => ({
      to,
      subject: 'Your Leadbench password was changed',
      text: [
        'The password of your Leadbench account was just changed, and other devices were signed out.',
        `If this was not you, choose a new password now at ${publicOrigin}/forgot-password.`,
      ].join('\n'),
    }),
    welcome: (to: string, name: string): OutgoingMail => ({
      to,
      subject: 'Welcome to Leadbench',
      text: [
        `Hello ${name},`,
        '',
        'Your Leadbench account is ready. A demonstration installation is waiting in your plans:',
        'open it, lift a few handsets and see which leads cause trouble.',
        '',
        `Sign in at ${publicOrigin}/ with ${to}.`,
      ].join('\n'),
    }),
  };
}

export type AccountMail = ReturnType<typeof accountMail>;
