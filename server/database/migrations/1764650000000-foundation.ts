import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Foundation1764650000000 implements MigrationInterface {
  name = 'Foundation1764650000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE seed_run (
        name varchar(100) PRIMARY KEY,
        version integer NOT NULL,
        applied_at timestamptz NOT NULL DEFAULT now()
      )`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE seed_run');
  }
}
