import { Router } from 'express';

import { markReadSchema, notificationsQuerySchema } from '../../shared/api/notifications';
import { requireSignedIn, signedInUser } from '../auth/authorize';
import { parseQuery } from '../http/validate-query';
import { validateBody } from '../http/validate';
import type { NotificationsService } from './notifications.service';

/** `/api/notifications`: the signed-in user's own notifications (any role), never cached. */
export function notificationsRouter(notifications: NotificationsService): Router {
  const router = Router();
  router.get('/notifications', requireSignedIn, async (req, res) => {
    const page = await notifications.list(signedInUser(req), parseQuery(notificationsQuerySchema, req));
    res.set('Cache-Control', 'private, no-store').json(page);
  });
  router.post('/notifications/read', requireSignedIn, validateBody(markReadSchema), async (req, res) => {
    res.set('Cache-Control', 'private, no-store').json(await notifications.markRead(signedInUser(req), res.locals['body']));
  });
  return router;
}
