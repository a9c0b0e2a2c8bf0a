import { Router } from 'express';
import type { DataSource } from 'typeorm';

import { checkHealth } from './health.service';

export function healthRouter(dataSource: DataSource): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const report = await checkHealth(dataSource);
    res.status(report.database === 'up' ? 200 : 503).set('Cache-Control', 'no-store').json(report);
  });
  return router;
}
