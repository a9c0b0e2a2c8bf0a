import { ChangeDetectionStrategy, Component, ElementRef, Injector, inject, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { RouterLink } from '@angular/router';

import type { SignUpRequest } from '../../../shared/api/accounts';
import { fieldError, focusAfterRender, submitForm } from '../core/form-errors';
import { AccountApi } from './account-api';

type AccountType = SignUpRequest['accountType'];

/** `/account/sign-up`: an apprentice, or a shop owner who names the shop. */
@Component({
  selector: 'fl-sign-up-page',
  imports: [MatButton, MatError, MatFormField, MatHint, MatInput, MatLabel, MatRadioButton, MatRadioGroup, ReactiveFormsModule, RouterLink],
  templateUrl: './sign-up-page.html',
  styleUrls: ['./account-form.scss', './sign-up-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignUpPage {
  private readonly api = inject(AccountApi);
  private readonly injector = inject(Injector);
  private readonly formElement = viewChild<ElementRef<HTMLFormElement>>('formElement');
  private readonly doneNotice = viewChild<ElementRef<HTMLElement>>('doneNotice');

  protected readonly form = inject(NonNullableFormBuilder).group({
    accountType: ['apprentice' as AccountType, Validators.required],
    displayName: ['', [Validators.required, Validators.maxLength(100)]],
    email: ['', [Validators.required, Validators.email]],
    password: ['', [Validators.required, Validators.minLength(8), Validators.maxLength(1000)]],
    shopName: [{ value: '', disabled: true }, [Validators.required, Validators.minLength(2), Validators.maxLength(120)]],
  });
  protected readonly accountType = toSignal(this.form.controls.accountType.valueChanges, { initialValue: this.form.controls.accountType.value });
  protected readonly submitting = signal(false);
  /** The server's answer after a sign-up: the same whether or not the address was new. */
  protected readonly done = signal<string | null>(null);

  protected readonly errorOf = fieldError;
  protected readonly messages = {
    displayName: { required: 'Enter your name as others should see it.', maxlength: 'Use at most 100 characters.' },
    email: { required: 'Enter your e-mail address.', email: 'Enter an e-mail address like name@example.com.' },
    password: { required: 'Choose a password.', minlength: 'Use at least 8 characters.', maxlength: 'Use at most 1000 characters.' },
    shopName: { required: 'Enter the name of your shop.', minlength: 'Use at least 2 characters.', maxlength: 'Use at most 120 characters.' },
  };

  constructor() {
    // The shop's name is asked for (and sent) only when a shop owner signs up.
    this.form.controls.accountType.valueChanges.pipe(takeUntilDestroyed()).subscribe((type) => {
      const shopName = this.form.controls.shopName;
      if (type === 'shop_owner') shopName.enable();
      else shopName.disable();
    });
  }

  protected async submit(): Promise<void> {
    await submitForm({
      form: this.form,
      element: this.formElement()?.nativeElement,
      injector: this.injector,
      busy: this.submitting,
      send: async () => {
        const value = this.form.getRawValue();
        const request: SignUpRequest =
          value.accountType === 'shop_owner'
            ? { accountType: 'shop_owner', displayName: value.displayName, email: value.email, password: value.password, shopName: value.shopName }
            : { accountType: 'apprentice', displayName: value.displayName, email: value.email, password: value.password };
        this.done.set(await this.api.signUp(request));
        focusAfterRender(() => this.doneNotice()?.nativeElement, this.injector);
      },
    });
  }
}
