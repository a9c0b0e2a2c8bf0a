import { EnvironmentProviders, inject, provideAppInitializer } from '@angular/core';
import { MatIconRegistry } from '@angular/material/icon';
import { DomSanitizer } from '@angular/platform-browser';

// Our own line icons, drawn on a 24-unit grid in the text colour. No icon font is loaded.
const stroke =
  'fill="none" stroke="currentColor" stroke-width="2" stroke-linecap="round" stroke-linejoin="round"';

const icons: Readonly<Record<string, string>> = {
  menu: `<svg viewBox="0 0 24 24" ${stroke}><path d="M4 7h16M4 12h16M4 17h16"/></svg>`,
  close: `<svg viewBox="0 0 24 24" ${stroke}><path d="M6 6l12 12M18 6L6 18"/></svg>`,
  'theme-light':
    `<svg viewBox="0 0 24 24" ${stroke}><circle cx="12" cy="12" r="4"/>` +
    '<path d="M12 2.5v2M12 19.5v2M2.5 12h2M19.5 12h2M5.3 5.3l1.4 1.4M17.3 17.3l1.4 1.4' +
    'M5.3 18.7l1.4-1.4M17.3 6.7l1.4-1.4"/></svg>',
  'theme-dark': `<svg viewBox="0 0 24 24" ${stroke}><path d="M19.5 14.5A8 8 0 0 1 9.5 4.5a8 8 0 1 0 10 10z"/></svg>`,
  'theme-system':
    `<svg viewBox="0 0 24 24" ${stroke}><circle cx="12" cy="12" r="8"/>` +
    '<path d="M12 4a8 8 0 0 1 0 16z" fill="currentColor"/></svg>',
  // Signal arcs struck through: the browser reports no network.
  offline:
    `<svg viewBox="0 0 24 24" ${stroke}><path d="M2.5 9a14 14 0 0 1 19 0M5.8 12.5a9.5 9.5 0 0 1 12.4 0M9 16a5 5 0 0 1 6 0"/>` +
    '<path d="M12 19.5v.01M3.5 3.5l17 17"/></svg>',
  bell:
    `<svg viewBox="0 0 24 24" ${stroke}><path d="M6 16.5V11a6 6 0 0 1 12 0v5.5l1.5 2h-15z"/>` +
    '<path d="M10 21h4"/></svg>',
  caution:
    `<svg viewBox="0 0 24 24" ${stroke}><path d="M12 3.5L2.5 20h19z"/><path d="M12 10v4.5M12 17.5v.01"/></svg>`,
};

/** Registers the shell's icons for <mat-icon svgIcon="…">; the literals above are static and trusted. */
export function provideIcons(): EnvironmentProviders {
  return provideAppInitializer(() => {
    const registry = inject(MatIconRegistry);
    const sanitizer = inject(DomSanitizer);
    for (const [name, svg] of Object.entries(icons)) {
      registry.addSvgIconLiteral(name, sanitizer.bypassSecurityTrustHtml(svg));
    }
  });
}
