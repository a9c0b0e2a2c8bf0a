import type { Role } from '../../../shared/api/accounts';

/** How each role reads on screen. */
export const ROLE_LABELS: Readonly<Record<Role, string>> = {
  apprentice: 'Apprentice',
  instructor: 'Instructor',
  shop_owner: 'Shop owner',
  admin: 'Administrator',
};
