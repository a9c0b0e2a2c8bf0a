import { randomBytes } from 'node:crypto';

import type { DataSource, EntityManager } from 'typeorm';

import { INVITATION_DAYS, type AcceptedInvitation, type InviteResult, type SeatRow, type ShopSeats } from '../../shared/api/seats';
import type { SeatPricing } from '../../shared/billing/pricing';
import type { User } from '../accounts/user.entity';
import { recordAudit } from '../admin/audit-log';
import { tokenHash } from '../auth/account-tokens';
import { HttpProblem } from '../http/problem';
import { isUuid } from '../http/uuid';
import type { Mailer } from '../mail/mailer';
import { invitationMail } from '../mail/templates/invitation';
import { SeatInvitation } from './seat-invitation.entity';
import { SeatPool } from './seat-pool.entity';
import { Seat } from './seat.entity';

export interface SeatsServiceOptions {
  readonly mailer: Mailer;
  /** Shown with the seats: what they cost, and whether they can be bought here. */
  readonly pricing: SeatPricing;
  readonly buying: boolean;
  /** The app's public address, for the invitation link. */
  readonly appBaseUrl: string;
  readonly now?: () => Date;
}

const INVITATION_MS = INVITATION_DAYS * 24 * 3600_000;

/**
 * A shop's seats: the balance, invitations that hold a seat for an address (14 days; resend,
 * revoke), acceptance through the link, direct assignment to an apprentice of the shop, and
 * release. The database keeps the count and refuses a seat nobody paid for (`seat_pool` CHECK);
 * that refusal reaches the owner as a 409 saying no seat is free.
 */
export class SeatsService {
  private readonly now: () => Date;

  constructor(
    private readonly dataSource: DataSource,
    private readonly options: SeatsServiceOptions,
  ) {
    this.now = options.now ?? (() => new Date());
  }

  /** The shop's pool, made on first use. */
  async poolOf(manager: EntityManager, shopId: string): Promise<SeatPool> {
    await manager.query('INSERT INTO seat_pool (shop_id) VALUES ($1) ON CONFLICT (shop_id) DO NOTHING', [shopId]);
    return manager.getRepository(SeatPool).findOneByOrFail({ shopId });
  }

  async seats(shopId: string): Promise<ShopSeats> {
    const pool = await this.poolOf(this.dataSource.manager, shopId);
    await this.releaseExpired(pool.id);
    const fresh = await this.dataSource.getRepository(SeatPool).findOneByOrFail({ id: pool.id });
    const rows: Array<{
      seat_id: string; status: 'invited' | 'assigned'; created_at: Date; assigned_at: Date | null;
      holder_id: string | null; display_name: string | null; email: string | null;
      invitation_id: string | null; invited_email: string | null; expires_at: Date | null; last_sent_at: Date | null; send_count: number | null;
      lessons_finished: number | null; quizzes_passed: number | null; last_activity_at: Date | null;
    }> = await this.dataSource.query(
      `SELECT s.id AS seat_id, s.status, s.created_at, s.assigned_at, s.holder_id, u.display_name, u.email,
              i.id AS invitation_id, i.email AS invited_email, i.expires_at, i.last_sent_at, i.send_count,
              ls.lessons_finished, ls.quizzes_passed, ls.last_activity_at
         FROM seat s
         LEFT JOIN user_account u ON u.id = s.holder_id
         LEFT JOIN seat_invitation i ON i.seat_id = s.id
         LEFT JOIN learner_standing ls ON ls.user_id = s.holder_id
        WHERE s.pool_id = $1 AND s.status <> 'released'
        ORDER BY s.status, lower(coalesce(u.display_name, i.email)), s.id`,
      [pool.id],
    );
    const seats: SeatRow[] = rows.map((r) => ({
      seatId: r.seat_id,
      state: r.status,
      holder: r.holder_id ? { id: r.holder_id, displayName: r.display_name ?? '', email: r.email ?? '' } : null,
      invitation: r.invitation_id
        ? { id: r.invitation_id, email: r.invited_email!, expiresAt: r.expires_at!.toISOString(), lastSentAt: r.last_sent_at!.toISOString(), sendCount: r.send_count! }
        : null,
      since: (r.assigned_at ?? r.created_at).toISOString(),
      progress:
        r.status === 'assigned'
          ? { lessonsFinished: r.lessons_finished ?? 0, quizzesPassed: r.quizzes_passed ?? 0, lastActivity: r.last_activity_at?.toISOString() ?? null }
          : null,
    }));
    return { pricing: this.options.pricing, buying: this.options.buying, purchased: fresh.purchased, refunded: fresh.refunded, inUse: fresh.inUse, available: fresh.purchased - fresh.refunded - fresh.inUse, seats };
  }

  /** Invites each address (one seat each) until the free seats run out; the rest are skipped with the reason. */
  async invite(owner: User, shopId: string, emails: readonly string[]): Promise<InviteResult> {
    const pool = await this.poolOf(this.dataSource.manager, shopId);
    await this.releaseExpired(pool.id);
    const [shop] = await this.dataSource.query('SELECT name FROM shop WHERE id = $1', [shopId]);
    const result: InviteResult = { invited: [], skipped: [], available: 0 };
    const mails: Array<{ email: string; token: string }> = [];
    const seen = new Set<string>();
    for (const email of emails) {
      if (seen.has(email)) {
        result.skipped.push({ email, reason: 'Listed twice.' });
        continue;
      }
      seen.add(email);
      const [held] = await this.dataSource.query(
        `SELECT s.status FROM seat s LEFT JOIN seat_invitation i ON i.seat_id = s.id LEFT JOIN user_account u ON u.id = s.holder_id
          WHERE s.pool_id = $1 AND s.status <> 'released' AND (lower(i.email) = $2 OR lower(u.email) = $2) LIMIT 1`,
        [pool.id, email],
      );
      if (held) {
        result.skipped.push({ email, reason: held.status === 'assigned' ? 'Already holds a seat here.' : 'Already invited.' });
        continue;
      }
      const token = randomBytes(32).toString('base64url');
      try {
        const invitationId = await this.dataSource.transaction(async (manager) => {
          const seat = await manager.save(manager.create(Seat, { poolId: pool.id, status: 'invited', invitedEmail: email, holderId: null }));
          const now = this.now();
          const invitation = await manager.save(
            manager.create(SeatInvitation, { seatId: seat.id, email, tokenHash: tokenHash(token), invitedBy: owner.id, expiresAt: new Date(now.getTime() + INVITATION_MS), lastSentAt: now }),
          );
          await recordAudit(manager, { actorId: owner.id, targetId: null, action: 'seat.invited', detail: { shopId, email, invitationId: invitation.id } });
          return invitation.id;
        });
        result.invited.push({ email, invitationId });
        mails.push({ email, token });
      } catch (error) {
        if (!isBalanceViolation(error)) throw error;
        result.skipped.push({ email, reason: 'No free seat left: buy more seats or release one.' });
      }
    }
    for (const { email, token } of mails) this.sendInvitation(email, token, owner.displayName, shop?.name ?? 'your shop');
    const after = await this.dataSource.getRepository(SeatPool).findOneByOrFail({ id: pool.id });
    result.available = after.purchased - after.refunded - after.inUse;
    return result;
  }

  /** A new link (the old one stops working) and 14 more days. */
  async resend(owner: User, shopId: string, invitationId: string): Promise<void> {
    const invitation = await this.pendingInvitation(shopId, invitationId);
    const token = randomBytes(32).toString('base64url');
    const now = this.now();
    await this.dataSource.getRepository(SeatInvitation).update(
      { id: invitation.id },
      { tokenHash: tokenHash(token), expiresAt: new Date(now.getTime() + INVITATION_MS), lastSentAt: now, sendCount: invitation.sendCount + 1 },
    );
    const [shop] = await this.dataSource.query('SELECT name FROM shop WHERE id = $1', [shopId]);
    this.sendInvitation(invitation.email, token, owner.displayName, shop?.name ?? 'your shop');
  }

  /** The invitation stops working and its seat comes back. */
  async revoke(owner: User, shopId: string, invitationId: string): Promise<void> {
    const invitation = await this.pendingInvitation(shopId, invitationId);
    await this.dataSource.transaction(async (manager) => {
      const now = this.now();
      await manager.update(SeatInvitation, { id: invitation.id }, { revokedAt: now });
      await manager.update(Seat, { id: invitation.seatId }, { status: 'released', releasedAt: now });
      await recordAudit(manager, { actorId: owner.id, targetId: null, action: 'seat.invitation-revoked', detail: { shopId, email: invitation.email, invitationId } });
    });
  }

  /**
   * The invited apprentice takes the seat: signed in with the invited address, verified, holding no
   * other seat. The seat becomes theirs and their account joins the shop. The link works once.
   */
  async accept(user: User, token: string): Promise<AcceptedInvitation> {
    if (user.role !== 'apprentice') throw HttpProblem.forbidden('Invitations are for apprentices; this account is not one.');
    if (!user.verifiedAt) throw HttpProblem.forbidden('Confirm your e-mail address first (the link in our first e-mail), then open the invitation again.');
    return this.dataSource.transaction(async (manager) => {
      const invitation = await manager.getRepository(SeatInvitation).findOne({ where: { tokenHash: tokenHash(token) }, lock: { mode: 'pessimistic_write' } });
      if (!invitation || invitation.revokedAt) throw HttpProblem.notFound('This invitation link is not valid any more. Ask the shop owner to send a new one.');
      if (invitation.acceptedAt) throw HttpProblem.conflict('This invitation has already been used.');
      if (invitation.expiresAt.getTime() < this.now().getTime()) throw HttpProblem.conflict('This invitation has expired. Ask the shop owner to send it again.');
      if (invitation.email.toLowerCase() !== user.email.toLowerCase()) {
        throw HttpProblem.forbidden(`This invitation was sent to ${invitation.email}. Sign in with that address to accept it.`);
      }
      const seat = await manager.getRepository(Seat).findOneByOrFail({ id: invitation.seatId });
      const pool = await manager.getRepository(SeatPool).findOneByOrFail({ id: seat.poolId });
      const now = this.now();
      try {
        await manager.update(Seat, { id: seat.id }, { status: 'assigned', holderId: user.id, assignedAt: now });
      } catch (error) {
        if (isHolderViolation(error)) throw HttpProblem.conflict('You already hold a seat. Ask the shop that gave it to release it first.');
        throw error;
      }
      await manager.update(SeatInvitation, { id: invitation.id }, { acceptedAt: now, acceptedBy: user.id });
      if (pool.shopId) await manager.query('UPDATE user_account SET shop_id = $2 WHERE id = $1', [user.id, pool.shopId]);
      await recordAudit(manager, { actorId: user.id, targetId: user.id, action: 'seat.accepted', detail: { shopId: pool.shopId, invitationId: invitation.id } });
      const [shop] = await manager.query('SELECT id, name FROM shop WHERE id = $1', [pool.shopId]);
      return { shop: { id: shop.id as string, name: shop.name as string }, seatId: seat.id };
    });
  }

  /** A seat for an apprentice already linked to the shop (one who left and came back, or made by an operator). */
  async assign(owner: User, shopId: string, userId: string): Promise<SeatRow['seatId']> {
    const [apprentice] = await this.dataSource.query(`SELECT id FROM user_account WHERE id = $1 AND shop_id = $2 AND role = 'apprentice' AND disabled_at IS NULL`, [userId, shopId]);
    if (!apprentice) throw HttpProblem.notFound('No apprentice of your shop has this id.');
    const pool = await this.poolOf(this.dataSource.manager, shopId);
    await this.releaseExpired(pool.id);
    try {
      return await this.dataSource.transaction(async (manager) => {
        const seat = await manager.save(manager.create(Seat, { poolId: pool.id, status: 'assigned', holderId: userId, assignedAt: this.now() }));
        await recordAudit(manager, { actorId: owner.id, targetId: userId, action: 'seat.assigned', detail: { shopId, seatId: seat.id } });
        return seat.id;
      });
    } catch (error) {
      if (isBalanceViolation(error)) throw HttpProblem.conflict('No free seat left: buy more seats or release one.');
      if (isHolderViolation(error)) throw HttpProblem.conflict('This apprentice already holds a seat.');
      throw error;
    }
  }

  /** The seat comes back to the shop; the apprentice keeps their progress and attempts. */
  async release(owner: User, shopId: string, seatId: string): Promise<void> {
    if (!isUuid(seatId)) throw HttpProblem.notFound('Your shop has no such seat.');
    const pool = await this.poolOf(this.dataSource.manager, shopId);
    await this.dataSource.transaction(async (manager) => {
      const seat = await manager.getRepository(Seat).findOne({ where: { id: seatId, poolId: pool.id }, lock: { mode: 'pessimistic_write' } });
      if (!seat || seat.status === 'released') throw HttpProblem.notFound('Your shop has no such seat in use.');
      const now = this.now();
      await manager.update(Seat, { id: seat.id }, { status: 'released', releasedAt: now });
      if (seat.status === 'invited') await manager.update(SeatInvitation, { seatId: seat.id }, { revokedAt: now });
      await recordAudit(manager, { actorId: owner.id, targetId: seat.holderId, action: 'seat.released', detail: { shopId, seatId } });
    });
  }

  /** Invitations past their 14 days give their seats back. */
  private async releaseExpired(poolId: string): Promise<void> {
    await this.dataSource.query(
      `UPDATE seat s SET status = 'released', released_at = $2
         FROM seat_invitation i
        WHERE i.seat_id = s.id AND s.pool_id = $1 AND s.status = 'invited' AND i.expires_at < $2`,
      [poolId, this.now()],
    );
  }

  private async pendingInvitation(shopId: string, invitationId: string): Promise<SeatInvitation> {
    const pool = await this.poolOf(this.dataSource.manager, shopId);
    const invitation = isUuid(invitationId)
      ? await this.dataSource.getRepository(SeatInvitation).findOne({ where: { id: invitationId }, relations: { seat: true } })
      : null;
    if (!invitation || invitation.seat?.poolId !== pool.id) throw HttpProblem.notFound('Your shop has no such invitation.');
    if (invitation.acceptedAt) throw HttpProblem.conflict('This invitation has been accepted; release the seat instead.');
    if (invitation.revokedAt || invitation.seat.status === 'released') throw HttpProblem.conflict('This invitation was withdrawn or has expired; invite the address again.');
    return invitation;
  }

  private sendInvitation(email: string, token: string, inviterName: string, placeName: string): void {
    const link = `${this.options.appBaseUrl}/invitations/accept?token=${encodeURIComponent(token)}`;
    this.options.mailer.sendInBackground({ to: email, secrets: [token] }, invitationMail({ inviterName, placeName, link, validDays: INVITATION_DAYS }));
  }
}

function constraintOf(error: unknown): string | undefined {
  const failed = error as { constraint?: string; driverError?: { constraint?: string } };
  return failed?.driverError?.constraint ?? failed?.constraint;
}

function isBalanceViolation(error: unknown): boolean {
  return constraintOf(error) === 'seat_pool_balance_check';
}

function isHolderViolation(error: unknown): boolean {
  return constraintOf(error) === 'seat_holder_key';
}
