import { Router } from 'express';

import { listCalculators, type CalculatorSummary, type FieldError } from '../../shared/airflow';
import { calculationRequestSchema, type CalculationRequestBody } from '../../shared/api/calculators';
import { HttpProblem, type FieldProblem } from '../http/problem';
import { validateBody } from '../http/validate';
import { CalculationCache } from './calculation-cache';

/** The public calculators: the catalogue, and the same engine the browser runs, on the server. */
export function calculatorsRouter(): Router {
  const router = Router();
  const catalogue = listCalculators();
  const byId = new Map(catalogue.map((summary) => [summary.id, summary]));
  const calculations = new CalculationCache();
  const requireCalculator = (id: string | undefined): CalculatorSummary => {
    const summary = id ? byId.get(id) : undefined;
    if (!summary) throw HttpProblem.notFound(`There is no calculator "${id}". GET /api/calculators lists them.`);
    return summary;
  };

  router.get('/', (_req, res) => {
    res.set('Cache-Control', 'public, max-age=300').json(catalogue);
  });

  router.get('/:id', (req, res) => {
    res.set('Cache-Control', 'public, max-age=300').json(requireCalculator(req.params.id));
  });

  router.post('/:id', (req, _res, next) => {
    requireCalculator(req.params.id);
    next();
  }, validateBody(calculationRequestSchema), (req, res) => {
    const outcome = calculations.evaluate(req.params.id as string, res.locals['body'] as CalculationRequestBody);
    if (!outcome.ok) {
      throw HttpProblem.badRequest('Some inputs cannot be used; each is listed with the reason.', outcome.errors.map(toRequestField));
    }
    // A computed answer, not a cacheable representation: no ETag to hash for it.
    res.type('application/json').end(outcome.json ?? JSON.stringify(outcome.result));
  });

  return router;
}

/** Engine errors name an input; the API names the place in the request body. */
function toRequestField(error: FieldError): FieldProblem {
  if (error.field.startsWith('outputUnits.')) return error;
  return { field: error.field ? `inputs.${error.field}` : 'inputs', message: error.message };
}
