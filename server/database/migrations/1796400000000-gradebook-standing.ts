import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The gradebook's standing per apprentice, kept by triggers so that a gradebook page reads one row
 * per apprentice (and one per quiz for the rows on the page) instead of aggregating every attempt
 * of the cohort: `quiz_standing` (per apprentice and quiz: status, best score, attempts used,
 * failed attempts, last activity) and `learner_standing` (lessons finished, quizzes passed, the most
 * failed attempts at one quiz, last activity).
 *
 * Triggers: a change of `quiz_attempt` recomputes that apprentice's quiz row and learner row; a
 * change of `lesson_progress` recomputes the learner row; an autosave (`quiz_response.answered_at`)
 * moves both last-activity times on. Each refresh first locks the standing row, then reads the
 * attempts (a fresh snapshot per statement), so concurrent writers cannot leave a stale row.
 * Lock order is always quiz row, then learner row.
 */
export class GradebookStanding1796400000000 implements MigrationInterface {
  name = 'GradebookStanding1796400000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE quiz_standing (
        user_id uuid NOT NULL,
        quiz_slug varchar(80) NOT NULL,
        status varchar(24) NOT NULL DEFAULT 'not-started',
        best_percent double precision,
        attempts_used integer NOT NULL DEFAULT 0,
        failed_attempts integer NOT NULL DEFAULT 0,
        last_activity_at timestamptz,
        CONSTRAINT quiz_standing_pkey PRIMARY KEY (user_id, quiz_slug),
        CONSTRAINT quiz_standing_user_fkey FOREIGN KEY (user_id) REFERENCES user_account (id) ON DELETE CASCADE
      )`);
    // A quiz column filtered by status (and sorted by score) reads only the matching rows.
    await queryRunner.query('CREATE INDEX quiz_standing_quiz_idx ON quiz_standing (quiz_slug, status, best_percent)');
    await queryRunner.query(`
      CREATE TABLE learner_standing (
        user_id uuid NOT NULL,
        lessons_finished integer NOT NULL DEFAULT 0,
        quizzes_passed integer NOT NULL DEFAULT 0,
        max_failed_attempts integer NOT NULL DEFAULT 0,
        last_activity_at timestamptz,
        CONSTRAINT learner_standing_pkey PRIMARY KEY (user_id),
        CONSTRAINT learner_standing_user_fkey FOREIGN KEY (user_id) REFERENCES user_account (id) ON DELETE CASCADE
      )`);

    await queryRunner.query(`
      CREATE FUNCTION gradebook_refresh_learner(p_user uuid) RETURNS void LANGUAGE plpgsql AS $$
      BEGIN
        -- A user being deleted (cascades) keeps no standing.
        IF NOT EXISTS (SELECT 1 FROM user_account WHERE id = p_user) THEN RETURN; END IF;
        INSERT INTO learner_standing (user_id) VALUES (p_user) ON CONFLICT DO NOTHING;
        PERFORM 1 FROM learner_standing WHERE user_id = p_user FOR UPDATE;
        UPDATE learner_standing SET
          lessons_finished = (SELECT count(*) FROM lesson_progress WHERE user_id = p_user AND finished_at IS NOT NULL),
          quizzes_passed = (SELECT count(*) FROM quiz_standing WHERE user_id = p_user AND status = 'passed'),
          max_failed_attempts = coalesce((SELECT max(failed_attempts) FROM quiz_standing WHERE user_id = p_user), 0),
          last_activity_at = greatest(
            (SELECT max(last_activity_at) FROM lesson_progress WHERE user_id = p_user),
            (SELECT max(last_activity_at) FROM quiz_standing WHERE user_id = p_user))
        WHERE user_id = p_user;
      END $$`);

    await queryRunner.query(`
      CREATE FUNCTION gradebook_refresh_quiz(p_user uuid, p_slug varchar) RETURNS void LANGUAGE plpgsql AS $$
      BEGIN
        IF NOT EXISTS (SELECT 1 FROM user_account WHERE id = p_user) THEN RETURN; END IF;
        INSERT INTO quiz_standing (user_id, quiz_slug) VALUES (p_user, p_slug) ON CONFLICT DO NOTHING;
        PERFORM 1 FROM quiz_standing WHERE user_id = p_user AND quiz_slug = p_slug FOR UPDATE;
        UPDATE quiz_standing s SET
          attempts_used = a.used,
          best_percent = a.best,
          failed_attempts = a.failed,
          last_activity_at = a.last_at,
          status = CASE WHEN a.passed THEN 'passed' WHEN a.pending > 0 THEN 'waiting-for-grading'
                        WHEN a.graded > 0 THEN 'not-yet-passed' WHEN a.used > 0 THEN 'in-progress' ELSE 'not-started' END
          FROM (
            SELECT count(*)::int AS used,
                   max(q.score_percent) FILTER (WHERE q.status = 'submitted') AS best,
                   coalesce(bool_or(q.passed) FILTER (WHERE q.status = 'submitted'), false) AS passed,
                   count(*) FILTER (WHERE q.status = 'submitted')::int AS graded,
                   count(*) FILTER (WHERE q.status = 'submitted' AND q.pending_count > 0)::int AS pending,
                   count(*) FILTER (WHERE q.status = 'submitted' AND q.pending_count = 0 AND q.passed IS NOT TRUE)::int AS failed,
                   -- A submitted attempt's answers are no later than its submit; only open ones need a look.
                   max(greatest(q.started_at, q.submitted_at,
                       CASE WHEN q.status = 'open' THEN (SELECT max(r.answered_at) FROM quiz_response r WHERE r.attempt_id = q.id) END)) AS last_at
              FROM quiz_attempt q WHERE q.user_id = p_user AND q.quiz_slug = p_slug
          ) AS a
         WHERE s.user_id = p_user AND s.quiz_slug = p_slug;
        DELETE FROM quiz_standing WHERE user_id = p_user AND quiz_slug = p_slug AND attempts_used = 0;
        PERFORM gradebook_refresh_learner(p_user);
      END $$`);

    await queryRunner.query(`
      CREATE FUNCTION gradebook_on_attempt() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF TG_OP <> 'INSERT' THEN PERFORM gradebook_refresh_quiz(OLD.user_id, OLD.quiz_slug); END IF;
        IF TG_OP = 'INSERT' OR (TG_OP = 'UPDATE' AND (NEW.user_id, NEW.quiz_slug) IS DISTINCT FROM (OLD.user_id, OLD.quiz_slug)) THEN
          PERFORM gradebook_refresh_quiz(NEW.user_id, NEW.quiz_slug);
        END IF;
        RETURN NULL;
      END $$`);
    await queryRunner.query(`
      CREATE TRIGGER quiz_attempt_gradebook AFTER INSERT OR DELETE OR UPDATE OF user_id, quiz_slug, status, started_at, submitted_at, score_percent, passed, pending_count
        ON quiz_attempt FOR EACH ROW EXECUTE FUNCTION gradebook_on_attempt()`);

    await queryRunner.query(`
      CREATE FUNCTION gradebook_on_lesson() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF TG_OP <> 'INSERT' THEN PERFORM gradebook_refresh_learner(OLD.user_id); END IF;
        IF TG_OP = 'INSERT' OR (TG_OP = 'UPDATE' AND NEW.user_id IS DISTINCT FROM OLD.user_id) THEN PERFORM gradebook_refresh_learner(NEW.user_id); END IF;
        RETURN NULL;
      END $$`);
    await queryRunner.query('CREATE TRIGGER lesson_progress_gradebook AFTER INSERT OR UPDATE OR DELETE ON lesson_progress FOR EACH ROW EXECUTE FUNCTION gradebook_on_lesson()');

    await queryRunner.query(`
      CREATE FUNCTION gradebook_on_answer() RETURNS trigger LANGUAGE plpgsql AS $$
      DECLARE
        owner uuid;
        slug varchar;
      BEGIN
        SELECT user_id, quiz_slug INTO owner, slug FROM quiz_attempt WHERE id = NEW.attempt_id;
        UPDATE quiz_standing SET last_activity_at = greatest(last_activity_at, NEW.answered_at) WHERE user_id = owner AND quiz_slug = slug;
        UPDATE learner_standing SET last_activity_at = greatest(last_activity_at, NEW.answered_at) WHERE user_id = owner;
        RETURN NULL;
      END $$`);
    await queryRunner.query(`
      CREATE TRIGGER quiz_response_gradebook AFTER UPDATE OF answered_at ON quiz_response
        FOR EACH ROW WHEN (NEW.answered_at IS NOT NULL AND NEW.answered_at IS DISTINCT FROM OLD.answered_at) EXECUTE FUNCTION gradebook_on_answer()`);

    // What is there already.
    await queryRunner.query('SELECT gradebook_refresh_quiz(user_id, quiz_slug) FROM (SELECT DISTINCT user_id, quiz_slug FROM quiz_attempt) AS pairs');
    await queryRunner.query('SELECT gradebook_refresh_learner(user_id) FROM (SELECT DISTINCT user_id FROM lesson_progress) AS learners');
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TRIGGER quiz_response_gradebook ON quiz_response');
    await queryRunner.query('DROP TRIGGER lesson_progress_gradebook ON lesson_progress');
    await queryRunner.query('DROP TRIGGER quiz_attempt_gradebook ON quiz_attempt');
    await queryRunner.query('DROP FUNCTION gradebook_on_answer()');
    await queryRunner.query('DROP FUNCTION gradebook_on_lesson()');
    await queryRunner.query('DROP FUNCTION gradebook_on_attempt()');
    await queryRunner.query('DROP FUNCTION gradebook_refresh_quiz(uuid, varchar)');
    await queryRunner.query('DROP FUNCTION gradebook_refresh_learner(uuid)');
    await queryRunner.query('DROP TABLE learner_standing');
    await queryRunner.query('DROP TABLE quiz_standing');
  }
}
