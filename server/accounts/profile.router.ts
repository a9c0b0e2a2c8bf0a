import { Router } from 'express';
import type { DataSource } from 'typeorm';

import { preferencesSchema, profileSchema } from '../../shared/api/accounts';
import { requireSignedIn, signedInUser } from '../auth/authorize';
import { validateBody } from '../http/validate';
import { toAccount } from './account-view';
import { User } from './user.entity';

/** `/api/account/*`: the signed-in user's own details. */
export function profileRouter(dataSource: DataSource): Router {
  const router = Router();
  const users = dataSource.getRepository(User);
  router.patch('/profile', requireSignedIn, validateBody(profileSchema), async (req, res) => {
    const user = signedInUser(req);
    await users.update({ id: user.id }, { displayName: res.locals['body'].displayName });
    res.json({ user: toAccount(await users.findOneByOrFail({ id: user.id })) });
  });
  /** Choices that follow the user to another device (today the calculators' unit system). */
  router.patch('/preferences', requireSignedIn, validateBody(preferencesSchema), async (req, res) => {
    const user = signedInUser(req);
    await users.update({ id: user.id }, { unitSystem: res.locals['body'].unitSystem });
    res.json({ user: toAccount(await users.findOneByOrFail({ id: user.id })) });
  });
  return router;
}
