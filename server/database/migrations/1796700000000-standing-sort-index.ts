import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The gradebook's quiz index in the order a page sorts by (best score ascending with nothing-yet
 * first, so that read backwards it gives descending with nothing-yet last) and carrying the
 * apprentice's id: a page sorted by a quiz and filtered by its status walks the index and stops at
 * its last row, and the count of matches reads the index alone.
 */
export class StandingSortIndex1796700000000 implements MigrationInterface {
  name = 'StandingSortIndex1796700000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP INDEX quiz_standing_quiz_idx');
    await queryRunner.query('CREATE INDEX quiz_standing_quiz_idx ON quiz_standing (quiz_slug, status, best_percent NULLS FIRST) INCLUDE (user_id)');
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP INDEX quiz_standing_quiz_idx');
    await queryRunner.query('CREATE INDEX quiz_standing_quiz_idx ON quiz_standing (quiz_slug, status, best_percent)');
  }
}
