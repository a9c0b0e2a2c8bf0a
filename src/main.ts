import { bootstrapApplication } from '@angular/platform-browser';

import { appConfig } from './app/app.config';
import { applyThemePreference, readThemePreference } from './app/core/theme-preference';
import { AppShell } from './app/shell/app-shell';

// Set the remembered theme before the first render, so a dark-theme reader never sees a flash of
// paper. (No inline script in index.html: the Content-Security-Policy forbids it.)
applyThemePreference(readThemePreference(), document.documentElement);

bootstrapApplication(AppShell, appConfig).catch((err: unknown) => console.error(err));
