import { DOCUMENT } from '@angular/common';
import { EnvironmentProviders, inject, provideAppInitializer } from '@angular/core';
import { SwUpdate } from '@angular/service-worker';

import { LessonsService } from './lessons.service';

/**
 * After a first online visit the free lesson must open offline, even if the visitor never opened
 * it. Once the service worker controls the page (its data group caches /api/lessons…), and the
 * browser is idle, read the outline and the free lessons through it so they land in its cache.
 * Other lessons are cached as they are read.
 */
export function provideOfflineCourse(): EnvironmentProviders {
  return provideAppInitializer(() => {
    const updates = inject(SwUpdate);
    const lessons = inject(LessonsService);
    const win = inject(DOCUMENT).defaultView;
    const workers = win?.navigator.serviceWorker;
    if (!updates.isEnabled || !win || !workers) return;
    void controlled(workers).then(() => {
      const warm = () => void lessons.cacheFreeLessons().catch(() => undefined); // offline now: next visit
      if ('requestIdleCallback' in win) win.requestIdleCallback(warm, { timeout: 10_000 });
      else setTimeout(warm, 2000);
    });
  });
}

/** Resolves once a service worker controls this page (on a first visit, when ours has activated). */
function controlled(workers: ServiceWorkerContainer): Promise<void> {
  if (workers.controller) return Promise.resolve();
  return new Promise((resolve) => workers.addEventListener('controllerchange', () => resolve(), { once: true }));
}
