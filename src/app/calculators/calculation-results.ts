import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormField } from '@angular/material/form-field';
import { MatOption, MatSelect } from '@angular/material/select';

import { CalculatorForm } from './calculator-form';
import type { Evaluation } from './form-state';
import { formatFigure, unitLabel, unitSuffix } from './unit-labels';

/**
 * The results: what they show in words (the calculator's notes, e.g. whether a gain is shown),
 * each output with its value and its own unit picker, then any notes on the formula's range.
 * When the engine refuses the inputs, a short "fix the marked fields" takes their place, so no
 * stale figure is ever on screen. The region is polite-live: it changes only after the form has
 * been still for a moment, so screen readers hear settled results.
 */
@Component({
  selector: 'fl-calculation-results',
  imports: [MatFormField, MatOption, MatSelect, ReactiveFormsModule],
  templateUrl: './calculation-results.html',
  styleUrl: './calculation-results.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalculationResults {
  readonly form = input.required<CalculatorForm>();
  readonly evaluation = input.required<Evaluation>();

  protected readonly formatFigure = formatFigure;
  protected readonly unitLabel = unitLabel;
  protected readonly unitSuffix = unitSuffix;

  /** Outputs the engine returned (a calculator may leave some out, e.g. for another result). */
  protected readonly shown = computed(() => {
    const result = this.evaluation().result;
    if (result === undefined) return [];
    return this.form()
      .outputs.filter((item) => result.outputs[item.output.name] !== undefined)
      .map((item) => ({ ...item, value: result.outputs[item.output.name]! }));
  });

  /** The calculator's own conclusions and caveats, plain text, in its order. */
  protected readonly conclusions = computed(() => this.evaluation().result?.notes ?? []);

  protected readonly notes = computed(() =>
    (this.evaluation().result?.warnings ?? []).map((warning) => ({
      about: this.form().summary.inputs.find((i) => i.name === warning.field)?.label,
      message: warning.message,
    })),
  );
}
