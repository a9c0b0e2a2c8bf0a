import type { Account, UserSummary } from '../../shared/api/accounts';
import type { User } from './user.entity';

/** The only shapes in which a user leaves the server: never the hash or the sign-in counters. */
export function toAccount(user: User): Account {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    role: user.role,
    verified: user.verifiedAt !== null,
    shopId: user.shopId,
    unitSystem: user.unitSystem,
  };
}

export function toUserSummary(user: User): UserSummary {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    role: user.role,
    verified: user.verifiedAt !== null,
    disabled: user.disabledAt !== null,
    shopId: user.shopId,
    createdAt: user.createdAt.toISOString(),
  };
}
