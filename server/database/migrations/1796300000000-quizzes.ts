import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Quizzes and progress: every version of a question the server has served, attempts with their
 * seed and deadline, one response row per question of an attempt (the numbers it was given, the
 * draft answer, the grade, an instructor's override or rubric marks), lessons opened and finished,
 * and the xAPI statements made when an attempt is graded.
 */
export class Quizzes1796300000000 implements MigrationInterface {
  name = 'Quizzes1796300000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE question_version (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        quiz_slug varchar(80) NOT NULL,
        question_id varchar(80) NOT NULL,
        version integer NOT NULL,
        fingerprint varchar(64) NOT NULL,
        definition jsonb NOT NULL,
        html jsonb NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT question_version_pkey PRIMARY KEY (id)
      )`);
    await queryRunner.query('CREATE UNIQUE INDEX question_version_number_key ON question_version (quiz_slug, question_id, version)');
    await queryRunner.query('CREATE UNIQUE INDEX question_version_fingerprint_key ON question_version (quiz_slug, question_id, fingerprint)');

    await queryRunner.query(`CREATE TYPE quiz_attempt_status AS ENUM ('open', 'submitted')`);
    await queryRunner.query(`
      CREATE TABLE quiz_attempt (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL,
        quiz_slug varchar(80) NOT NULL,
        number integer NOT NULL,
        seed integer NOT NULL,
        status quiz_attempt_status NOT NULL DEFAULT 'open',
        pass_mark double precision NOT NULL,
        started_at timestamptz NOT NULL,
        deadline_at timestamptz,
        submitted_at timestamptz,
        points double precision,
        max_points double precision NOT NULL,
        score_percent double precision,
        passed boolean,
        pending_count integer NOT NULL DEFAULT 0,
        CONSTRAINT quiz_attempt_pkey PRIMARY KEY (id),
        CONSTRAINT quiz_attempt_user_fkey FOREIGN KEY (user_id) REFERENCES user_account (id) ON DELETE CASCADE
      )`);
    // One row per attempt number: the attempt limit holds even if two starts raced past the count.
    await queryRunner.query('CREATE UNIQUE INDEX quiz_attempt_number_key ON quiz_attempt (user_id, quiz_slug, number)');

    await queryRunner.query(`CREATE TYPE quiz_response_status AS ENUM ('correct', 'partial', 'incorrect', 'unanswered', 'pending')`);
    await queryRunner.query(`
      CREATE TABLE quiz_response (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        attempt_id uuid NOT NULL,
        question_version_id uuid NOT NULL,
        question_id varchar(80) NOT NULL,
        position integer NOT NULL,
        seed integer NOT NULL,
        choice_order jsonb,
        drawn jsonb,
        key jsonb,
        answer jsonb,
        answered_at timestamptz,
        max_points double precision NOT NULL,
        points double precision,
        status quiz_response_status,
        within_tolerance boolean,
        answer_in_key_unit double precision,
        graded_at timestamptz,
        override_points double precision,
        override_reason text,
        override_by uuid,
        override_at timestamptz,
        rubric_marks jsonb,
        grader_comment text,
        graded_by uuid,
        CONSTRAINT quiz_response_pkey PRIMARY KEY (id),
        CONSTRAINT quiz_response_attempt_fkey FOREIGN KEY (attempt_id) REFERENCES quiz_attempt (id) ON DELETE CASCADE,
        CONSTRAINT quiz_response_version_fkey FOREIGN KEY (question_version_id) REFERENCES question_version (id) ON DELETE RESTRICT,
        CONSTRAINT quiz_response_override_by_fkey FOREIGN KEY (override_by) REFERENCES user_account (id) ON DELETE SET NULL,
        CONSTRAINT quiz_response_graded_by_fkey FOREIGN KEY (graded_by) REFERENCES user_account (id) ON DELETE SET NULL
      )`);
    await queryRunner.query('CREATE UNIQUE INDEX quiz_response_question_key ON quiz_response (attempt_id, question_id)');
    await queryRunner.query('CREATE INDEX quiz_response_version_idx ON quiz_response (question_version_id)');

    await queryRunner.query(`
      CREATE TABLE lesson_progress (
        user_id uuid NOT NULL,
        lesson_slug varchar(80) NOT NULL,
        opened_at timestamptz NOT NULL,
        finished_at timestamptz,
        last_activity_at timestamptz NOT NULL,
        CONSTRAINT lesson_progress_pkey PRIMARY KEY (user_id, lesson_slug),
        CONSTRAINT lesson_progress_user_fkey FOREIGN KEY (user_id) REFERENCES user_account (id) ON DELETE CASCADE
      )`);

    await queryRunner.query(`
      CREATE TABLE learning_record (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL,
        attempt_id uuid,
        verb varchar(40) NOT NULL,
        statement jsonb NOT NULL,
        stored_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT learning_record_pkey PRIMARY KEY (id),
        CONSTRAINT learning_record_user_fkey FOREIGN KEY (user_id) REFERENCES user_account (id) ON DELETE CASCADE,
        CONSTRAINT learning_record_attempt_fkey FOREIGN KEY (attempt_id) REFERENCES quiz_attempt (id) ON DELETE SET NULL
      )`);
    await queryRunner.query('CREATE INDEX learning_record_user_idx ON learning_record (user_id, stored_at)');
    await queryRunner.query('CREATE INDEX learning_record_attempt_idx ON learning_record (attempt_id)');
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE learning_record');
    await queryRunner.query('DROP TABLE lesson_progress');
    await queryRunner.query('DROP TABLE quiz_response');
    await queryRunner.query('DROP TYPE quiz_response_status');
    await queryRunner.query('DROP TABLE quiz_attempt');
    await queryRunner.query('DROP TYPE quiz_attempt_status');
    await queryRunner.query('DROP TABLE question_version');
  }
}
