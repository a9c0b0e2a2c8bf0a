import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterLink } from '@angular/router';

/** Placeholder until the calculator list lands. */
@Component({
  selector: 'fl-calculator-index',
  imports: [RouterLink],
  template: `
    <h1>Calculators</h1>
    <p class="prose">
      The calculators are on their way. Each one will take SI or US customary units, show every
      step with its formula, and give you a link to share. They will be free to use, with no account.
    </p>
    <p class="prose"><a routerLink="/">Back to the home page</a></p>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalculatorIndex {}
