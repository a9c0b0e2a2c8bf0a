import type { Account, UserSummary } from '../../shared/api/accounts';
import type { User } from './user.entity';

/** The only shapes in which a user leaves the server: never the hash or the sign-in counters. */
export function toAccount(user: User): Account {
  return { ...whoTheyAre(user), unitSystem: user.unitSystem };
}

export function toUserSummary(user: User): UserSummary {
  return { ...whoTheyAre(user), disabled: user.disabledAt !== null, createdAt: user.createdAt.toISOString() };
}

/** The fields both shapes share. */
function whoTheyAre(user: User) {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    role: user.role,
    verified: user.verifiedAt !== null,
    shopId: user.shopId,
  };
}
