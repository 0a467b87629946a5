/**
 * The provider's error shape: every failure is answered as
 * `{ "error": { "type", "code"?, "decline_code"?, "message", "param"? } }`
 * with the matching HTTP status (400 bad request, 401 bad key, 402 card
 * declined, 404 unknown object, 409 conflict). The SDK turns the status and
 * type into its error classes, so both must be right.
 */
export type ApiErrorType =
  "invalid_request_error" | "card_error" | "api_error" | "idempotency_error";

export interface ApiErrorExtra {
  code?: string;
  param?: string;
  decline_code?: string;
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: ApiErrorType,
    message: string,
    readonly extra: ApiErrorExtra = {},
  ) {
    super(message);
    this.name = "ApiError";
  }

  toBody(): { error: Record<string, string> } {
    const error: Record<string, string> = { type: this.type, message: this.message };
    if (this.extra.code) error.code = this.extra.code;
    if (this.extra.decline_code) error.decline_code = this.extra.decline_code;
    if (this.extra.param) error.param = this.extra.param;
    return { error };
  }
}

export function invalidRequest(message: string, param?: string, code?: string): ApiError {
  return new ApiError(400, "invalid_request_error", message, { param, code });
}

export function missingParam(param: string): ApiError {
  return new ApiError(400, "invalid_request_error", `Missing required param: ${param}.`, {
    code: "parameter_missing",
    param,
  });
}

/** 404 for an id that does not exist, worded like the provider: "No such customer: 'cus_x'". */
export function noSuch(noun: string, id: string, param = "id"): ApiError {
  return new ApiError(404, "invalid_request_error", `No such ${noun}: '${id}'`, {
    code: "resource_missing",
    param,
  });
}

export function unrecognizedUrl(method: string, path: string): ApiError {
  return new ApiError(
    404,
    "invalid_request_error",
    `Unrecognized request URL (${method}: ${path}). This local fake implements only the endpoints listed in docker/payment-fake/README.md.`,
  );
}

export interface Decline {
  code: string;
  decline_code?: string;
  message: string;
}

export function cardError(decline: Decline, param?: string): ApiError {
  return new ApiError(402, "card_error", decline.message, {
    code: decline.code,
    decline_code: decline.decline_code,
    param,
  });
}
