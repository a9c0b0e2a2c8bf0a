import { Router } from 'express';

import { adminUserChangeSchema, adminUserQuerySchema, pageQuerySchema } from '../../shared/api/accounts';
import { requireRole, signedInUser } from '../auth/authorize';
import { HttpProblem } from '../http/problem';
import { parseQuery } from '../http/validate-query';
import { validateBody } from '../http/validate';
import type { AdminService } from './admin.service';

/** `/api/admin/*`: admins only. */
export function adminRouter(admin: AdminService): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/users', async (req, res) => {
    res.set('Cache-Control', 'no-store').json(await admin.listUsers(parseQuery(adminUserQuerySchema, req)));
  });

  router.patch('/users/:id', validateBody(adminUserChangeSchema), async (req, res) => {
    const id = String(req.params['id']);
    if (!/^[0-9a-f-]{36}$/i.test(id)) throw HttpProblem.notFound(`There is no user "${id}".`);
    res.json(await admin.changeUser(signedInUser(req).id, id, res.locals['body']));
  });

  router.get('/outbox', async (req, res) => {
    const { page, pageSize } = parseQuery(pageQuerySchema, req);
    res.set('Cache-Control', 'no-store').json(await admin.listOutbox(page, pageSize));
  });

  router.get('/audit', async (req, res) => {
    const { page, pageSize } = parseQuery(pageQuerySchema, req);
    res.set('Cache-Control', 'no-store').json(await admin.listAudit(page, pageSize));
  });
  return router;
}
