import { escapeHtml, htmlFrame, type RenderedMail } from './layout';

export function resetPasswordMail({ displayName, link }: { displayName: string; link: string }): RenderedMail {
  const subject = 'Choose a new Flowlore password';
  const text = [
    `Hello ${displayName},`,
    '',
    'Someone (we hope you) asked to reset the password of your Flowlore account.',
    'Open this link within one hour to choose a new one. It works once:',
    link,
    '',
    'If you did not ask, ignore this message: your password stays as it is.',
  ].join('\n');
  const html = htmlFrame(subject, [
    `Hello ${escapeHtml(displayName)},`,
    'Someone (we hope you) asked to reset the password of your Flowlore account. The link below works once, within one hour.',
    'If you did not ask, ignore this message: your password stays as it is.',
  ], { href: link, label: 'Choose a new password' });
  return { template: 'reset-password', subject, text, html };
}
