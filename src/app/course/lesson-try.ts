import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { RouterLink } from '@angular/router';

import { describeCalculator, withExampleDefaults } from '../../../shared/airflow';
import type { LessonResultCheck } from '../../../shared/api/lessons';
import { presetState } from '../calculators/form-state';
import { encodeShareLink } from '../calculators/share-link';
import { unitSuffix } from '../calculators/unit-labels';
import { isUsCustomary } from '../calculators/unit-system';

/**
 * A worked example's result line (mounted by LessonContent at its placeholder): the stated result
 * and a link that opens the calculator on the example's numbers, showing that result's unit.
 */
@Component({
  selector: 'fl-lesson-try',
  imports: [RouterLink],
  template: `
    <p class="result">
      <span class="stated">
        {{ shown().label }} =
        <span class="figures">{{ shown().value }}&nbsp;{{ shown().unit }}</span>
      </span>
      @if (shown().link; as link) {
        <a class="no-print" [routerLink]="['/calculators', check().calculator]" [queryParams]="link">
          Check these numbers in the calculator
        </a>
      }
    </p>
  `,
  styles: `
    :host {
      display: block;
    }

    .result {
      display: flex;
      flex-wrap: wrap;
      gap: 0.25rem 1.25rem;
      align-items: baseline;
      margin: 0.5rem 0 0;
      font-family: var(--mat-sys-body-large-font);
      font-size: 1rem;
      line-height: 1.5;
    }

    .stated {
      font-weight: 600;
    }

    a {
      font-size: 0.9375rem;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LessonTry {
  readonly check = input.required<LessonResultCheck>();

  protected readonly shown = computed(() => {
    const check = this.check();
    const summary = describeCalculator(check.calculator);
    const label = summary?.outputs.find((output) => output.name === check.output)?.label ?? check.output;
    const shown = { label, value: String(check.value).replace('-', '−'), unit: unitSuffix(check.unit), link: undefined as Record<string, string> | undefined };
    if (summary === undefined) return shown;
    // The link opens in the system of the stated unit, with that unit on the result.
    const system = isUsCustomary(check.unit) ? 'us' : 'si';
    const state = presetState(summary, withExampleDefaults(check.calculator, check.inputs)?.inputs ?? check.inputs, system);
    state.outputUnits[check.output] = check.unit;
    return { ...shown, link: encodeShareLink(summary, state, system) };
  });
}
