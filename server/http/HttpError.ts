/** An error with an HTTP status; the error middleware answers `{error: message}` with it. */
export class HttpError extends Error {
  constructor(readonly status: number, message: string) {
    super(message);
    this.name = 'HttpError';
  }
}

export const badRequest = (message: string) => new HttpError(400, message);
export const unauthorized = (message = 'sign in first') => new HttpError(401, message);
export const forbidden = (message = 'your role does not allow this') => new HttpError(403, message);
export const notFound = (message = 'not found') => new HttpError(404, message);
export const conflict = (message: string) => new HttpError(409, message);
export const payloadTooLarge = (message: string) => new HttpError(413, message);
export const unsupportedMediaType = (message: string) => new HttpError(415, message);
