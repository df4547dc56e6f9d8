/** An error answered in the payment API's own error shape, so the SDK maps it to its error classes. */
export class ApiError extends Error {
  readonly status: number;
  readonly type: string;
  readonly param: string | undefined;
  readonly code: string | undefined;

  constructor(status: number, message: string, details: { param?: string; code?: string; type?: string } = {}) {
    super(message);
    this.status = status;
    this.type = details.type ?? 'invalid_request_error';
    this.param = details.param;
    this.code = details.code;
  }

  toBody(): { error: Record<string, string> } {
    const error: Record<string, string> = { type: this.type, message: this.message };
    if (this.param !== undefined) error['param'] = this.param;
    if (this.code !== undefined) error['code'] = this.code;
    return { error };
  }
}

export function missingParam(param: string): ApiError {
  return new ApiError(400, `Missing required param: ${param}.`, { param, code: 'parameter_missing' });
}

export function invalidParam(param: string, message: string, code = 'parameter_invalid'): ApiError {
  return new ApiError(400, message, { param, code });
}

export function noSuchObject(kind: string, id: string, param: string, status = 404): ApiError {
  return new ApiError(status, `No such ${kind}: '${id}'`, { param, code: 'resource_missing' });
}
