import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * `quiz_attempt.answers_version`: every autosave bumps it, so a submit can read the answers, grade
 * them and write the grades in one statement that holds only if no answer changed in between.
 */
export class AttemptAnswersVersion1796600000000 implements MigrationInterface {
  name = 'AttemptAnswersVersion1796600000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE quiz_attempt ADD COLUMN answers_version integer NOT NULL DEFAULT 0');
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE quiz_attempt DROP COLUMN answers_version');
  }
}
