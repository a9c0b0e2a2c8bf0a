import { ChangeDetectionStrategy, Component, input } from '@angular/core';

import type { Step } from '../../../shared/airflow';
import { KatexRender } from './katex-render';

/** The engine's worked steps: each with its formula, the numbers put in, and the result. */
@Component({
  selector: 'fl-worked-steps',
  imports: [KatexRender],
  template: `
    <ol class="steps">
      @for (step of steps(); track $index; let number = $index) {
        <li class="step">
          <!-- A heading one level below the section the steps sit in: h3 on the page, h4 in a lesson. -->
          <div class="step-title" role="heading" [attr.aria-level]="headingLevel()">
            <span class="step-number figures" aria-hidden="true">{{ number + 1 }}</span>
            <span>{{ step.title }}</span>
          </div>
          <dl class="step-lines">
            <div class="step-line">
              <dt>Formula</dt>
              <dd class="math" [flKatex]="step.formula"></dd>
            </div>
            <div class="step-line">
              <dt>With the numbers</dt>
              <dd class="math" [flKatex]="step.substituted"></dd>
            </div>
            <div class="step-line result">
              <dt>Result</dt>
              <dd class="math" [flKatex]="step.result"></dd>
            </div>
          </dl>
        </li>
      }
    </ol>
  `,
  styleUrl: './worked-steps.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WorkedSteps {
  readonly steps = input.required<readonly Step[]>();
  readonly headingLevel = input(3);
}
