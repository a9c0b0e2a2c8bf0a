import type { DataSource } from 'typeorm';

import { createUserSchema, type CreateUserRequest } from '../../shared/api/accounts';
import { recordAudit } from '../admin/audit-log';
import { passwordProblem, type PasswordHasher } from '../auth/passwords';
import { Shop } from '../shops/shop.entity';
import { User } from './user.entity';

/** Why an operator's account could not be created; the message is meant for their terminal. */
export class CreateUserRefused extends Error {}

/**
 * Creates a verified account of any role for an operator (`cli.js create-user`): the way a deployment
 * gets its first administrator, since nobody can sign up as one. The same field and password rules as
 * sign-up apply; a shop owner gets the named shop, an apprentice joins the existing shop of that
 * name (until seats let owners invite them); the audit log records it with no actor (the CLI).
 */
export async function createVerifiedUser(
  deps: { dataSource: DataSource; hasher: PasswordHasher; now?: () => Date },
  input: CreateUserRequest,
): Promise<User> {
  const parsed = createUserSchema.safeParse(input);
  if (!parsed.success) {
    throw new CreateUserRefused(parsed.error.issues.map((issue) => `${issue.path.join('.') || 'input'}: ${issue.message}`).join('\n'));
  }
  const request = parsed.data;
  const problem = passwordProblem(request.password, request);
  if (problem) throw new CreateUserRefused(`The password cannot be used. ${problem}`);
  const passwordHash = await deps.hasher.hash(request.password);
  const now = deps.now?.() ?? new Date();
  try {
    return await deps.dataSource.transaction(async (manager) => {
      const existing = await manager.getRepository(User).createQueryBuilder('u').where('lower(u.email) = lower(:email)', { email: request.email }).getOne();
      if (existing) throw new CreateUserRefused(`There is already an account for ${request.email}; nothing was changed.`);
      const user = await manager.save(
        manager.create(User, { email: request.email, displayName: request.displayName, passwordHash, role: request.role, shopId: null, verifiedAt: now, disabledAt: null }),
      );
      if (request.role === 'shop_owner' && request.shopName) {
        const shop = await manager.save(manager.create(Shop, { name: request.shopName, ownerId: user.id }));
        await manager.update(User, { id: user.id }, { shopId: shop.id });
        user.shopId = shop.id;
      }
      if (request.role === 'apprentice' && request.shopName) {
        const shops = await manager.getRepository(Shop).find({ where: { name: request.shopName }, take: 2 });
        if (shops.length === 0) throw new CreateUserRefused(`There is no shop named "${request.shopName}"; nothing was changed.`);
        if (shops.length > 1) throw new CreateUserRefused(`More than one shop is named "${request.shopName}"; nothing was changed.`);
        await manager.update(User, { id: user.id }, { shopId: shops[0]!.id });
        user.shopId = shops[0]!.id;
      }
      await recordAudit(manager, { actorId: null, targetId: user.id, action: 'account.created', detail: { role: request.role, by: 'cli' } });
      return user;
    });
  } catch (error) {
    // Two operators racing for one address: the unique index on lower(email) decides.
    if (isUniqueViolation(error)) throw new CreateUserRefused(`There is already an account for ${request.email}; nothing was changed.`);
    throw error;
  }
}

function isUniqueViolation(error: unknown): boolean {
  const failed = error as { code?: string; driverError?: { code?: string } };
  return failed?.code === '23505' || failed?.driverError?.code === '23505';
}
