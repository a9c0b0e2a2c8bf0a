import { ChangeDetectionStrategy, Component, ElementRef, Injector, computed, inject, input, signal, viewChild } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';

import type { DemoAccount } from '../../../shared/api/accounts';
import { AuthService } from '../core/auth.service';
import { fieldError, focusAfterRender, submitForm } from '../core/form-errors';
import { problemMessage } from '../core/problem';
import { AccountApi } from './account-api';
import { ROLE_LABELS } from './role-labels';

/** `/account/sign-in?returnUrl=…`: e-mail and password; in demo mode, the demo sign-ins to fill in. */
@Component({
  selector: 'fl-sign-in-page',
  imports: [MatButton, MatError, MatFormField, MatInput, MatLabel, ReactiveFormsModule, RouterLink],
  templateUrl: './sign-in-page.html',
  styleUrls: ['./account-form.scss', './sign-in-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignInPage {
  protected readonly auth = inject(AuthService);
  private readonly router = inject(Router);
  private readonly injector = inject(Injector);
  private readonly formElement = viewChild.required<ElementRef<HTMLFormElement>>('formElement');
  private readonly refusalElement = viewChild<ElementRef<HTMLElement>>('refusalNotice');

  /** Where to go afterwards (from the query string); only paths inside the app are followed. */
  readonly returnUrl = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', Validators.required],
  });
  protected readonly submitting = signal(false);
  protected readonly refusal = signal<string | null>(null);
  protected readonly demo = inject(AccountApi).demoAccounts();
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly cameToContinue = computed(() => !!this.safeReturnUrl());

  protected readonly errorOf = fieldError;
  protected readonly emailMessages = { required: 'Enter your e-mail address.', email: 'Enter an e-mail address like name@example.com.' };
  protected readonly passwordMessages = { required: 'Enter your password.' };

  private safeReturnUrl(): string | null {
    const url = this.returnUrl();
    return url && url.startsWith('/') && !url.startsWith('//') && !url.startsWith('/account/sign-in') ? url : null;
  }

  protected fillIn(account: DemoAccount): void {
    this.form.setValue({ email: account.email, password: account.password });
    this.refusal.set(null);
    focusAfterRender(() => this.formElement().nativeElement.querySelector<HTMLElement>('button[type="submit"]') ?? undefined, this.injector);
  }

  protected async submit(): Promise<void> {
    this.refusal.set(null);
    await submitForm({
      form: this.form,
      element: this.formElement().nativeElement,
      injector: this.injector,
      busy: this.submitting,
      send: async () => {
        await this.auth.signIn(this.form.getRawValue());
        await this.router.navigateByUrl(this.safeReturnUrl() ?? '/');
      },
      onUnmatched: (error, unmatched) => {
        this.refusal.set(unmatched[0] ?? problemMessage(error));
        focusAfterRender(() => this.refusalElement()?.nativeElement, this.injector);
      },
    });
  }
}
