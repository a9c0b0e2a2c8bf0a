import { escapeHtml, htmlFrame, type RenderedMail } from './layout';

export function verifyEmailMail({ displayName, link }: { displayName: string; link: string }): RenderedMail {
  const subject = 'Confirm your e-mail address for Flowlore';
  const text = [
    `Hello ${displayName},`,
    '',
    'Please confirm that this e-mail address is yours by opening this link (valid for 48 hours):',
    link,
    '',
    'If you did not sign up for Flowlore, ignore this message.',
  ].join('\n');
  const html = htmlFrame(subject, [`Hello ${escapeHtml(displayName)},`, 'Please confirm that this e-mail address is yours. The link is valid for 48 hours.', 'If you did not sign up for Flowlore, ignore this message.'], {
    href: link,
    label: 'Confirm my e-mail address',
  });
  return { template: 'verify-email', subject, text, html };
}
