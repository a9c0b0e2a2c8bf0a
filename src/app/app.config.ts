import { ViewportScroller } from '@angular/common';
import { provideHttpClient, withFetch, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import {
  ApplicationConfig,
  inject,
  isDevMode,
  provideAppInitializer,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
} from '@angular/core';
import {
  TitleStrategy,
  provideRouter,
  withComponentInputBinding,
  withInMemoryScrolling,
  withNavigationErrorHandler,
} from '@angular/router';
import { provideServiceWorker } from '@angular/service-worker';

import { routes } from './app.routes';
import { AppUpdates, isMissingChunk, provideAppUpdates } from './core/app-updates';
import { apiErrorsInterceptor } from './core/api-errors.interceptor';
import { AuthService } from './core/auth.service';
import { XSRF_COOKIE, XSRF_HEADER, csrfInterceptor } from './core/csrf-token';
import { provideIcons } from './core/icons';
import { PageTitleStrategy } from './core/page-title-strategy';
import { provideOfflineCourse } from './course/offline-course';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(
      routes,
      withComponentInputBinding(),
      withInMemoryScrolling({ scrollPositionRestoration: 'enabled', anchorScrolling: 'enabled' }),
      // Without a service worker a deploy can remove the chunk a lazy page needs: offer a reload.
      withNavigationErrorHandler((error) => {
        if (isMissingChunk(error.error)) inject(AppUpdates).chunkMissing();
      }),
    ),
    // Offline calculators and lessons, installable app (src/ngsw-config.json says what is kept).
    // Registered once the app is stable, so it never competes with the first page for the network.
    provideServiceWorker('ngsw-worker.js', { enabled: !isDevMode(), registrationStrategy: 'registerWhenStable:10000' }),
    provideAppUpdates(),
    provideOfflineCourse(),
    // Angular copies the XSRF-TOKEN cookie into the X-XSRF-TOKEN header of same-origin changes;
    // csrfInterceptor fetches the cookie first when there is none (see DEVELOPERS.md, CSRF).
    // apiErrorsInterceptor is outermost, so it sees a change's answer after any CSRF retry.
    provideHttpClient(
      withFetch(),
      withXsrfConfiguration({ cookieName: XSRF_COOKIE, headerName: XSRF_HEADER }),
      withInterceptors([apiErrorsInterceptor, csrfInterceptor]),
    ),
    // Who is signed in is asked at start-up without holding the first page back; the guards wait
    // for the answer, and the top bar shows the account control once it is in.
    provideAppInitializer(() => inject(AuthService).start()),
    { provide: TitleStrategy, useClass: PageTitleStrategy },
    provideIcons(),
    // A heading reached by its #fragment (lesson contents, glossary letters) lands a little below
    // the window's edge, not flush against it.
    provideAppInitializer(() => inject(ViewportScroller).setOffset([0, 24])),
  ],
};
