import type { Logger } from 'pino';
import type { DataSource, EntityManager } from 'typeorm';

import type { SignUpRequest } from '../../shared/api/accounts';
import { User } from '../accounts/user.entity';
import { HttpProblem } from '../http/problem';
import type { Mailer } from '../mail/mailer';
import { passwordChangedMail } from '../mail/templates/password-changed';
import { resetPasswordMail } from '../mail/templates/reset-password';
import { signUpAttemptMail } from '../mail/templates/sign-up-attempt';
import { verifyEmailMail } from '../mail/templates/verify-email';
import { Shop } from '../shops/shop.entity';
import { consumeToken, issueToken } from './account-tokens';
import { passwordProblem, type PasswordHasher } from './passwords';
import { endSessionsOf } from './session-revocation';
import { secondsUntilNextAttempt } from './sign-in-delay';

export interface AuthServiceDeps {
  readonly dataSource: DataSource;
  readonly hasher: PasswordHasher;
  readonly mailer: Mailer;
  readonly logger: Logger;
  readonly appBaseUrl: string;
  readonly now: () => Date;
}

export type CredentialCheck =
  | { ok: true; user: User }
  | { ok: false; reason: 'wrong' }
  | { ok: false; reason: 'disabled' }
  | { ok: false; reason: 'wait'; seconds: number };

/** Sign-up, sign-in checks, e-mail verification, password reset and change. */
export class AuthService {
  constructor(private readonly deps: AuthServiceDeps) {}

  private link(path: string, token?: string): string {
    return `${this.deps.appBaseUrl}${path}${token ? `?token=${encodeURIComponent(token)}` : ''}`;
  }

  private findByEmail(manager: EntityManager, email: string): Promise<User | null> {
    return manager.getRepository(User).createQueryBuilder('u').where('lower(u.email) = lower(:email)', { email }).getOne();
  }

  /**
   * Creates the account and sends the verification e-mail. For an address that already has an
   * account it changes nothing and tells that account's owner instead: the caller answers the same.
   */
  async signUp(request: SignUpRequest): Promise<void> {
    const problem = passwordProblem(request.password, request);
    if (problem) throw HttpProblem.badRequest('The password cannot be used.', [{ field: 'password', message: problem }]);
    const passwordHash = await this.deps.hasher.hash(request.password);
    const outcome = await this.deps.dataSource.transaction(async (manager) => {
      const existing = await this.findByEmail(manager, request.email);
      if (existing) return { existing };
      const user = await manager.save(
        manager.create(User, { email: request.email, displayName: request.displayName, passwordHash, role: request.accountType, shopId: null, verifiedAt: null, disabledAt: null }),
      );
      if (request.accountType === 'shop_owner') {
        const shop = await manager.save(manager.create(Shop, { name: request.shopName, ownerId: user.id }));
        await manager.update(User, { id: user.id }, { shopId: shop.id });
      }
      const token = await issueToken(manager, user.id, 'verify-email', this.deps.now());
      return { user, token };
    });
    if ('existing' in outcome && outcome.existing) {
      const user = outcome.existing;
      this.deps.mailer.sendInBackground(
        { to: user.email, userId: user.id },
        signUpAttemptMail({ displayName: user.displayName, signInLink: this.link('/account/sign-in'), resetLink: this.link('/account/forgot-password') }),
      );
      return;
    }
    const { user, token } = outcome as { user: User; token: string };
    this.deps.mailer.sendInBackground(
      { to: user.email, userId: user.id, secrets: [token] },
      verifyEmailMail({ displayName: user.displayName, link: this.link('/account/verify', token) }),
    );
  }

  async verifyEmail(token: string): Promise<void> {
    const now = this.deps.now();
    await this.deps.dataSource.transaction(async (manager) => {
      const userId = await consumeToken(manager, token, 'verify-email', now);
      if (!userId) throw new HttpProblem(400, 'Bad request', 'This confirmation link is not valid any more. Use “Forgot password” on the sign-in page: following the reset link also confirms your address.');
      await manager.query('UPDATE user_account SET verified_at = coalesce(verified_at, $2) WHERE id = $1', [userId, now]);
    });
  }

  /** Sends a reset link when the address has an (enabled) account; the caller answers 202 either way. */
  async requestPasswordReset(email: string): Promise<void> {
    const user = await this.findByEmail(this.deps.dataSource.manager, email);
    if (!user || user.disabledAt) return;
    const token = await issueToken(this.deps.dataSource.manager, user.id, 'reset-password', this.deps.now());
    this.deps.mailer.sendInBackground(
      { to: user.email, userId: user.id, secrets: [token] },
      resetPasswordMail({ displayName: user.displayName, link: this.link('/account/reset-password', token) }),
    );
  }

  /** Sets a new password from a reset link; every session of the account ends. */
  async resetPassword(token: string, password: string): Promise<void> {
    const now = this.deps.now();
    const user = await this.deps.dataSource.transaction(async (manager) => {
      const userId = await consumeToken(manager, token, 'reset-password', now);
      if (!userId) throw new HttpProblem(400, 'Bad request', 'This reset link is not valid any more (it works once, for one hour). Ask for a new one.');
      const found = await manager.findOneByOrFail(User, { id: userId });
      const problem = passwordProblem(password, found);
      if (problem) throw HttpProblem.badRequest('The password cannot be used.', [{ field: 'password', message: problem }]);
      const passwordHash = await this.deps.hasher.hash(password);
      // The link proved the address, so it also counts as verification; the failure counter restarts.
      await manager.update(User, { id: userId }, { passwordHash, failedSignIns: 0, lastFailedSignInAt: null, verifiedAt: found.verifiedAt ?? now });
      await endSessionsOf(manager, userId);
      return found;
    });
    this.notifyPasswordChanged(user);
  }

  /** Changes the password of a signed-in user; their other sessions end, this one stays. */
  async changePassword(user: User, currentPassword: string, newPassword: string, currentSid: string): Promise<void> {
    if (!(await this.deps.hasher.verify(currentPassword, user.passwordHash))) {
      throw HttpProblem.badRequest('The current password is not right.', [{ field: 'currentPassword', message: 'This is not your current password.' }]);
    }
    const problem = passwordProblem(newPassword, user);
    if (problem) throw HttpProblem.badRequest('The password cannot be used.', [{ field: 'newPassword', message: problem }]);
    const passwordHash = await this.deps.hasher.hash(newPassword);
    await this.deps.dataSource.transaction(async (manager) => {
      await manager.update(User, { id: user.id }, { passwordHash });
      await endSessionsOf(manager, user.id, currentSid);
    });
    this.notifyPasswordChanged(user);
  }

  private notifyPasswordChanged(user: User): void {
    this.deps.mailer.sendInBackground({ to: user.email, userId: user.id }, passwordChangedMail({ displayName: user.displayName, resetLink: this.link('/account/forgot-password') }));
  }

  /**
   * Checks an e-mail and password, with the growing per-account delay after failures. An unknown
   * address costs as much time as a known one and gets the same answer as a wrong password.
   */
  async checkCredentials(email: string, password: string): Promise<CredentialCheck> {
    const now = this.deps.now();
    const user = await this.findByEmail(this.deps.dataSource.manager, email);
    if (!user) {
      await this.deps.hasher.spendEquivalentTime(password);
      return { ok: false, reason: 'wrong' };
    }
    const wait = secondsUntilNextAttempt(user, now);
    if (wait > 0) return { ok: false, reason: 'wait', seconds: wait };
    if (!(await this.deps.hasher.verify(password, user.passwordHash))) {
      await this.deps.dataSource.query(
        'UPDATE user_account SET failed_sign_ins = failed_sign_ins + 1, last_failed_sign_in_at = $2 WHERE id = $1',
        [user.id, now],
      );
      return { ok: false, reason: 'wrong' };
    }
    if (user.disabledAt) return { ok: false, reason: 'disabled' };
    if (user.failedSignIns > 0) {
      await this.deps.dataSource.query('UPDATE user_account SET failed_sign_ins = 0, last_failed_sign_in_at = NULL WHERE id = $1', [user.id]);
    }
    return { ok: true, user };
  }
}
