/* Catalogue entries the form-state and share-link tests share: a real calculator, or a list-only one. */
import { describeCalculator, type CalculatorSummary } from '../../../shared/airflow';

/** A calculator of the engine's catalogue, or a loud failure. */
export function calculator(id: string): CalculatorSummary {
  const summary = describeCalculator(id);
  if (summary === undefined) throw new Error(`no calculator ${id}`);
  return summary;
}

/** A calculator with one list input, as the catalogue describes one (InputSummary.list). */
export function readingsCalculator(): CalculatorSummary {
  return {
    id: 'readings-only',
    title: 'Readings',
    topic: 'Sensors and uncertainty',
    summary: '',
    inputs: [
      {
        name: 'readings',
        label: 'Readings',
        symbol: 'Q',
        kind: 'volumeFlow',
        help: 'Repeat readings of one flow.',
        optional: false,
        units: ['m^3/s', 'L/s', 'cfm'],
        defaultUnit: { si: 'L/s', us: 'cfm' },
        list: { min: 2, max: 30 },
        // Readings for the worked example of course-review-1 E1: n = 3 refits, s = 1.2 cfm.
        example: { values: [248.8, 250.0, 251.2], unit: 'cfm' },
      },
    ],
    groups: [],
    outputs: [],
  };
}
