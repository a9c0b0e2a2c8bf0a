import { escapeHtml, htmlFrame, type RenderedMail } from './layout';

/** An invitation to join a shop or a cohort (used by the seats and cohort issues). */
export function invitationMail({ inviterName, placeName, link }: { inviterName: string; placeName: string; link: string }): RenderedMail {
  const subject = `${inviterName} invites you to ${placeName} on Flowlore`;
  const text = [
    'Hello,',
    '',
    `${inviterName} invites you to join ${placeName} on Flowlore, the course on engine-air physics for bench technicians.`,
    'Open this link to accept (valid for 7 days):',
    link,
  ].join('\n');
  const html = htmlFrame(subject, [
    'Hello,',
    `${escapeHtml(inviterName)} invites you to join <strong>${escapeHtml(placeName)}</strong> on Flowlore, the course on engine-air physics for bench technicians. The link is valid for 7 days.`,
  ], { href: link, label: 'Accept the invitation' });
  return { template: 'invitation', subject, text, html };
}
