import type { DataSource } from 'typeorm';

import type { CohortDetail, CohortSummary } from '../../shared/api/accounts';
import { User } from '../accounts/user.entity';
import { HttpProblem } from '../http/problem';
import { CohortMember } from './cohort-member.entity';
import { Cohort } from './cohort.entity';

interface SummaryRow {
  id: string;
  name: string;
  instructor_id: string;
  instructor_name: string;
  member_count: number;
  created_at: Date;
}

/** Instructors' cohorts and their apprentices. Ownership is checked by the route guard. */
export class CohortsService {
  constructor(private readonly dataSource: DataSource) {}

  async listFor(instructorId: string | null): Promise<CohortSummary[]> {
    const rows: SummaryRow[] = await this.dataSource.query(
      `SELECT c.id, c.name, c.instructor_id, u.display_name AS instructor_name, c.created_at,
              (SELECT count(*)::int FROM cohort_member m WHERE m.cohort_id = c.id) AS member_count
         FROM cohort c JOIN user_account u ON u.id = c.instructor_id
        WHERE $1::uuid IS NULL OR c.instructor_id = $1
        ORDER BY c.created_at, c.id`,
      [instructorId],
    );
    return rows.map(toSummary);
  }

  async create(instructorId: string, name: string): Promise<CohortSummary> {
    const cohort = await this.dataSource.getRepository(Cohort).save({ name, instructorId });
    return (await this.summary(cohort.id)) as CohortSummary;
  }

  private async summary(id: string): Promise<CohortSummary | undefined> {
    const rows: SummaryRow[] = await this.dataSource.query(
      `SELECT c.id, c.name, c.instructor_id, u.display_name AS instructor_name, c.created_at,
              (SELECT count(*)::int FROM cohort_member m WHERE m.cohort_id = c.id) AS member_count
         FROM cohort c JOIN user_account u ON u.id = c.instructor_id WHERE c.id = $1`,
      [id],
    );
    return rows[0] ? toSummary(rows[0]) : undefined;
  }

  async detail(id: string): Promise<CohortDetail> {
    const summary = await this.summary(id);
    if (!summary) throw HttpProblem.notFound(`There is no cohort "${id}".`);
    const members: Array<{ id: string; email: string; display_name: string; added_at: Date }> = await this.dataSource.query(
      `SELECT u.id, u.email, u.display_name, m.added_at FROM cohort_member m JOIN user_account u ON u.id = m.user_id
        WHERE m.cohort_id = $1 ORDER BY u.display_name, u.id`,
      [id],
    );
    return { ...summary, members: members.map((m) => ({ id: m.id, email: m.email, displayName: m.display_name, addedAt: new Date(m.added_at).toISOString() })) };
  }

  /** Adds an apprentice (found by e-mail or id); only apprentice accounts can join a cohort. */
  async addMember(cohortId: string, who: { email: string } | { userId: string }): Promise<CohortDetail> {
    const users = this.dataSource.getRepository(User);
    const user =
      'email' in who
        ? await users.createQueryBuilder('u').where('lower(u.email) = lower(:email)', { email: who.email }).getOne()
        : await users.findOneBy({ id: who.userId });
    if (!user || user.role !== 'apprentice' || user.disabledAt) {
      throw HttpProblem.badRequest('No apprentice account matches.', [{ field: 'email' in who ? 'email' : 'userId', message: 'No apprentice account matches.' }]);
    }
    await this.dataSource.createQueryBuilder().insert().into(CohortMember).values({ cohortId, userId: user.id }).orIgnore().execute();
    return this.detail(cohortId);
  }

  async removeMember(cohortId: string, userId: string): Promise<void> {
    const result = await this.dataSource.getRepository(CohortMember).delete({ cohortId, userId });
    if (!result.affected) throw HttpProblem.notFound('That apprentice is not in this cohort.');
  }
}

function toSummary(row: SummaryRow): CohortSummary {
  return {
    id: row.id,
    name: row.name,
    instructor: { id: row.instructor_id, displayName: row.instructor_name },
    memberCount: row.member_count,
    createdAt: new Date(row.created_at).toISOString(),
  };
}
