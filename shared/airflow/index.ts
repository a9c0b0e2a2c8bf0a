/* Flowlore's airflow engine: unit-aware calculators with worked steps, for browser and server. */
export type {
  Bound,
  CalculationOutcome,
  CalculationRequest,
  CalculationResult,
  CalculatorSummary,
  FieldError,
  InputGroup,
  InputKind,
  InputSummary,
  InputValue,
  ListValue,
  OptionChoice,
  OutputSummary,
  QuantityKind,
  QuantityOut,
  Step,
  Topic,
  UnitPair,
} from './types';
export { isListValue } from './read-input';
export { describeCalculator, evaluate, exampleRequest, listCalculators, withExampleDefaults } from './catalogue';
export { convert, DEFAULT_UNITS, isUnitOf, isUsCustomary, SI_UNIT, UNITS_BY_KIND } from './units';
export { STANDARD_CONDITIONS, type StandardCondition } from './standard-conditions';
