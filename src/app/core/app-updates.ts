import { DOCUMENT } from '@angular/common';
import { EnvironmentProviders, Injectable, Injector, inject, provideAppInitializer } from '@angular/core';
import { SwUpdate } from '@angular/service-worker';
import { filter } from 'rxjs';

/**
 * New versions of the app. The service worker keeps serving the version a tab started with, so old
 * and new chunks never mix; when a new version has been downloaded in the background we offer to
 * reload into it, and a reload is the only way the switch happens.
 */
@Injectable({ providedIn: 'root' })
export class AppUpdates {
  private readonly updates = inject(SwUpdate);
  private readonly injector = inject(Injector);
  private readonly document = inject(DOCUMENT);

  watch(): void {
    if (!this.updates.isEnabled) return;
    this.updates.versionUpdates
      .pipe(filter((event) => event.type === 'VERSION_READY'))
      .subscribe(() => this.offerReload('A new version of Flowlore is ready.'));
    // The worker could not keep this tab's version (its files were evicted and are gone from the
    // server): nothing but a reload into the current version will work.
    this.updates.unrecoverable.subscribe(() => this.offerReload('Flowlore was updated and this page must reload to keep working.'));
  }

  /** A lazy page's chunk failed to load (no service worker, and a deploy removed it): reload. */
  chunkMissing(): void {
    this.offerReload('Part of Flowlore could not be loaded; a newer version may be out.');
  }

  /** The snackbar loads only when there is something to say, keeping it out of the first download. */
  private offerReload(message: string): void {
    void import('@angular/material/snack-bar').then(({ MatSnackBar }) => {
      this.injector
        .get(MatSnackBar)
        .open(message, 'Reload', { politeness: 'polite' })
        .onAction()
        .subscribe(() => this.document.location.reload());
    });
  }
}

/** Starts watching for new versions once the app is up. */
export function provideAppUpdates(): EnvironmentProviders {
  return provideAppInitializer(() => inject(AppUpdates).watch());
}

/** True for the error a dynamic import throws when its chunk is not on the server any more. */
export function isMissingChunk(error: unknown): boolean {
  const message = error instanceof Error ? error.message : String(error);
  return /dynamically imported module|Importing a module script failed|error loading dynamically imported module/i.test(message);
}
