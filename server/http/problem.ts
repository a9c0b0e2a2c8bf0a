/** RFC 9457 problem details: every API error leaves the server in this shape. */
export const PROBLEM_CONTENT_TYPE = 'application/problem+json';

export interface FieldProblem {
  /** Where the bad value sits, as a dotted path into the request (`inputs.pressure`). */
  readonly field: string;
  readonly message: string;
}

export interface ProblemBody {
  type: string;
  title: string;
  status: number;
  detail?: string;
  instance?: string;
  errors?: readonly FieldProblem[];
}

/** A typed error that the error middleware turns into problem+json. */
export class HttpProblem extends Error {
  constructor(
    readonly status: number,
    readonly title: string,
    readonly detail?: string,
    readonly errors?: readonly FieldProblem[],
    readonly type = 'about:blank',
  ) {
    super(detail ?? title);
    this.name = 'HttpProblem';
  }

  toBody(instance?: string): ProblemBody {
    const body: ProblemBody = { type: this.type, title: this.title, status: this.status };
    if (this.detail) body.detail = this.detail;
    if (instance) body.instance = instance;
    if (this.errors?.length) body.errors = this.errors;
    return body;
  }

  static badRequest(detail: string, errors?: readonly FieldProblem[]): HttpProblem {
    return new HttpProblem(400, 'Bad request', detail, errors);
  }

  static unauthorized(detail = 'Sign in to do this.'): HttpProblem {
    return new HttpProblem(401, 'Unauthorized', detail);
  }

  static forbidden(detail = 'Your account may not do this.'): HttpProblem {
    return new HttpProblem(403, 'Forbidden', detail);
  }

  static conflict(detail: string): HttpProblem {
    return new HttpProblem(409, 'Conflict', detail);
  }

  static notFound(detail: string): HttpProblem {
    return new HttpProblem(404, 'Not found', detail);
  }

  static serviceUnavailable(detail: string): HttpProblem {
    return new HttpProblem(503, 'Service unavailable', detail);
  }
}
