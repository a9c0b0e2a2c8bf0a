import { Router } from 'express';
import type { DataSource } from 'typeorm';

import { profileSchema } from '../../shared/api/accounts';
import { requireSignedIn, signedInUser } from '../auth/authorize';
import { validateBody } from '../http/validate';
import { toAccount } from './account-view';
import { User } from './user.entity';

/** `/api/account/*`: the signed-in user's own details. */
export function profileRouter(dataSource: DataSource): Router {
  const router = Router();
  router.patch('/profile', requireSignedIn, validateBody(profileSchema), async (req, res) => {
    const user = signedInUser(req);
    await dataSource.getRepository(User).update({ id: user.id }, { displayName: res.locals['body'].displayName });
    res.json({ user: toAccount(await dataSource.getRepository(User).findOneByOrFail({ id: user.id })) });
  });
  return router;
}
