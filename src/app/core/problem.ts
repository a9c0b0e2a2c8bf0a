import { HttpContext, HttpContextToken, HttpErrorResponse } from '@angular/common/http';

/** An RFC 9457 problem as the API sends it (`application/problem+json`). */
export interface Problem {
  /** RFC 9457 type: 'about:blank', or one of ours such as '/problems/csrf-token'. */
  readonly type: string;
  readonly title: string;
  readonly status: number;
  readonly detail?: string;
  readonly errors?: ReadonlyArray<{ readonly field: string; readonly message: string }>;
}

/**
 * Who shows a failed request's problem: `snackbar` (the default for changes), `form` (the form shows
 * field errors beside its fields; anything else still goes to the snackbar) or `page` (the page
 * shows it itself; the default for reads, whose pages have their own error states) or `background`
 * (a save the reader did not ask for in words, such as the units switch following the account:
 * nothing is shown, and a lost session signs the app out without leaving the page).
 */
export type ProblemDisplay = 'snackbar' | 'form' | 'page' | 'background';
export const PROBLEM_DISPLAY = new HttpContextToken<ProblemDisplay | null>(() => null);

export function problemDisplay(display: ProblemDisplay): HttpContext {
  return new HttpContext().set(PROBLEM_DISPLAY, display);
}

/** The problem inside a failed request, or null when the answer was not problem+json. */
export function problemOf(error: unknown): Problem | null {
  if (!(error instanceof HttpErrorResponse)) return null;
  const body = error.error as Partial<Problem> | null;
  if (typeof body !== 'object' || body === null || typeof body.title !== 'string') return null;
  return { type: typeof body.type === 'string' ? body.type : 'about:blank', title: body.title, status: error.status, detail: body.detail, errors: Array.isArray(body.errors) ? body.errors : undefined };
}

/** The sentence to show for a problem: its detail, else its title. */
export function problemMessage(error: unknown, fallback = 'Something went wrong. Try again in a moment.'): string {
  const problem = problemOf(error);
  if (problem) return problem.detail ?? problem.title;
  if (error instanceof HttpErrorResponse && error.status === 0) return 'The server could not be reached. Check the connection and try again.';
  return fallback;
}
