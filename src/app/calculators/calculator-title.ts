import type { ResolveFn } from '@angular/router';

/**
 * The page title of /calculators/:id: the calculator's own title. A resolver rather than an
 * effect, because the title strategy runs after every navigation, and the page navigates (to
 * the same route, new query) whenever it writes its state into the address bar. The engine is
 * imported lazily, so it stays out of the initial bundle.
 */
export const calculatorTitle: ResolveFn<string> = async (route) => {
  const { describeCalculator } = await import('../../../shared/airflow');
  return describeCalculator(route.paramMap.get('id') ?? '')?.title ?? 'No such calculator';
};
