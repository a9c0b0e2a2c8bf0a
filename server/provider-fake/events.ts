import { Router } from 'express';
import { z } from 'zod';

import { ProviderError } from './errors';
import { integerParam, readParams } from './params';
import { listOf } from './resources';
import type { ProviderStore } from './store';

const listQuery = z.looseObject({
  type: z.string().optional(),
  limit: integerParam(1, 100).optional(),
});

/** `/v1/events`: retrieve one (an app may fetch an event again rather than trust a webhook body) or list, newest first. */
export function eventsRouter(store: ProviderStore): Router {
  const router = Router();
  router.get('/', (req, res) => {
    const query = readParams(listQuery, req.query);
    const matching = [...store.events.values()].filter((event) => !query.type || event.type === query.type).reverse();
    const limit = query.limit ?? 10;
    res.json(listOf(structuredClone(matching.slice(0, limit)), '/v1/events', matching.length > limit));
  });
  router.get('/:id', (req, res) => {
    const event = store.events.get(req.params.id);
    if (!event) throw ProviderError.noSuch('event', req.params.id);
    res.json(event);
  });
  return router;
}
