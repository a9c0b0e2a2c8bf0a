import { escapeHtml, htmlFrame, type RenderedMail } from './layout';

/** Sent to an existing user when someone signs up with their address (the API answers as for a new account). */
export function signUpAttemptMail({ displayName, signInLink, resetLink }: { displayName: string; signInLink: string; resetLink: string }): RenderedMail {
  const subject = 'Someone tried to sign up to Flowlore with your e-mail address';
  const text = [
    `Hello ${displayName},`,
    '',
    'Someone just tried to create a new Flowlore account with this e-mail address, which already has one.',
    'No new account was made. If it was you, sign in instead:',
    signInLink,
    `Forgotten your password? ${resetLink}`,
    '',
    'If it was not you, you need do nothing.',
  ].join('\n');
  const html = htmlFrame(subject, [
    `Hello ${escapeHtml(displayName)},`,
    'Someone just tried to create a new Flowlore account with this e-mail address, which already has one. No new account was made.',
    `If it was you, sign in instead. Forgotten your password? <a href="${escapeHtml(resetLink)}">Choose a new one</a>.`,
    'If it was not you, you need do nothing.',
  ], { href: signInLink, label: 'Sign in' });
  return { template: 'sign-up-attempt', subject, text, html };
}
