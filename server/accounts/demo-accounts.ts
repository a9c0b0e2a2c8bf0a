import type { EntityManager } from 'typeorm';

import type { DemoAccount, Role } from '../../shared/api/accounts';
import { PasswordHasher } from '../auth/passwords';
import type { SeedSet } from '../database/seeds';
import { CohortMember } from '../cohorts/cohort-member.entity';
import { Cohort } from '../cohorts/cohort.entity';
import { Shop } from '../shops/shop.entity';
import { User } from './user.entity';

/** The one password of every demo account (long enough, not a common one). Demo data only. */
export const DEMO_PASSWORD = 'demo-flowlore-2026';

interface DemoPerson {
  readonly email: string;
  readonly displayName: string;
  readonly role: Role;
  /** Apprentices of the Larkfield Flow Lab. */
  readonly inShop?: boolean;
}

/** The invented demo scenario: the Larkfield Flow Lab, its owner, two instructors, six apprentices, an admin. */
export const DEMO_PEOPLE: readonly DemoPerson[] = [
  { email: 'admin@demo.flowlore.test', displayName: 'Priya Danvers', role: 'admin' },
  { email: 'morag.tull@demo.flowlore.test', displayName: 'Morag Tull', role: 'instructor' },
  { email: 'ewan.castell@demo.flowlore.test', displayName: 'Ewan Castell', role: 'instructor' },
  { email: 'owner@demo.flowlore.test', displayName: 'Hollis Brande', role: 'shop_owner' },
  { email: 'jo.okafor@demo.flowlore.test', displayName: 'Jo Okafor', role: 'apprentice', inShop: true },
  { email: 'sam.reyes@demo.flowlore.test', displayName: 'Sam Reyes', role: 'apprentice', inShop: true },
  { email: 'ines.marwick@demo.flowlore.test', displayName: 'Ines Marwick', role: 'apprentice', inShop: true },
  { email: 'tobias.lund@demo.flowlore.test', displayName: 'Tobias Lund', role: 'apprentice', inShop: true },
  { email: 'keri.ashdown@demo.flowlore.test', displayName: 'Keri Ashdown', role: 'apprentice' },
  { email: 'dev.patel@demo.flowlore.test', displayName: 'Dev Patel-Orme', role: 'apprentice' },
];

export const DEMO_SHOP_NAME = 'Larkfield Flow Lab';

/** What `GET /api/auth/demo-accounts` lists in demo mode. */
export function demoAccounts(): DemoAccount[] {
  return DEMO_PEOPLE.map((p) => ({ email: p.email, displayName: p.displayName, role: p.role, password: DEMO_PASSWORD }));
}

async function upsertUser(manager: EntityManager, person: DemoPerson, passwordHash: string): Promise<User> {
  const existing = await manager.findOneBy(User, { email: person.email });
  if (existing) return existing;
  return manager.save(
    manager.create(User, { email: person.email, displayName: person.displayName, role: person.role, passwordHash, verifiedAt: new Date(), disabledAt: null, shopId: null }),
  );
}

/** Seed set: demo accounts (verified), the shop and two cohorts. Idempotent by e-mail and name. */
export const demoAccountsSeed: SeedSet = {
  name: 'demo-accounts',
  version: 1,
  apply: async (manager) => {
    const passwordHash = await new PasswordHasher(12).hash(DEMO_PASSWORD);
    const people = new Map<string, User>();
    for (const person of DEMO_PEOPLE) people.set(person.email, await upsertUser(manager, person, passwordHash));
    const owner = people.get('owner@demo.flowlore.test') as User;
    const shop = (await manager.findOneBy(Shop, { ownerId: owner.id })) ?? (await manager.save(manager.create(Shop, { name: DEMO_SHOP_NAME, ownerId: owner.id })));
    const shopMembers = [owner, ...DEMO_PEOPLE.filter((p) => p.inShop).map((p) => people.get(p.email) as User)];
    for (const user of shopMembers) await manager.update(User, { id: user.id }, { shopId: shop.id });

    const cohorts: Array<{ name: string; instructor: string; members: string[] }> = [
      { name: 'Spring bench intake 2026', instructor: 'morag.tull@demo.flowlore.test', members: ['jo.okafor', 'sam.reyes', 'ines.marwick', 'keri.ashdown'] },
      { name: 'Forced induction evening class', instructor: 'ewan.castell@demo.flowlore.test', members: ['tobias.lund', 'dev.patel', 'sam.reyes'] },
    ];
    for (const plan of cohorts) {
      const instructor = people.get(plan.instructor) as User;
      const cohort =
        (await manager.findOneBy(Cohort, { name: plan.name, instructorId: instructor.id })) ??
        (await manager.save(manager.create(Cohort, { name: plan.name, instructorId: instructor.id })));
      for (const local of plan.members) {
        const member = people.get(`${local}@demo.flowlore.test`) as User;
        await manager.createQueryBuilder().insert().into(CohortMember).values({ cohortId: cohort.id, userId: member.id }).orIgnore().execute();
      }
    }
  },
};
