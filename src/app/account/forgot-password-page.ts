import { ChangeDetectionStrategy, Component, ElementRef, Injector, inject, signal, viewChild } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { RouterLink } from '@angular/router';

import { fieldError, focusAfterRender, submitForm } from '../core/form-errors';
import { AccountApi } from './account-api';

/** `/account/forgot-password`: asks for a reset link; the answer never says whether the address has an account. */
@Component({
  selector: 'fl-forgot-password-page',
  imports: [MatButton, MatError, MatFormField, MatInput, MatLabel, ReactiveFormsModule, RouterLink],
  template: `
    <h1>Forgotten password</h1>
    @if (sent()) {
      <div class="notice" role="status" tabindex="-1" #sentNotice>
        <p><strong>Check your e-mail.</strong> If an account exists for that address, we sent a link to choose a new password.</p>
        <p>The link works once, for one hour.</p>
      </div>
      <p><a routerLink="/account/sign-in">Back to sign-in</a></p>
    } @else {
      <p class="lead">Enter the address you signed up with, and we will send a link to choose a new password.</p>
      <form #formElement [formGroup]="form" (ngSubmit)="submit()" novalidate>
        <mat-form-field>
          <mat-label>E-mail address</mat-label>
          <input matInput type="email" formControlName="email" autocomplete="email" required />
          @if (errorOf(form.controls.email, emailMessages); as message) {
            <mat-error>{{ message }}</mat-error>
          }
        </mat-form-field>
        <div class="actions">
          <button matButton="filled" type="submit" [disabled]="submitting()">Send the link</button>
          <a routerLink="/account/sign-in">Back to sign-in</a>
        </div>
      </form>
    }
  `,
  styleUrl: './account-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ForgotPasswordPage {
  private readonly api = inject(AccountApi);
  private readonly injector = inject(Injector);
  private readonly formElement = viewChild<ElementRef<HTMLFormElement>>('formElement');
  private readonly sentNotice = viewChild<ElementRef<HTMLElement>>('sentNotice');

  protected readonly form = inject(NonNullableFormBuilder).group({ email: ['', [Validators.required, Validators.email]] });
  protected readonly submitting = signal(false);
  protected readonly sent = signal(false);
  protected readonly errorOf = fieldError;
  protected readonly emailMessages = { required: 'Enter your e-mail address.', email: 'Enter an e-mail address like name@example.com.' };

  protected async submit(): Promise<void> {
    await submitForm({
      form: this.form,
      element: this.formElement()?.nativeElement,
      injector: this.injector,
      busy: this.submitting,
      send: async () => {
        await this.api.forgotPassword(this.form.getRawValue().email);
        this.sent.set(true);
        focusAfterRender(() => this.sentNotice()?.nativeElement, this.injector);
      },
    });
  }
}
