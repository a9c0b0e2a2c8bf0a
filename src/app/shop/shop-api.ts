import { httpResource, type HttpResourceRef } from '@angular/common/http';
import { Injectable } from '@angular/core';

import type { ShopView } from '../../../shared/api/accounts';
import type { ShopProgress } from '../../../shared/api/gradebook';

/** The shop owner's own shop (`GET /api/shops/mine`) and its apprentices' progress (`GET /api/shop/progress`). */
@Injectable({ providedIn: 'root' })
export class ShopApi {
  mine(): HttpResourceRef<ShopView | undefined> {
    return httpResource(() => '/api/shops/mine', { parse: parseShop });
  }

  /** Lessons finished, quizzes passed and last activity per apprentice: no answers, scores or comments. */
  progress(): HttpResourceRef<ShopProgress | undefined> {
    return httpResource(() => '/api/shop/progress', { parse: parseProgress });
  }
}

function parseShop(raw: unknown): ShopView {
  const shop = raw as Partial<ShopView> | null;
  if (typeof shop?.id !== 'string' || typeof shop.name !== 'string' || !Array.isArray(shop.apprentices)) {
    throw new Error('The shop came back in an unexpected shape.');
  }
  return shop as ShopView;
}

function parseProgress(raw: unknown): ShopProgress {
  const progress = raw as Partial<ShopProgress> | null;
  if (!Array.isArray(progress?.apprentices) || typeof progress.lessonCount !== 'number' || typeof progress.quizCount !== 'number') {
    throw new Error('The progress came back in an unexpected shape.');
  }
  return progress as ShopProgress;
}
