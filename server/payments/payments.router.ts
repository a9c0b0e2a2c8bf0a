import express, { Router } from 'express';

import { createOrderSchema } from '../../shared/api/payments';
import { requireShopOwner, signedInUser } from '../auth/authorize';
import { validateBody } from '../http/validate';
import type { PaymentsService } from './payments.service';

/**
 * `POST /api/payments/webhook`: the provider's events. Mounted before the JSON parser, sessions and
 * CSRF: it needs the raw body for the signature, and the signature is its only credential.
 */
export function paymentsWebhookRouter(payments: PaymentsService): Router {
  const router = Router();
  router.post('/payments/webhook', express.raw({ type: 'application/json', limit: '1mb' }), async (req, res) => {
    const body = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    const outcome = await payments.receiveEvent(body, req.get('Stripe-Signature'));
    res.status(200).json({ received: true, outcome });
  });
  return router;
}

/** `/api/shop/orders`: a shop owner buys seats (hosted checkout) and follows the order. Never cached. */
export function shopOrdersRouter(payments: PaymentsService): Router {
  const router = Router();
  router.post('/shop/orders', requireShopOwner, validateBody(createOrderSchema), async (req, res) => {
    const start = await payments.createShopOrder(signedInUser(req), res.locals['shopId'] as string, res.locals['body'].quantity);
    res.status(201).set('Cache-Control', 'private, no-store').json(start);
  });
  router.get('/shop/orders', requireShopOwner, async (_req, res) => {
    res.set('Cache-Control', 'private, no-store').json(await payments.orders(res.locals['shopId'] as string));
  });
  router.get('/shop/orders/:id', requireShopOwner, async (req, res) => {
    res.set('Cache-Control', 'private, no-store').json(await payments.order(res.locals['shopId'] as string, String(req.params['id'])));
  });
  return router;
}
