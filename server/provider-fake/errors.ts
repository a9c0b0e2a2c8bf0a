import type { ErrorRequestHandler, RequestHandler } from 'express';

/**
 * The provider's error types. The SDK picks its error class from the HTTP status, and from `type`
 * for 400/404 (stripe 23.1.0, cjs/Error.js `generateV1Error`): 400/404 + idempotency_error →
 * StripeIdempotencyError, other 400/404 → StripeInvalidRequestError, 401 → StripeAuthenticationError,
 * 402 → StripeCardError, 5xx → StripeAPIError.
 */
export type ProviderErrorType = 'api_error' | 'card_error' | 'idempotency_error' | 'invalid_request_error';

export interface ProviderErrorBody {
  readonly type: ProviderErrorType;
  readonly message: string;
  readonly code?: string;
  readonly param?: string;
  readonly decline_code?: string;
}

/** An error answered as `{ error: { type, code, message, param } }` with its HTTP status. */
export class ProviderError extends Error {
  constructor(
    readonly status: number,
    readonly body: ProviderErrorBody,
  ) {
    super(body.message);
    this.name = 'ProviderError';
  }

  // Messages below follow the provider's public API reference and its answers as we remember them
  // (from memory, not looked up): close in meaning, not promised word for word.

  static invalidRequest(message: string, param?: string, code?: string): ProviderError {
    return new ProviderError(400, { type: 'invalid_request_error', message, ...(param ? { param } : {}), ...(code ? { code } : {}) });
  }

  static missingParam(param: string): ProviderError {
    return ProviderError.invalidRequest(`Missing required param: ${param}.`, param, 'parameter_missing');
  }

  static unknownParam(param: string): ProviderError {
    return ProviderError.invalidRequest(`Received unknown parameter: ${param}`, param, 'parameter_unknown');
  }

  static noSuch(kind: string, id: string, param = 'id'): ProviderError {
    return new ProviderError(404, { type: 'invalid_request_error', code: 'resource_missing', param, message: `No such ${kind}: '${id}'` });
  }

  static idempotencyMismatch(key: string): ProviderError {
    return new ProviderError(400, {
      type: 'idempotency_error',
      message:
        `Keys for idempotent requests can only be used with the same parameters they were first used with. ` +
        `Try using a key other than '${key}' if you meant to execute a different request.`,
    });
  }

  static missingApiKey(): ProviderError {
    return new ProviderError(401, {
      type: 'invalid_request_error',
      message: "You did not provide an API key. Send it in the Authorization header as 'Bearer <secret key>'.",
    });
  }

  static invalidApiKey(key: string): ProviderError {
    return new ProviderError(401, { type: 'invalid_request_error', code: 'api_key_invalid', message: `Invalid API Key provided: ${maskApiKey(key)}` });
  }

  static unavailable(): ProviderError {
    return new ProviderError(503, { type: 'api_error', message: 'The payment provider (local fake) is down on purpose for a test. Try again later.' });
  }
}

/**
 * Masks a key as the provider does in its 401 answer: the `sk_test_`-style prefix and the last four
 * characters stay, the rest become asterisks (from memory of the provider's answers).
 */
export function maskApiKey(key: string): string {
  const prefix = /^[a-z]{2,4}_(test_|live_)?/.exec(key)?.[0] ?? '';
  const rest = key.slice(prefix.length);
  if (rest.length <= 4) return `${prefix}${'*'.repeat(rest.length)}`;
  return `${prefix}${'*'.repeat(Math.min(rest.length - 4, 32))}${rest.slice(-4)}`;
}

/** Any /v1 path no router claimed. */
export const unknownApiRoute: RequestHandler = (req, _res, next) => {
  next(ProviderError.invalidRequest(`Unrecognized request URL (${req.method}: ${req.originalUrl.split('?')[0]}). The local fake speaks only the calls Flowlore makes.`));
};

interface BodyParserError extends Error {
  type?: string;
  status?: number;
}

/** Turns every error into the provider's error body; unexpected ones become a 500 api_error. */
export function providerErrorHandler(onUnexpected: (error: unknown) => void): ErrorRequestHandler {
  return (error: unknown, _req, res, next) => {
    if (res.headersSent) {
      next(error);
      return;
    }
    const known = toProviderError(error);
    if (!known) onUnexpected(error);
    const providerError = known ?? new ProviderError(500, { type: 'api_error', message: 'The local payment fake failed unexpectedly.' });
    res.status(providerError.status).json({ error: providerError.body });
  };
}

function toProviderError(error: unknown): ProviderError | undefined {
  if (error instanceof ProviderError) return error;
  const parserError = error as BodyParserError;
  if (parserError?.type === 'entity.too.large') return ProviderError.invalidRequest('The request body is too large.');
  if (typeof parserError?.type === 'string' && parserError.type.startsWith('entity.')) {
    return ProviderError.invalidRequest('The request body could not be read.');
  }
  return undefined;
}
