import { signal } from '@angular/core';
import { FormControl, FormGroup, FormRecord, ValidatorFn } from '@angular/forms';

import type { CalculatorSummary, InputGroup, InputSummary, OutputSummary } from '../../../shared/airflow';
import type { FormState } from './form-state';

export interface QuantityControls {
  text: FormControl<string>;
  unit: FormControl<string>;
}

export type CalculatorFormGroup = FormGroup<{
  quantities: FormRecord<FormGroup<QuantityControls>>;
  options: FormRecord<FormControl<string>>;
  picks: FormRecord<FormControl<string>>;
  outputUnits: FormRecord<FormControl<string>>;
}>;

/** One line of the form, in the order the calculator lists its inputs. */
export type FormItem =
  | { readonly kind: 'quantity'; readonly input: InputSummary; readonly controls: FormGroup<QuantityControls> }
  | { readonly kind: 'option'; readonly input: InputSummary; readonly control: FormControl<string> }
  | {
      readonly kind: 'group';
      readonly group: InputGroup;
      readonly control: FormControl<string>;
      readonly members: readonly { readonly input: InputSummary; readonly controls: FormGroup<QuantityControls> }[];
    };

export interface OutputItem {
  readonly output: OutputSummary;
  readonly unit: FormControl<string>;
}

let formsMade = 0;

/**
 * A calculator's summary as a typed reactive form: one text + unit pair per quantity (text, so
 * a half-typed "1.5e" stays on screen), one control per option, the picked member of each one-of
 * group, and each output's unit. The engine judges the values: {@link CalculatorForm.showErrors}
 * hands its messages to one validator per control, which reports them (a validator rather than
 * setErrors, so the message survives the re-validation a field does when it is shown again).
 */
export class CalculatorForm {
  /** Unique on the page (a lesson may show the same calculator twice): a prefix for element ids. */
  readonly uid: string;
  readonly group: CalculatorFormGroup;
  readonly items: readonly FormItem[];
  readonly outputs: readonly OutputItem[];

  /** Field → the engine's latest message for it; read by the validators. */
  private engineErrors: ReadonlyMap<string, string> = new Map();
  private readonly checkedControls = new Map<string, FormControl<string>>();

  private readonly pickState = signal<Readonly<Record<string, string>>>({});
  /** The picked member of each one-of group, as a signal for templates. */
  readonly picks = this.pickState.asReadonly();

  constructor(
    readonly summary: CalculatorSummary,
    state: FormState,
  ) {
    this.uid = `${summary.id}-${++formsMade}`;
    const quantities = new FormRecord<FormGroup<QuantityControls>>({});
    const options = new FormRecord<FormControl<string>>({});
    const picks = new FormRecord<FormControl<string>>({});
    const outputUnits = new FormRecord<FormControl<string>>({});
    for (const input of summary.inputs) {
      if (input.kind === 'option') {
        options.addControl(input.name, this.checked(input.name, state.options[input.name] ?? ''));
      } else {
        const entry = state.quantities[input.name] ?? { text: '', unit: '' };
        quantities.addControl(input.name, new FormGroup({ text: this.checked(input.name, entry.text), unit: text(entry.unit) }));
      }
    }
    for (const group of summary.groups) picks.addControl(group.id, text(state.picks[group.id] ?? ''));
    for (const output of summary.outputs) {
      const field = `outputUnits.${output.name}`;
      outputUnits.addControl(output.name, this.checked(field, state.outputUnits[output.name] ?? ''));
    }
    this.group = new FormGroup({ quantities, options, picks, outputUnits });
    this.items = this.layOut();
    this.outputs = summary.outputs.map((output) => ({ output, unit: outputUnits.controls[output.name] as FormControl<string> }));
    // The form and this subscription live and die together: no teardown needed.
    this.pickState.set(picks.getRawValue());
    picks.valueChanges.subscribe(() => this.pickState.set(picks.getRawValue()));
  }

  state(): FormState {
    return this.group.getRawValue();
  }

  /** Replaces every value at once (one change event, so one evaluation). */
  replace(state: FormState): void {
    this.group.setValue(state);
  }

  /** Marks the fields the engine refused, and clears the ones it no longer does. */
  showErrors(fieldErrors: ReadonlyMap<string, string>): void {
    const before = this.engineErrors;
    this.engineErrors = fieldErrors;
    for (const [field, control] of this.checkedControls) {
      // No change event: the value is the same, and evaluating again would change nothing.
      if (before.get(field) !== fieldErrors.get(field)) control.updateValueAndValidity({ emitEvent: false });
    }
  }

  /** A control whose validator reports the engine's message for its field, if any. */
  private checked(field: string, value: string): FormControl<string> {
    const control = text(value, () => {
      const message = this.engineErrors.get(field);
      return message === undefined ? null : { engine: message };
    });
    this.checkedControls.set(field, control);
    return control;
  }

  private layOut(): FormItem[] {
    const { quantities, options, picks } = this.group.controls;
    const items: FormItem[] = [];
    const placed = new Set<string>();
    for (const input of this.summary.inputs) {
      const group = this.summary.groups.find((g) => g.id === input.group);
      if (group !== undefined) {
        if (placed.has(group.id)) continue;
        placed.add(group.id);
        const members = group.inputs
          .map((name) => this.summary.inputs.find((i) => i.name === name))
          .filter((member): member is InputSummary => member !== undefined)
          .map((member) => ({ input: member, controls: quantities.controls[member.name] as FormGroup<QuantityControls> }));
        items.push({ kind: 'group', group, control: picks.controls[group.id] as FormControl<string>, members });
      } else if (input.kind === 'option') {
        items.push({ kind: 'option', input, control: options.controls[input.name] as FormControl<string> });
      } else {
        items.push({ kind: 'quantity', input, controls: quantities.controls[input.name] as FormGroup<QuantityControls> });
      }
    }
    return items;
  }
}

function text(value: string, validator?: ValidatorFn): FormControl<string> {
  return new FormControl(value, { nonNullable: true, validators: validator ?? null });
}
