import type { User } from '../accounts/user.entity';

/** Failed sign-ins allowed before the per-account delay starts. */
export const FREE_FAILURES = 3;
export const MAX_DELAY_SECONDS = 15 * 60;

/** Seconds an account waits after its latest failure: none for the first three, then 1, 2, 4 … up to 15 minutes. */
export function delayAfterFailures(failures: number): number {
  if (failures < FREE_FAILURES) return 0;
  return Math.min(2 ** (failures - FREE_FAILURES), MAX_DELAY_SECONDS);
}

/** Seconds left before this account may try again (0 = now). */
export function secondsUntilNextAttempt(user: Pick<User, 'failedSignIns' | 'lastFailedSignInAt'>, now: Date): number {
  if (!user.lastFailedSignInAt) return 0;
  const until = user.lastFailedSignInAt.getTime() + delayAfterFailures(user.failedSignIns) * 1000;
  return Math.max(0, Math.ceil((until - now.getTime()) / 1000));
}
