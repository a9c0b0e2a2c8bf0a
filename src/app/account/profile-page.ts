import { ChangeDetectionStrategy, Component, ElementRef, Injector, inject, signal, viewChild } from '@angular/core';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { Router } from '@angular/router';

import { AuthService } from '../core/auth.service';
import { fieldError, submitForm } from '../core/form-errors';
import { AccountApi } from './account-api';
import { ROLE_LABELS } from './role-labels';

/** `/account/profile`: the signed-in user's name, a password change (ends other sessions), sign-out. */
@Component({
  selector: 'fl-profile-page',
  imports: [MatButton, MatError, MatFormField, MatHint, MatInput, MatLabel, ReactiveFormsModule],
  templateUrl: './profile-page.html',
  styleUrls: ['./account-form.scss', './profile-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProfilePage {
  private readonly api = inject(AccountApi);
  private readonly router = inject(Router);
  private readonly injector = inject(Injector);
  private readonly nameForm = viewChild.required<ElementRef<HTMLFormElement>>('nameFormElement');
  private readonly passwordForm = viewChild.required<ElementRef<HTMLFormElement>>('passwordFormElement');
  private readonly passwordFormDirective = viewChild.required('passwordFormElement', { read: FormGroupDirective });
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly auth = inject(AuthService);
  protected readonly roleLabels = ROLE_LABELS;

  protected readonly profile = this.fb.group({
    displayName: [this.auth.user()?.displayName ?? '', [Validators.required, Validators.maxLength(100)]],
  });
  protected readonly password = this.fb.group({
    currentPassword: ['', Validators.required],
    newPassword: ['', [Validators.required, Validators.minLength(8), Validators.maxLength(1000)]],
  });
  protected readonly savingName = signal(false);
  protected readonly nameSaved = signal(false);
  protected readonly savingPassword = signal(false);
  protected readonly passwordChanged = signal(false);

  protected readonly errorOf = fieldError;
  protected readonly messages = {
    displayName: { required: 'Enter your name as others should see it.', maxlength: 'Use at most 100 characters.' },
    currentPassword: { required: 'Enter your current password.' },
    newPassword: { required: 'Choose a new password.', minlength: 'Use at least 8 characters.', maxlength: 'Use at most 1000 characters.' },
  };

  protected async saveName(): Promise<void> {
    this.nameSaved.set(false);
    await submitForm({
      form: this.profile,
      element: this.nameForm().nativeElement,
      injector: this.injector,
      busy: this.savingName,
      send: async () => {
        this.auth.setUser(await this.api.updateProfile(this.profile.getRawValue().displayName));
        this.profile.markAsPristine();
        this.nameSaved.set(true);
      },
    });
  }

  protected async changePassword(): Promise<void> {
    this.passwordChanged.set(false);
    await submitForm({
      form: this.password,
      element: this.passwordForm().nativeElement,
      injector: this.injector,
      busy: this.savingPassword,
      send: async () => {
        const { currentPassword, newPassword } = this.password.getRawValue();
        await this.api.changePassword(currentPassword, newPassword);
        // Through the directive, so the emptied fields are not shown as a submitted, empty form.
        this.passwordFormDirective().resetForm();
        this.passwordChanged.set(true);
      },
    });
  }

  protected async signOut(): Promise<void> {
    await this.auth.signOut();
    await this.router.navigateByUrl('/');
  }
}
