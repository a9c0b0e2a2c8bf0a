import type { QuestionDefinition } from '../../../shared/quiz/definition';

/**
 * Questions of four auto-graded kinds, built in code (independent of the YAML loader), that the API
 * tests' fixture quiz and the submits benchmark both ask. Keys: 180 cfm at 10 inH2O → 28 inH2O is
 * 180·√2.8 = 301.2 cfm (the square-root rule, content/README.md's own example).
 */
export function sampleQuestions(): QuestionDefinition[] {
  return [
    {
      id: 'why-test-pressure',
      kind: 'single',
      points: 1,
      stem: 'Jo quotes a port at 212 cfm. What is missing before anyone can compare it?',
      choices: [
        { id: 'a', text: 'The test pressure it was measured at', correct: true },
        { id: 'b', text: 'The room temperature', correct: false },
        { id: 'c', text: "The valve's diameter", correct: false },
      ],
      explanation: 'Flow grows with the pressure drop, roughly with its square root.',
    },
    {
      id: 'which-are-differential',
      kind: 'multiple',
      points: 2,
      partialCredit: 'per-choice',
      stem: 'Which of these readings are differential pressures?',
      choices: [
        { id: 'a', text: 'The drop across the port', correct: true },
        { id: 'b', text: 'The barometer', correct: false },
        { id: 'c', text: 'The drop across the orifice plate', correct: true },
        { id: 'd', text: 'A tyre gauge', correct: false },
      ],
      explanation: 'A differential pressure is one pressure measured against another.',
    },
    {
      id: 'convert-reading',
      kind: 'numeric',
      points: 2,
      stem: 'A port flows 180 cfm at 10 inH2O. What does it flow at 28 inH2O?',
      // content/README.md, "Quizzes": 180 cfm · √(28/10) = 301.2 cfm.
      key: { value: 301.2, unit: 'cfm' },
      tolerance: { kind: 'relative', percent: 1 },
      check: {
        calculator: 'flow-at-test-pressure',
        inputs: { flow: { value: 180, unit: 'cfm' }, fromPressureDrop: { value: 10, unit: 'inH2O' }, toPressureDrop: { value: 28, unit: 'inH2O' } },
        output: 'flow',
      },
      explanation: 'Flow scales with the square root of the pressure drop.',
    },
    {
      id: 'fresh-conversion',
      kind: 'fresh',
      points: 3,
      calculator: 'flow-at-test-pressure',
      output: 'flow',
      answerUnit: 'cfm',
      inputs: {
        flow: { from: 200, to: 260, step: 1, unit: 'cfm' },
        fromPressureDrop: { from: 10, to: 14, step: 0.5, unit: 'inH2O' },
        toPressureDrop: { value: 28, unit: 'inH2O' },
        model: 'square-root',
      },
      tolerance: { kind: 'relative', percent: 1 },
      stem: 'A port flows {flow} at {fromPressureDrop}. What does it flow at {toPressureDrop}?',
      explanation: 'Scale with the square root of the ratio of the pressure drops.',
    },
  ];
}
