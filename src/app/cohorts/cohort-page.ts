import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, ElementRef, Injector, inject, input, signal, viewChild } from '@angular/core';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';

import type { CohortMemberView } from '../../../shared/api/accounts';
import { askToConfirm } from '../core/confirm-dialog';
import { fieldError, submitForm } from '../core/form-errors';
import { CohortsApi } from './cohorts-api';
import { Gradebook } from './gradebook';

/** `/cohorts/:id`: one cohort's gradebook and apprentices; add one by e-mail, remove one. */
@Component({
  selector: 'fl-cohort-page',
  imports: [DatePipe, Gradebook, MatButton, MatError, MatFormField, MatHint, MatInput, MatLabel, MatTableModule, ReactiveFormsModule, RouterLink],
  templateUrl: './cohort-page.html',
  styleUrls: ['../admin/admin-tables.scss', './cohorts.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CohortPage {
  private readonly api = inject(CohortsApi);
  private readonly dialog = inject(MatDialog);
  private readonly injector = inject(Injector);
  private readonly formElement = viewChild<ElementRef<HTMLFormElement>>('formElement');
  private readonly formDirective = viewChild(FormGroupDirective);
  private readonly gradebook = viewChild(Gradebook);

  /** The cohort's id, from the address. */
  readonly id = input.required<string>();
  protected readonly cohort = this.api.detail(this.id);
  protected readonly columns = ['displayName', 'email', 'addedAt', 'remove'];
  protected readonly form = inject(NonNullableFormBuilder).group({ email: ['', [Validators.required, Validators.email]] });
  protected readonly adding = signal(false);
  protected readonly removing = signal<string | null>(null);
  protected readonly added = signal<string | null>(null);
  protected readonly errorOf = fieldError;
  protected readonly emailMessages = { required: 'Enter the apprentice’s e-mail address.', email: 'Enter an e-mail address like name@example.com.' };

  protected async add(): Promise<void> {
    this.added.set(null);
    await submitForm({
      form: this.form,
      element: this.formElement()?.nativeElement,
      injector: this.injector,
      busy: this.adding,
      send: async () => {
        const email = this.form.getRawValue().email;
        const updated = await this.api.addMember(this.id(), email);
        this.cohort.set(updated);
        this.gradebook()?.reload();
        // Through the directive, so the cleared field is not shown as a submitted, empty one.
        this.formDirective()?.resetForm();
        this.added.set(`${email} is in the cohort.`);
      },
    });
  }

  protected async remove(member: CohortMemberView): Promise<void> {
    const confirmed = await askToConfirm(this.dialog, {
      title: `Remove ${member.displayName}?`,
      message: `${member.displayName} (${member.email}) leaves this cohort. Their account and progress stay; you can add them again.`,
      confirm: 'Remove from cohort',
    });
    if (!confirmed) return;
    this.removing.set(member.id);
    try {
      await this.api.removeMember(this.id(), member.id);
    } catch {
      // The snackbar has said why.
    } finally {
      this.removing.set(null);
      this.cohort.reload();
      this.gradebook()?.reload();
    }
  }
}
