/*
 * Flowlore's quiz engine: answers, fresh numbers, grading and question fingerprints. Pure
 * TypeScript for the server. The definitions (`./definition`) hold keys and rubrics: the Angular
 * app never imports them, nor the loader in server/quizzes/.
 */
export { answerUnits, isCompatibleUnit, isEmptyResponse, keyUnitOf, kindOfUnit, MAX_WRITTEN_LENGTH, type ResponseValue, validateResponse } from './answers';
export {
  choiceOrder,
  decimalsOf,
  displayUnit,
  drawFresh,
  drawnValue,
  type EngineRun,
  type FreshDraw,
  interpolateStem,
  isDrawnInput,
  questionSeed,
  runCheck,
  runEngine,
  stemPlaceholders,
  stepCount,
} from './draw';
export { type GradeContext, type Graded, type GradeStatus, gradeResponse, isWithinTolerance, toleranceBand, toleranceInKeyUnit, toleranceText } from './grade';
export { canonicalJson, questionFingerprint, sha256Hex } from './version';
