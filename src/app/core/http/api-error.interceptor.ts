import { HttpErrorResponse, type HttpInterceptorFn } from '@angular/common/http';
import { catchError, throwError } from 'rxjs';

/** An API failure as the views show it: one sentence, whatever went wrong underneath. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details?: unknown,
    readonly body?: unknown,
  ) {
    super(message);
  }
}

export function describeHttpError(error: HttpErrorResponse): ApiError {
  if (error.status === 0) return new ApiError(0, 'The server cannot be reached. Check your connection and try again.');
  const body = error.error as { error?: unknown; details?: unknown } | null;
  const message = typeof body?.error === 'string' ? body.error : `The server answered ${error.status} ${error.statusText}`.trim();
  return new ApiError(error.status, message, body?.details, error.error);
}

/** Shapes every failed API call into an ApiError so views show a readable message. */
export const apiErrorInterceptor: HttpInterceptorFn = (req, next) =>
  next(req).pipe(catchError((error: unknown) => throwError(() => (error instanceof HttpErrorResponse ? describeHttpError(error) : error))));
