import type { MigrationInterface, QueryRunner } from 'typeorm';

/** In-app notifications (`notification`): one row per notice to one user, read or not. */
export class Notifications1796500000000 implements MigrationInterface {
  name = 'Notifications1796500000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE notification (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL,
        kind varchar(40) NOT NULL,
        title varchar(200) NOT NULL,
        body text NOT NULL,
        link varchar(500),
        created_at timestamptz NOT NULL DEFAULT now(),
        read_at timestamptz,
        CONSTRAINT notification_pkey PRIMARY KEY (id),
        CONSTRAINT notification_user_fkey FOREIGN KEY (user_id) REFERENCES user_account (id) ON DELETE CASCADE,
        CONSTRAINT notification_link_check CHECK (link IS NULL OR link LIKE '/%')
      )`);
    await queryRunner.query('CREATE INDEX notification_user_idx ON notification (user_id, created_at)');
    // The unread count on every page load reads only unread rows.
    await queryRunner.query('CREATE INDEX notification_unread_idx ON notification (user_id) WHERE read_at IS NULL');
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE notification');
  }
}
