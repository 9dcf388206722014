import type { MailContent } from '../mail/mail.layout.js';

export function invitationMail(input: { organisationName: string; inviterName: string; link: string; validDays: number }): MailContent {
  return {
    subject: `You are invited to Plummet by ${input.organisationName}`,
    paragraphs: [
      `${input.inviterName} has invited you to use Plummet for ${input.organisationName}: recording and following up objects that could fall from scaffolds.`,
      `Open the link below to choose your password. It works once and expires in ${input.validDays} days.`,
    ],
    action: { label: 'Accept the invitation', url: input.link },
  };
}

export function passwordResetMail(input: { link: string; validMinutes: number }): MailContent {
  return {
    subject: 'Reset your Plummet password',
    paragraphs: [
      'Someone (hopefully you) asked to reset the password of your Plummet account.',
      `Open the link below to choose a new one. It works once and expires in ${input.validMinutes} minutes. If you did not ask, ignore this e-mail; your password stays as it is.`,
    ],
    action: { label: 'Choose a new password', url: input.link },
  };
}

/** Links in e-mails point at the PWA (PUBLIC_URL), falling back to the address the server listens on. */
export function publicLink(publicUrl: string | undefined, host: string, port: number, path: string, token: string): string {
  const base = (publicUrl ?? `http://${host}:${port}`).replace(/\/+$/, '');
  return `${base}${path}?token=${encodeURIComponent(token)}`;
}
