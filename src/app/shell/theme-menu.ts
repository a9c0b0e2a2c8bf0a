import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatMenu, MatMenuItem, MatMenuTrigger } from '@angular/material/menu';

import { ThemePreference } from '../core/theme-preference';
import { ThemeService } from '../core/theme.service';

interface ThemeOption {
  readonly value: ThemePreference;
  readonly label: string;
  readonly icon: string;
}

/** The top bar's "Theme" button: a menu of Light, Dark and System with the current one checked. */
@Component({
  selector: 'fl-theme-menu',
  imports: [MatButton, MatIcon, MatMenu, MatMenuItem, MatMenuTrigger],
  templateUrl: './theme-menu.html',
  styleUrl: './theme-menu.scss',
  host: { class: 'no-print' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ThemeMenu {
  protected readonly theme = inject(ThemeService);

  protected readonly options: readonly ThemeOption[] = [
    { value: 'light', label: 'Light', icon: 'theme-light' },
    { value: 'dark', label: 'Dark', icon: 'theme-dark' },
    { value: 'system', label: 'System', icon: 'theme-system' },
  ];
}
