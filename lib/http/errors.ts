/** Errors with an HTTP meaning; route handlers map them to the one error shape. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) =>
  new HttpError(400, 'bad_request', message, fields);
export const unauthorized = (message = 'Sign in to continue.') => new HttpError(401, 'unauthorized', message);
export const forbidden = (message = 'Your role does not allow this action.') => new HttpError(403, 'forbidden', message);
export const notFound = (what = 'Record') => new HttpError(404, 'not_found', `${what} not found.`);
export const conflict = (message: string, fields?: Record<string, string>) =>
  new HttpError(409, 'conflict', message, fields);
export const tooLarge = (limitBytes: number) =>
  new HttpError(413, 'too_large', `The request body is larger than the limit of ${Math.round(limitBytes / 1024)} KiB.`);
export const tooMany = (retryAfterS: number, message: string) =>
  new HttpError(429, 'too_many_requests', message, undefined, { 'Retry-After': String(retryAfterS) });
export const unprocessable = (message: string, fields?: Record<string, string>) =>
  new HttpError(422, 'invalid', message, fields);
