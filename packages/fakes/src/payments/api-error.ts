/**
 * Errors in the provider's REST shape: `{ error: { type, code, message, param } }` with the
 * HTTP status the official SDK maps to its error classes (400/404 invalid request, 401
 * authentication, 402 card, 409 conflict, 5xx api error). Codes follow the provider's
 * published error-code list (from memory where marked).
 */
export type ApiErrorType = 'invalid_request_error' | 'idempotency_error' | 'api_error' | 'card_error';

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: ApiErrorType,
    message: string,
    readonly code?: string,
    readonly param?: string,
  ) {
    super(message);
  }

  toBody(): { error: { type: ApiErrorType; message: string; code?: string; param?: string } } {
    return {
      error: {
        type: this.type,
        message: this.message,
        ...(this.code ? { code: this.code } : {}),
        ...(this.param ? { param: this.param } : {}),
      },
    };
  }
}

export const missingParam = (param: string): ApiError =>
  new ApiError(400, 'invalid_request_error', `Missing required param: ${param}.`, 'parameter_missing', param);

export const invalidParam = (param: string, message: string, code = 'parameter_invalid'): ApiError =>
  new ApiError(400, 'invalid_request_error', message, code, param);

export const unknownParam = (param: string): ApiError =>
  new ApiError(
    400,
    'invalid_request_error',
    `Received unknown parameter: ${param} (the local payment fake implements only what Gloaming uses).`,
    'parameter_unknown',
    param,
  );

/** 404 for an id that does not exist, e.g. `No such checkout.session: 'cs_test_x'`. */
export const noSuch = (objectName: string, id: string, param = 'id'): ApiError =>
  new ApiError(404, 'invalid_request_error', `No such ${objectName}: '${id}'`, 'resource_missing', param);
