/** An error that carries the HTTP status and a message that is safe to show a client. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const notFound = (what: string) => new HttpError(404, `${what} not found`);
export const badRequest = (message: string, details?: unknown) => new HttpError(400, message, details);
export const forbidden = (message = 'not allowed') => new HttpError(403, message);
export const unauthorized = (message = 'sign-in required') => new HttpError(401, message);
export const conflict = (message: string) => new HttpError(409, message);
