import { Router } from 'express';

import { acceptInvitationSchema, assignSeatSchema, inviteSchema } from '../../shared/api/seats';
import { requireShopOwner, requireSignedIn, signedInUser } from '../auth/authorize';
import { validateBody } from '../http/validate';
import type { SeatsService } from './seats.service';

/**
 * `/api/shop/seats`, `/api/shop/invitations` (the shop owner's seats: balance, invitations, assign,
 * release) and `/api/invitations/accept` (the invited apprentice). Never cached.
 */
export function seatsRouter(seats: SeatsService): Router {
  const router = Router();
  const shopOf = (locals: Record<string, unknown>) => locals['shopId'] as string;
  router.get('/shop/seats', requireShopOwner, async (_req, res) => {
    res.set('Cache-Control', 'private, no-store').json(await seats.seats(shopOf(res.locals)));
  });
  router.post('/shop/invitations', requireShopOwner, validateBody(inviteSchema), async (req, res) => {
    const result = await seats.invite(signedInUser(req), shopOf(res.locals), res.locals['body'].emails);
    res.status(result.invited.length > 0 ? 201 : 200).set('Cache-Control', 'private, no-store').json(result);
  });
  router.post('/shop/invitations/:id/resend', requireShopOwner, async (req, res) => {
    await seats.resend(signedInUser(req), shopOf(res.locals), String(req.params['id']));
    res.status(204).end();
  });
  router.delete('/shop/invitations/:id', requireShopOwner, async (req, res) => {
    await seats.revoke(signedInUser(req), shopOf(res.locals), String(req.params['id']));
    res.status(204).end();
  });
  router.post('/shop/seats/assign', requireShopOwner, validateBody(assignSeatSchema), async (req, res) => {
    const seatId = await seats.assign(signedInUser(req), shopOf(res.locals), res.locals['body'].userId);
    res.status(201).set('Cache-Control', 'private, no-store').json({ seatId });
  });
  router.post('/shop/seats/:id/release', requireShopOwner, async (req, res) => {
    await seats.release(signedInUser(req), shopOf(res.locals), String(req.params['id']));
    res.status(204).end();
  });
  router.post('/invitations/accept', requireSignedIn, validateBody(acceptInvitationSchema), async (req, res) => {
    res.set('Cache-Control', 'private, no-store').json(await seats.accept(signedInUser(req), res.locals['body'].token));
  });
  return router;
}
