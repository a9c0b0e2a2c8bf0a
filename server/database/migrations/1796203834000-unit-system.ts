import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The calculators' unit system saved with the account (null: not chosen yet, the browser decides). */
export class UnitSystem1796203834000 implements MigrationInterface {
  name = 'UnitSystem1796203834000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`CREATE TYPE unit_system AS ENUM ('si', 'us')`);
    await queryRunner.query('ALTER TABLE user_account ADD COLUMN unit_system unit_system');
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE user_account DROP COLUMN unit_system');
    await queryRunner.query('DROP TYPE unit_system');
  }
}
