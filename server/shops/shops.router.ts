import { Router } from 'express';
import type { DataSource } from 'typeorm';

import type { ShopView } from '../../shared/api/accounts';
import { requireShopOwner } from '../auth/authorize';
import { HttpProblem } from '../http/problem';

/** `/api/shops/*`: a shop owner's own shop and its apprentices. */
export function shopsRouter(dataSource: DataSource): Router {
  const router = Router();
  router.get('/mine', requireShopOwner, async (_req, res) => {
    res.set('Cache-Control', 'no-store').json(await shopView(dataSource, res.locals['shopId'] as string));
  });
  return router;
}

async function shopView(dataSource: DataSource, shopId: string): Promise<ShopView> {
  const shops: Array<{ id: string; name: string; owner_id: string; owner_name: string }> = await dataSource.query(
    `SELECT s.id, s.name, s.owner_id, u.display_name AS owner_name FROM shop s JOIN user_account u ON u.id = s.owner_id WHERE s.id = $1`,
    [shopId],
  );
  const shop = shops[0];
  if (!shop) throw HttpProblem.notFound('Your shop was not found.');
  const apprentices: Array<{ id: string; email: string; display_name: string; verified_at: Date | null }> = await dataSource.query(
    `SELECT id, email, display_name, verified_at FROM user_account
      WHERE shop_id = $1 AND role = 'apprentice' AND disabled_at IS NULL ORDER BY display_name, id`,
    [shopId],
  );
  return {
    id: shop.id,
    name: shop.name,
    owner: { id: shop.owner_id, displayName: shop.owner_name },
    apprentices: apprentices.map((a) => ({ id: a.id, email: a.email, displayName: a.display_name, verified: a.verified_at !== null })),
  };
}
