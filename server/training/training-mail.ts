/** The invitation message a trainee receives; sent through the app's mailer. */
import type { OutgoingMail } from '../mail/mailer';

export function invitationMail(input: {
  to: string;
  className: string;
  instructorName: string;
  link: string;
  expiresAt: string;
}): OutgoingMail {
  const until = new Date(input.expiresAt).toUTCString();
  return {
    to: input.to,
    subject: `You are invited to ${input.className} on Leadbench`,
    text: [
      'Hello,',
      '',
      `${input.instructorName} invites you to the class "${input.className}" on Leadbench, where you will`,
      'trace and cure wiring faults on simulated key telephone installations.',
      '',
      'Open this link to join (it works once and expires ' + until + '):',
      input.link,
      '',
      'If you did not expect this, ignore this message.',
    ].join('\n'),
  };
}
