import { setTimeout as sleep } from 'node:timers/promises';

/** maildev's REST API (the SMTP catcher `npm test` starts); undefined when not configured. */
export const maildevApiUrl = process.env['MAILDEV_API_URL'];

export interface CaughtMail {
  id: string;
  subject: string;
  text: string;
  html: string;
  to: Array<{ address: string }>;
}

/** Runs the block only when a mail catcher is configured, and says why it skipped otherwise. */
export const describeWithMailCatcher: jest.Describe = maildevApiUrl
  ? describe
  : ((name: string, fn: () => void) => {
      describe.skip(`${name} (skipped: MAILDEV_API_URL is not set — run with \`npm test\`, which starts maildev)`, fn);
    }) as jest.Describe;

async function caught(): Promise<CaughtMail[]> {
  const res = await fetch(`${maildevApiUrl}/api/email`);
  if (!res.ok) throw new Error(`maildev answered ${res.status}`);
  return (await res.json()) as CaughtMail[];
}

/** Mail caught for one address (tests use unique addresses, so parallel workers do not collide). */
export async function mailTo(address: string): Promise<CaughtMail[]> {
  return (await caught()).filter((m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()));
}

/** Waits (up to 10 s) until `count` messages for the address have arrived. */
export async function waitForMail(address: string, count = 1, timeoutMs = 10_000): Promise<CaughtMail[]> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = await mailTo(address);
    if (found.length >= count) return found;
    if (Date.now() > until) throw new Error(`expected ${count} message(s) for ${address}, caught ${found.length}`);
    await sleep(100);
  }
}

/** The token in the first Flowlore link of a message (`…?token=…`). */
export function tokenIn(mail: CaughtMail): string {
  const match = /[?&]token=([A-Za-z0-9_-]+)/.exec(mail.text);
  if (!match) throw new Error(`no token link in "${mail.subject}"`);
  return match[1]!;
}
