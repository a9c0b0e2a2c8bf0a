import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Invitations to a shop's seat (issue 11): each holds a seat (`seat.status = 'invited'`) for an
 * e-mail address for 14 days; its single-use link carries a token of which only the SHA-256 is kept.
 */
export class SeatInvitations1796900000000 implements MigrationInterface {
  name = 'SeatInvitations1796900000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE seat_invitation (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        seat_id uuid NOT NULL,
        email varchar(254) NOT NULL,
        token_hash varchar(64) NOT NULL,
        invited_by uuid,
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        last_sent_at timestamptz NOT NULL DEFAULT now(),
        send_count integer NOT NULL DEFAULT 1,
        accepted_at timestamptz,
        accepted_by uuid,
        revoked_at timestamptz,
        CONSTRAINT seat_invitation_pkey PRIMARY KEY (id),
        CONSTRAINT seat_invitation_seat_fkey FOREIGN KEY (seat_id) REFERENCES seat (id) ON DELETE CASCADE,
        CONSTRAINT seat_invitation_inviter_fkey FOREIGN KEY (invited_by) REFERENCES user_account (id) ON DELETE SET NULL,
        CONSTRAINT seat_invitation_acceptor_fkey FOREIGN KEY (accepted_by) REFERENCES user_account (id) ON DELETE SET NULL
      )`);
    await queryRunner.query('CREATE UNIQUE INDEX seat_invitation_seat_key ON seat_invitation (seat_id)');
    await queryRunner.query('CREATE UNIQUE INDEX seat_invitation_token_key ON seat_invitation (token_hash)');
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE seat_invitation');
  }
}
