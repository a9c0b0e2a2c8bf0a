import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Accounts: users with roles, shops, cohorts, single-use e-mail tokens, the e-mail outbox, the
 * audit log, the session table of connect-pg-simple (its own schema, made here rather than by
 * the library) and the shared counters of the rate limiter.
 */
export class Accounts1764700000000 implements MigrationInterface {
  name = 'Accounts1764700000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`CREATE TYPE user_role AS ENUM ('apprentice', 'instructor', 'shop_owner', 'admin')`);
    await queryRunner.query(`
      CREATE TABLE user_account (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        email varchar(254) NOT NULL,
        display_name varchar(100) NOT NULL,
        password_hash varchar(100) NOT NULL,
        role user_role NOT NULL,
        shop_id uuid,
        verified_at timestamptz,
        disabled_at timestamptz,
        failed_sign_ins integer NOT NULL DEFAULT 0,
        last_failed_sign_in_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT user_account_pkey PRIMARY KEY (id)
      )`);
    await queryRunner.query('CREATE UNIQUE INDEX user_account_email_key ON user_account (lower(email))');
    await queryRunner.query('CREATE INDEX user_account_shop_idx ON user_account (shop_id)');

    await queryRunner.query(`
      CREATE TABLE shop (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        name varchar(120) NOT NULL,
        owner_id uuid NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT shop_pkey PRIMARY KEY (id),
        CONSTRAINT shop_owner_fkey FOREIGN KEY (owner_id) REFERENCES user_account (id) ON DELETE RESTRICT
      )`);
    await queryRunner.query('CREATE UNIQUE INDEX shop_owner_key ON shop (owner_id)');
    await queryRunner.query(
      'ALTER TABLE user_account ADD CONSTRAINT user_account_shop_fkey FOREIGN KEY (shop_id) REFERENCES shop (id) ON DELETE SET NULL',
    );

    await queryRunner.query(`
      CREATE TABLE cohort (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        name varchar(120) NOT NULL,
        instructor_id uuid NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT cohort_pkey PRIMARY KEY (id),
        CONSTRAINT cohort_instructor_fkey FOREIGN KEY (instructor_id) REFERENCES user_account (id) ON DELETE RESTRICT
      )`);
    await queryRunner.query('CREATE INDEX cohort_instructor_idx ON cohort (instructor_id)');
    await queryRunner.query(`
      CREATE TABLE cohort_member (
        cohort_id uuid NOT NULL,
        user_id uuid NOT NULL,
        added_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT cohort_member_pkey PRIMARY KEY (cohort_id, user_id),
        CONSTRAINT cohort_member_cohort_fkey FOREIGN KEY (cohort_id) REFERENCES cohort (id) ON DELETE CASCADE,
        CONSTRAINT cohort_member_user_fkey FOREIGN KEY (user_id) REFERENCES user_account (id) ON DELETE CASCADE
      )`);
    await queryRunner.query('CREATE INDEX cohort_member_user_idx ON cohort_member (user_id)');

    await queryRunner.query(`CREATE TYPE account_token_purpose AS ENUM ('verify-email', 'reset-password', 'invitation')`);
    await queryRunner.query(`
      CREATE TABLE account_token (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL,
        purpose account_token_purpose NOT NULL,
        token_hash varchar(64) NOT NULL,
        expires_at timestamptz NOT NULL,
        used_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT account_token_pkey PRIMARY KEY (id),
        CONSTRAINT account_token_user_fkey FOREIGN KEY (user_id) REFERENCES user_account (id) ON DELETE CASCADE
      )`);
    await queryRunner.query('CREATE UNIQUE INDEX account_token_hash_key ON account_token (token_hash)');
    await queryRunner.query('CREATE INDEX account_token_user_idx ON account_token (user_id)');

    await queryRunner.query(`CREATE TYPE mail_status AS ENUM ('sent', 'failed')`);
    await queryRunner.query(`
      CREATE TABLE mail_outbox (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        to_address varchar(254) NOT NULL,
        subject varchar(200) NOT NULL,
        template varchar(60) NOT NULL,
        text_body text NOT NULL,
        html_body text NOT NULL,
        status mail_status NOT NULL,
        error text,
        sent_at timestamptz,
        user_id uuid,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT mail_outbox_pkey PRIMARY KEY (id),
        CONSTRAINT mail_outbox_user_fkey FOREIGN KEY (user_id) REFERENCES user_account (id) ON DELETE SET NULL
      )`);
    await queryRunner.query('CREATE INDEX mail_outbox_created_idx ON mail_outbox (created_at)');
    await queryRunner.query('CREATE INDEX mail_outbox_user_idx ON mail_outbox (user_id)');

    await queryRunner.query(`
      CREATE TABLE audit_entry (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        actor_id uuid,
        target_id uuid,
        action varchar(60) NOT NULL,
        detail jsonb NOT NULL DEFAULT '{}',
        at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT audit_entry_pkey PRIMARY KEY (id),
        CONSTRAINT audit_entry_actor_fkey FOREIGN KEY (actor_id) REFERENCES user_account (id) ON DELETE SET NULL,
        CONSTRAINT audit_entry_target_fkey FOREIGN KEY (target_id) REFERENCES user_account (id) ON DELETE SET NULL
      )`);
    await queryRunner.query('CREATE INDEX audit_entry_at_idx ON audit_entry (at)');

    // The schema connect-pg-simple expects (its table.sql); we make it, the library never does.
    await queryRunner.query(`
      CREATE TABLE session (
        sid varchar NOT NULL COLLATE "default",
        sess json NOT NULL,
        expire timestamp(6) NOT NULL,
        CONSTRAINT session_pkey PRIMARY KEY (sid)
      )`);
    await queryRunner.query('CREATE INDEX "IDX_session_expire" ON session (expire)');

    // Hits per key and window for express-rate-limit, shared by every app instance.
    await queryRunner.query(`
      CREATE TABLE rate_limit_hit (
        key varchar(200) NOT NULL,
        hits integer NOT NULL,
        reset_at timestamptz NOT NULL,
        CONSTRAINT rate_limit_hit_pkey PRIMARY KEY (key)
      )`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE rate_limit_hit');
    await queryRunner.query('DROP TABLE session');
    await queryRunner.query('DROP TABLE audit_entry');
    await queryRunner.query('DROP TABLE mail_outbox');
    await queryRunner.query('DROP TYPE mail_status');
    await queryRunner.query('DROP TABLE account_token');
    await queryRunner.query('DROP TYPE account_token_purpose');
    await queryRunner.query('DROP TABLE cohort_member');
    await queryRunner.query('DROP TABLE cohort');
    await queryRunner.query('ALTER TABLE user_account DROP CONSTRAINT user_account_shop_fkey');
    await queryRunner.query('DROP TABLE shop');
    await queryRunner.query('DROP TABLE user_account');
    await queryRunner.query('DROP TYPE user_role');
  }
}
