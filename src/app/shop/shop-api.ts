import { httpResource, type HttpResourceRef } from '@angular/common/http';
import { Injectable } from '@angular/core';

import type { ShopView } from '../../../shared/api/accounts';

/** The shop owner's own shop (`GET /api/shops/mine`). */
@Injectable({ providedIn: 'root' })
export class ShopApi {
  mine(): HttpResourceRef<ShopView | undefined> {
    return httpResource(() => '/api/shops/mine', { parse: parseShop });
  }
}

function parseShop(raw: unknown): ShopView {
  const shop = raw as Partial<ShopView> | null;
  if (typeof shop?.id !== 'string' || typeof shop.name !== 'string' || !Array.isArray(shop.apprentices)) {
    throw new Error('The shop came back in an unexpected shape.');
  }
  return shop as ShopView;
}
