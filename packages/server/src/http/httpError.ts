/**
 * An error with an HTTP status that the error middleware turns into
 * `{ error: { message, field? } }`. Throw it from any handler (async included).
 */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly field?: string,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const notFound = (what: string): HttpError => new HttpError(404, `${what} not found`);
