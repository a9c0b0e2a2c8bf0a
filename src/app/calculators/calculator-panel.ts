import { ChangeDetectionStrategy, Component, computed, effect, input, linkedSignal, output, untracked } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { ErrorStateMatcher } from '@angular/material/core';
import { debounceTime, map, switchMap } from 'rxjs';

import { CalculationResults } from './calculation-results';
import { CalculatorFields } from './calculator-fields';
import { CalculatorForm } from './calculator-form';
import { type FormState, calculate, isGiven } from './form-state';
import { unitSuffix } from './unit-labels';
import { WorkedSteps } from './worked-steps';

/** Long enough to skip the keystrokes of one number, short enough to feel live. */
const settleMs = 150;

/** A field shows its message as soon as the engine refuses it, touched or not (e.g. from a link). */
const engineErrorState: ErrorStateMatcher = { isErrorState: (control) => !!control?.invalid };

let panelsMade = 0;

/**
 * A working calculator: the form, live results and the worked steps, for a form its host opened.
 * The calculator page shows it full width with headings; a lesson shows it compact, inside the
 * text, with the steps folded away. It knows nothing of the address bar: each time the form
 * settles it says so (`settled`), and the host does what it wants with the state.
 */
@Component({
  selector: 'fl-calculator-panel',
  imports: [CalculationResults, CalculatorFields, WorkedSteps],
  providers: [{ provide: ErrorStateMatcher, useValue: engineErrorState }],
  templateUrl: './calculator-panel.html',
  styleUrl: './calculator-panel.scss',
  host: { '[class.embedded]': 'embedded()' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalculatorPanel {
  readonly form = input.required<CalculatorForm>();
  /** Compact, for a lesson: no section headings, worked steps folded. */
  readonly embedded = input(false);

  /** The form's state once typing pauses (and once at the start). */
  readonly settled = output<FormState>();

  /** Element ids: unique however many panels a page holds. */
  protected readonly uid = `calculator-panel-${++panelsMade}`;

  /** The state being evaluated: the form as opened, then each settled state. */
  private readonly current = linkedSignal(() => {
    const form = this.form();
    return { form, state: untracked(() => form.state()) };
  });

  protected readonly evaluation = computed(() => {
    const { form, state } = this.current();
    return calculate(form.summary, state);
  });

  /** The inputs as given, for the printed page. */
  protected readonly printedInputs = computed(() => {
    const { form, state } = this.current();
    return form.summary.inputs
      .filter((input) => isGiven(input, state.picks))
      .flatMap((input) => {
        if (input.kind === 'option') {
          const chosen = input.options?.find((option) => option.value === state.options[input.name]);
          return chosen ? [{ label: input.label, value: chosen.label, unit: '' }] : [];
        }
        const entry = state.quantities[input.name];
        const text = entry?.text.trim() ?? '';
        return entry && text ? [{ label: input.label, value: text, unit: unitSuffix(entry.unit) }] : [];
      });
  });

  constructor() {
    toObservable(this.form)
      .pipe(
        switchMap((form) =>
          form.group.valueChanges.pipe(
            debounceTime(settleMs),
            map(() => ({ form, state: form.state() })),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((current) => this.current.set(current));

    // The engine's messages go onto the fields they name; the typed text is never touched.
    effect(() => {
      const { form } = this.current();
      const evaluation = this.evaluation();
      untracked(() => form.showErrors(evaluation.fieldErrors));
    });

    effect(() => {
      const { state } = this.current();
      untracked(() => this.settled.emit(state));
    });
  }
}
