import { ChangeDetectionStrategy, Component, ElementRef, Injector, inject, signal, viewChild } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogRef, MatDialogTitle } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';

import type { GradedResponse } from '../../../shared/api/grading';
import { fieldError, submitForm } from '../core/form-errors';
import { GradingApi } from './grading-api';

export interface OverrideRequest {
  readonly responseId: string;
  readonly questionId: string;
  readonly points: number | null;
  readonly maxPoints: number;
  readonly current: { points: number; reason: string } | null;
}

/** New points for an auto-graded answer and the reason, which the apprentice reads with their result. */
@Component({
  selector: 'fl-override-dialog',
  imports: [MatButton, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogTitle, MatError, MatFormField, MatHint, MatInput, MatLabel, ReactiveFormsModule],
  template: `
    <h2 mat-dialog-title>Change the points of “{{ data.questionId }}”</h2>
    <form #formElement [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content>
        <p>The automatic grade gave {{ data.points ?? 0 }} of {{ data.maxPoints }} points. The apprentice sees the new points and your reason with their result; the change is kept in the audit log.</p>
        <mat-form-field class="full">
          <mat-label>Points (0 to {{ data.maxPoints }})</mat-label>
          <input matInput type="number" inputmode="decimal" formControlName="points" min="0" [max]="data.maxPoints" step="0.5" required cdkFocusInitial />
          @if (errorOf(form.controls.points, pointsMessages); as message) {
            <mat-error>{{ message }}</mat-error>
          }
        </mat-form-field>
        <mat-form-field class="full">
          <mat-label>Reason</mat-label>
          <textarea matInput formControlName="reason" rows="3" maxlength="2000" required></textarea>
          <mat-hint>Written for the apprentice: why the points change.</mat-hint>
          @if (errorOf(form.controls.reason, reasonMessages); as message) {
            <mat-error>{{ message }}</mat-error>
          }
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button matButton type="button" [mat-dialog-close]="undefined">Cancel</button>
        <button matButton="filled" type="submit" [disabled]="saving()">Change the points</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .full {
      display: block;
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OverrideDialog {
  protected readonly data = inject<OverrideRequest>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<OverrideDialog, GradedResponse>>(MatDialogRef);
  private readonly api = inject(GradingApi);
  private readonly injector = inject(Injector);
  private readonly formElement = viewChild<ElementRef<HTMLFormElement>>('formElement');

  protected readonly form = inject(NonNullableFormBuilder).group({
    points: [this.data.current?.points ?? this.data.points ?? 0, [Validators.required, Validators.min(0), Validators.max(this.data.maxPoints)]],
    reason: [this.data.current?.reason ?? '', [Validators.required, Validators.minLength(3), Validators.maxLength(2000)]],
  });
  protected readonly saving = signal(false);
  protected readonly errorOf = fieldError;
  protected readonly pointsMessages = { required: 'Enter the points.', min: 'No fewer than 0 points.', max: `No more than ${this.data.maxPoints} points.` };
  protected readonly reasonMessages = { required: 'Say why the points change.', minlength: 'Say why in a few words.', maxlength: 'Keep it under 2000 characters.' };

  protected async save(): Promise<void> {
    await submitForm({
      form: this.form,
      element: this.formElement()?.nativeElement,
      injector: this.injector,
      busy: this.saving,
      send: async () => {
        const { points, reason } = this.form.getRawValue();
        this.ref.close(await this.api.override(this.data.responseId, { points: Number(points), reason }));
      },
    });
  }
}
