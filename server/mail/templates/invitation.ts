import { escapeHtml, htmlFrame, type RenderedMail } from './layout';

/** An invitation to take a seat in a shop (or, later, a cohort), valid for `validDays`. */
export function invitationMail({ inviterName, placeName, link, validDays }: { inviterName: string; placeName: string; link: string; validDays: number }): RenderedMail {
  const subject = `${inviterName} invites you to ${placeName} on Flowlore`;
  const text = [
    'Hello,',
    '',
    `${inviterName} invites you to join ${placeName} on Flowlore, the course on engine-air physics for bench technicians.`,
    `Open this link to accept (valid for ${validDays} days). You can sign up with this e-mail address, or sign in if you already have an account:`,
    link,
  ].join('\n');
  const html = htmlFrame(subject, [
    'Hello,',
    `${escapeHtml(inviterName)} invites you to join <strong>${escapeHtml(placeName)}</strong> on Flowlore, the course on engine-air physics for bench technicians. The link is valid for ${validDays} days. You can sign up with this e-mail address, or sign in if you already have an account.`,
  ], { href: link, label: 'Accept the invitation' });
  return { template: 'invitation', subject, text, html };
}
