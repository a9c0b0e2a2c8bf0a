import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { startWith, switchMap } from 'rxjs';

import type { InputSummary } from '../../../shared/airflow';
import type { QuantityControls } from './calculator-form';
import { countReadings, readingsHint } from './typed-numbers';
import { unitLabel } from './unit-labels';

/**
 * A number field with its unit picker beside it. The field is text (inputmode decimal), so what
 * the reader types stays exactly as typed; the engine's message for it shows underneath. An input
 * that takes a list of readings is the same field: the readings typed with spaces between them,
 * one unit for all, a hint saying how many it takes and a count of those typed so far.
 */
@Component({
  selector: 'fl-quantity-field',
  imports: [MatError, MatFormField, MatHint, MatInput, MatLabel, MatOption, MatSelect, ReactiveFormsModule],
  template: `
    <mat-form-field class="value" subscriptSizing="dynamic">
      <mat-label>
        {{ input().label }}
        @if (optional()) {
          <span class="optional">(optional)</span>
        }
      </mat-label>
      <input
        matInput
        type="text"
        autocomplete="off"
        spellcheck="false"
        [attr.inputmode]="listHint() ? null : 'decimal'"
        [formControl]="controls().controls.text"
      />
      <mat-hint>{{ input().help }} {{ listHint() ?? '' }}</mat-hint>
      @if (listHint()) {
        <mat-hint align="end">{{ typedCount() === 1 ? '1 reading' : typedCount() + ' readings' }}</mat-hint>
      }
      <mat-error>{{ error() }}</mat-error>
    </mat-form-field>
    <mat-form-field class="unit" subscriptSizing="dynamic">
      <mat-label>Unit<span class="visually-hidden"> for {{ input().label }}</span></mat-label>
      <mat-select [formControl]="controls().controls.unit" [panelWidth]="null">
        @for (unit of input().units ?? []; track unit) {
          <mat-option [value]="unit">{{ unitLabel(unit) }}</mat-option>
        }
      </mat-select>
    </mat-form-field>
  `,
  styles: `
    :host {
      display: flex;
      gap: 0.75rem;
      align-items: flex-start;
    }

    .value {
      flex: 1 1 12rem;
      min-width: 0;
    }

    .unit {
      flex: 0 0 9.5rem;
    }

    .optional {
      margin-inline-start: 0.25em;
      font-style: italic;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QuantityField {
  readonly input = input.required<InputSummary>();
  readonly controls = input.required<FormGroup<QuantityControls>>();
  readonly optional = input(false);
  readonly error = input<string>();

  protected readonly unitLabel = unitLabel;

  /**
   * For a list input: how many readings it takes and how to type them. A list gets the full
   * keyboard on a phone (no inputmode decimal), since a decimal pad has no space key.
   */
  protected readonly listHint = computed(() => {
    const list = this.input().list;
    return list === undefined ? undefined : readingsHint(list);
  });

  private readonly typed = toSignal(
    toObservable(this.controls).pipe(switchMap((controls) => controls.controls.text.valueChanges.pipe(startWith(controls.controls.text.value)))),
    { initialValue: '' },
  );

  protected readonly typedCount = computed(() => countReadings(this.typed()));
}
