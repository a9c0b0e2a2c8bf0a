import { ChangeDetectionStrategy, Component, computed, input, inject, linkedSignal, untracked } from '@angular/core';
import { RouterLink } from '@angular/router';

import { describeCalculator, withExampleDefaults } from '../../../shared/airflow';
import type { LessonEmbed } from '../../../shared/api/lessons';
import { CalculatorForm } from '../calculators/calculator-form';
import { CalculatorPanel } from '../calculators/calculator-panel';
import { type FormState, presetState } from '../calculators/form-state';
import { encodeShareLink } from '../calculators/share-link';
import { UnitSystemService } from '../calculators/unit-system.service';

let calculatorsMade = 0;

/**
 * A live calculator inside a lesson's text (mounted by LessonContent at its placeholder): the
 * calculator's title, the compact panel opened on the lesson's preset, and a link that opens the
 * same numbers on the calculator's own page.
 */
@Component({
  selector: 'fl-lesson-calculator',
  imports: [CalculatorPanel, RouterLink],
  template: `
    @if (opened(); as opened) {
      <section class="frame" [attr.aria-labelledby]="uid">
        <div class="head">
          <p class="kicker">Try it</p>
          <h3 [id]="uid">{{ opened.form.summary.title }}</h3>
          <a class="open no-print" [routerLink]="['/calculators', opened.form.summary.id]" [queryParams]="linkParams()">
            Open in the calculator
          </a>
        </div>
        <fl-calculator-panel [form]="opened.form" [embedded]="true" (settled)="state.set($event)" />
      </section>
    } @else {
      <p class="missing">The calculator “{{ embed().calculator }}” is not available.</p>
    }
  `,
  styleUrl: './lesson-calculator.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LessonCalculator {
  readonly embed = input.required<LessonEmbed>();

  private readonly unitSystems = inject(UnitSystemService);
  protected readonly uid = `lesson-calculator-${++calculatorsMade}`;

  /** The preset over the calculator's example, values in the author's units, results in the reader's system. */
  protected readonly opened = computed(() => {
    const { calculator, inputs } = this.embed();
    const summary = describeCalculator(calculator);
    if (summary === undefined) return undefined;
    // Untracked: the form is made once per embed (it writes its own signals as it is built).
    return untracked(() => {
      const system = this.unitSystems.preference();
      const preset = withExampleDefaults(calculator, inputs)?.inputs ?? inputs;
      return { form: new CalculatorForm(summary, presetState(summary, preset, system)), system };
    });
  });

  /** The panel's settled state, for the link to the calculator page. */
  protected readonly state = linkedSignal<FormState | undefined>(() => untracked(() => this.opened()?.form.state()));

  protected readonly linkParams = computed(() => {
    const opened = this.opened();
    const state = this.state();
    return opened && state ? encodeShareLink(opened.form.summary, state, opened.system) : {};
  });
}
