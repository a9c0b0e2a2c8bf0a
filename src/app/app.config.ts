import { ViewportScroller } from '@angular/common';
import { provideHttpClient, withFetch, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import {
  ApplicationConfig,
  inject,
  provideAppInitializer,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
} from '@angular/core';
import {
  TitleStrategy,
  provideRouter,
  withComponentInputBinding,
  withInMemoryScrolling,
} from '@angular/router';

import { routes } from './app.routes';
import { apiErrorsInterceptor } from './core/api-errors.interceptor';
import { AuthService } from './core/auth.service';
import { XSRF_COOKIE, XSRF_HEADER, csrfInterceptor } from './core/csrf-token';
import { provideIcons } from './core/icons';
import { PageTitleStrategy } from './core/page-title-strategy';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(
      routes,
      withComponentInputBinding(),
      withInMemoryScrolling({ scrollPositionRestoration: 'enabled', anchorScrolling: 'enabled' }),
    ),
    // Angular copies the XSRF-TOKEN cookie into the X-XSRF-TOKEN header of same-origin changes;
    // csrfInterceptor fetches the cookie first when there is none (see DEVELOPERS.md, CSRF).
    // apiErrorsInterceptor is outermost, so it sees a change's answer after any CSRF retry.
    provideHttpClient(
      withFetch(),
      withXsrfConfiguration({ cookieName: XSRF_COOKIE, headerName: XSRF_HEADER }),
      withInterceptors([apiErrorsInterceptor, csrfInterceptor]),
    ),
    // Who is signed in is known before the first page renders, so guards and the top bar agree.
    provideAppInitializer(() => inject(AuthService).load()),
    { provide: TitleStrategy, useClass: PageTitleStrategy },
    provideIcons(),
    // A heading reached by its #fragment (lesson contents, glossary letters) lands a little below
    // the window's edge, not flush against it.
    provideAppInitializer(() => inject(ViewportScroller).setOffset([0, 24])),
  ],
};
