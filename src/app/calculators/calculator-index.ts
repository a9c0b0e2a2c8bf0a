import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterLink } from '@angular/router';

import { type CalculatorSummary, listCalculators } from '../../../shared/airflow';

interface TopicShelf {
  readonly topic: string;
  readonly calculators: readonly CalculatorSummary[];
}

/** Every calculator, under its topic, in the order the course meets them. */
function shelves(): TopicShelf[] {
  const byTopic = new Map<string, CalculatorSummary[]>();
  for (const calculator of listCalculators()) {
    const shelf = byTopic.get(calculator.topic) ?? [];
    shelf.push(calculator);
    byTopic.set(calculator.topic, shelf);
  }
  return [...byTopic].map(([topic, calculators]) => ({ topic, calculators }));
}

/** The calculator list: a card per calculator, grouped by topic. */
@Component({
  selector: 'fl-calculator-index',
  imports: [RouterLink],
  templateUrl: './calculator-index.html',
  styleUrl: './calculator-index.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalculatorIndex {
  protected readonly shelves = shelves();
}
