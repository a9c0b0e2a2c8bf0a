import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogTitle } from '@angular/material/dialog';
import { firstValueFrom } from 'rxjs';

export interface ConfirmRequest {
  readonly title: string;
  readonly message: string;
  /** The button that goes ahead, named for what it does ("Disable account"). */
  readonly confirm: string;
}

/** A yes/no question before a change that is hard to take back. Focus starts on "Cancel". */
@Component({
  selector: 'fl-confirm-dialog',
  imports: [MatButton, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogTitle],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <mat-dialog-content><p>{{ data.message }}</p></mat-dialog-content>
    <mat-dialog-actions align="end">
      <button matButton type="button" [mat-dialog-close]="false" cdkFocusInitial>Cancel</button>
      <button matButton="filled" type="button" [mat-dialog-close]="true">{{ data.confirm }}</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConfirmDialog {
  protected readonly data = inject<ConfirmRequest>(MAT_DIALOG_DATA);
}

/** Opens the dialog; true when the user went ahead. */
export async function askToConfirm(dialog: MatDialog, request: ConfirmRequest): Promise<boolean> {
  const ref = dialog.open<ConfirmDialog, ConfirmRequest, boolean>(ConfirmDialog, { data: request, maxWidth: '28rem', role: 'alertdialog' });
  return (await firstValueFrom(ref.afterClosed())) === true;
}
