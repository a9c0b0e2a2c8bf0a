import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { MatOption, MatSelect } from '@angular/material/select';

import type { InputSummary } from '../../../shared/airflow';

let nextId = 0;

/** A choice among the calculator's options: radio buttons for two or three, a select for more. */
@Component({
  selector: 'fl-option-field',
  imports: [MatError, MatFormField, MatHint, MatLabel, MatOption, MatRadioButton, MatRadioGroup, MatSelect, ReactiveFormsModule],
  template: `
    @if (asRadios()) {
      <div class="radios">
        <span class="radios-label" [id]="id + '-label'">{{ input().label }}</span>
        <mat-radio-group
          [formControl]="control()"
          [attr.aria-labelledby]="id + '-label'"
          [attr.aria-describedby]="id + '-help'"
          [attr.aria-invalid]="error() ? true : null"
        >
          @for (option of input().options ?? []; track option.value; let i = $index) {
            <div class="radio">
              <mat-radio-button
                [value]="option.value"
                [aria-describedby]="option.help ? id + '-option-' + i : ''"
              >{{ option.label }}</mat-radio-button>
              @if (option.help) {
                <span class="option-help" [id]="id + '-option-' + i">{{ option.help }}</span>
              }
            </div>
          }
        </mat-radio-group>
        <span class="help" [id]="id + '-help'">{{ input().help }}</span>
        @if (error(); as message) {
          <span class="error">{{ message }}</span>
        }
      </div>
    } @else {
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>{{ input().label }}</mat-label>
        <mat-select [formControl]="control()">
          @for (option of input().options ?? []; track option.value) {
            <mat-option [value]="option.value">{{ option.label }}</mat-option>
          }
        </mat-select>
        <mat-hint>{{ input().help }}</mat-hint>
        <mat-error>{{ error() }}</mat-error>
      </mat-form-field>
    }
  `,
  styleUrl: './option-field.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OptionField {
  readonly input = input.required<InputSummary>();
  readonly control = input.required<FormControl<string>>();
  readonly error = input<string>();

  protected readonly id = `fl-option-${nextId++}`;
  protected readonly asRadios = computed(() => (this.input().options?.length ?? 0) <= 3);
}
