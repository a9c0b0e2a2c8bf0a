import { escapeHtml, htmlFrame, type RenderedMail } from './layout';

export function passwordChangedMail({ displayName, resetLink }: { displayName: string; resetLink: string }): RenderedMail {
  const subject = 'Your Flowlore password was changed';
  const text = [
    `Hello ${displayName},`,
    '',
    'The password of your Flowlore account was just changed, and other signed-in devices were signed out.',
    `If this was not you, reset your password at once: ${resetLink}`,
  ].join('\n');
  const html = htmlFrame(subject, [
    `Hello ${escapeHtml(displayName)},`,
    'The password of your Flowlore account was just changed, and other signed-in devices were signed out.',
    'If this was not you, reset your password at once.',
  ], { href: resetLink, label: 'Reset my password' });
  return { template: 'password-changed', subject, text, html };
}
