/**
 * An error with an HTTP status that the error middleware turns into
 * `{ error: { message, field? } }`. Throw it from any handler (async included).
 */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly field?: string,
    /** Every problem found, when there are several (e.g. a design document). */
    readonly issues?: { path: string; message: string }[],
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const notFound = (what: string): HttpError => new HttpError(404, `${what} not found`);
