import { ChangeDetectionStrategy, Component, ElementRef, Injector, computed, inject, input, signal, viewChild } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { RouterLink } from '@angular/router';

import { fieldError, focusAfterRender, submitForm } from '../core/form-errors';
import { problemMessage } from '../core/problem';
import { AccountApi } from './account-api';

/** `/account/reset-password?token=…`: the link in the reset e-mail; a new password ends every session. */
@Component({
  selector: 'fl-reset-password-page',
  imports: [MatButton, MatError, MatFormField, MatHint, MatInput, MatLabel, ReactiveFormsModule, RouterLink],
  template: `
    <h1>Choose a new password</h1>
    @if (done()) {
      <div class="notice" role="status" tabindex="-1" #outcomeNotice>
        <p><strong>Your password is changed.</strong> Any other place where you were signed in has been signed out.</p>
        <p><a routerLink="/account/sign-in">Sign in with the new password</a></p>
      </div>
    } @else if (!hasToken()) {
      <div class="notice error" role="alert">
        <p>This page needs the link from your password-reset e-mail, complete. Open the link from the message again, or ask for a new one.</p>
        <p><a routerLink="/account/forgot-password">Ask for a new link</a></p>
      </div>
    } @else {
      @if (refusal(); as message) {
        <div class="notice error" role="alert" tabindex="-1" #outcomeNotice>
          <p>{{ message }}</p>
          <p><a routerLink="/account/forgot-password">Ask for a new link</a></p>
        </div>
      }
      <form #formElement [formGroup]="form" (ngSubmit)="submit()" novalidate>
        <mat-form-field>
          <mat-label>New password</mat-label>
          <input matInput type="password" formControlName="password" autocomplete="new-password" required />
          <mat-hint>At least 8 characters. A long passphrase is best.</mat-hint>
          @if (errorOf(form.controls.password, passwordMessages); as message) {
            <mat-error>{{ message }}</mat-error>
          }
        </mat-form-field>
        <div class="actions">
          <button matButton="filled" type="submit" [disabled]="submitting()">Save the new password</button>
        </div>
      </form>
    }
  `,
  styleUrl: './account-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPasswordPage {
  private readonly api = inject(AccountApi);
  private readonly injector = inject(Injector);
  private readonly formElement = viewChild<ElementRef<HTMLFormElement>>('formElement');
  private readonly outcomeNotice = viewChild<ElementRef<HTMLElement>>('outcomeNotice');

  readonly token = input<string>();
  protected readonly hasToken = computed(() => (this.token() ?? '').length >= 16);
  protected readonly form = inject(NonNullableFormBuilder).group({
    password: ['', [Validators.required, Validators.minLength(8), Validators.maxLength(1000)]],
  });
  protected readonly submitting = signal(false);
  protected readonly done = signal(false);
  protected readonly refusal = signal<string | null>(null);
  protected readonly errorOf = fieldError;
  protected readonly passwordMessages = { required: 'Choose a new password.', minlength: 'Use at least 8 characters.', maxlength: 'Use at most 1000 characters.' };

  protected async submit(): Promise<void> {
    this.refusal.set(null);
    await submitForm({
      form: this.form,
      element: this.formElement()?.nativeElement,
      injector: this.injector,
      busy: this.submitting,
      send: async () => {
        await this.api.resetPassword(this.token() ?? '', this.form.getRawValue().password);
        this.done.set(true);
        focusAfterRender(() => this.outcomeNotice()?.nativeElement, this.injector);
      },
      // The link is used up or expired (or the token field was refused): say so beside the form.
      onUnmatched: (error, unmatched) => {
        this.refusal.set(unmatched[0] ?? problemMessage(error));
        focusAfterRender(() => this.outcomeNotice()?.nativeElement, this.injector);
      },
    });
  }
}
