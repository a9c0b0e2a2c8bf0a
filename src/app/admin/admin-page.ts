import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatTabLink, MatTabNav, MatTabNavPanel } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';

/** The admin area's frame: a tab per part, each its own address. */
@Component({
  selector: 'fl-admin-page',
  imports: [MatTabLink, MatTabNav, MatTabNavPanel, RouterLink, RouterLinkActive, RouterOutlet],
  template: `
    <h1>Administration</h1>
    <nav mat-tab-nav-bar [tabPanel]="panel" aria-label="Administration">
      @for (tab of tabs; track tab.path) {
        <a mat-tab-link [routerLink]="tab.path" routerLinkActive #active="routerLinkActive" [active]="active.isActive">
          {{ tab.label }}
        </a>
      }
    </nav>
    <mat-tab-nav-panel #panel class="panel">
      <router-outlet />
    </mat-tab-nav-panel>
  `,
  styles: `
    .panel {
      display: block;
      padding-top: 1.5rem;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AdminPage {
  protected readonly tabs = [
    { path: 'users', label: 'Users' },
    { path: 'outbox', label: 'Sent e-mail' },
    { path: 'audit', label: 'Audit log' },
  ] as const;
}
