import { Router } from 'express';

import { ProviderError } from './errors';
import { expandObject } from './expand';
import { commonQuery, readParams } from './params';
import type { ProviderStore } from './store';

/** `GET /v1/payment_intents/:id` and `GET /v1/charges/:id` (with `expand[]`): read-only here, made by paying. */
export function paymentObjectsRouter(store: ProviderStore): Router {
  const router = Router();
  router.get('/payment_intents/:id', (req, res) => {
    const { expand } = readParams(commonQuery, req.query);
    const intent = store.paymentIntents.get(req.params.id);
    if (!intent) throw ProviderError.noSuch('payment_intent', req.params.id);
    res.json(expandObject(store, intent, expand));
  });
  router.get('/charges/:id', (req, res) => {
    const { expand } = readParams(commonQuery, req.query);
    const charge = store.charges.get(req.params.id);
    if (!charge) throw ProviderError.noSuch('charge', req.params.id);
    res.json(expandObject(store, charge, expand));
  });
  return router;
}
