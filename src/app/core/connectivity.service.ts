import { DOCUMENT } from '@angular/common';
import { DestroyRef, Injectable, inject, signal } from '@angular/core';

/**
 * Whether the browser reports a network connection (`navigator.onLine`, kept current by the
 * window's online/offline events). "Online" only means a network is there, not that our server
 * answers; "offline" is certain, which is what the pages that need the server rely on.
 */
@Injectable({ providedIn: 'root' })
export class ConnectivityService {
  private readonly window = inject(DOCUMENT).defaultView;
  private readonly state = signal(this.window?.navigator.onLine ?? true);

  readonly online = this.state.asReadonly();

  constructor() {
    const win = this.window;
    if (!win) return;
    const update = () => this.state.set(win.navigator.onLine);
    win.addEventListener('online', update);
    win.addEventListener('offline', update);
    inject(DestroyRef).onDestroy(() => {
      win.removeEventListener('online', update);
      win.removeEventListener('offline', update);
    });
  }
}
