// One error type for the whole server; the central handler turns it into the JSON error shape.
export class AppError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields?: Record<string, string>,
    public readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const notFound = (what = 'That') => new AppError(404, 'not_found', `${what} was not found.`);
export const forbidden = (message = 'Your role does not allow this.') => new AppError(403, 'forbidden', message);
export const unauthorized = (message = 'Sign in first.') => new AppError(401, 'unauthorized', message);
export const conflict = (code: string, message: string, fields?: Record<string, string>) =>
  new AppError(409, code, message, fields);
/** The database cannot be reached (or cannot just now): try again in a few seconds. */
export const databaseUnavailable = () =>
  new AppError(503, 'database_unavailable', 'Sporewell cannot reach its database just now. Try again in a few seconds.', undefined, { 'Retry-After': '5' });
/** Every pooled connection stayed in use for the pool's whole wait: the database is there, Sporewell is just busy. */
export const serverBusy = () => new AppError(503, 'busy', 'Sporewell is very busy just now. Try again in a moment.', undefined, { 'Retry-After': '2' });
