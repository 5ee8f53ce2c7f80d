import type { ErrorRequestHandler } from 'express';
import multer from 'multer';
import { HttpError } from './HttpError';

/**
 * The one place errors become responses: typed errors keep their status,
 * body-parser and multer errors get theirs, anything else is a 500 whose
 * details go to the log, not to the client.
 */
export function errorMiddleware(log: (message: string, error: unknown) => void = console.error): ErrorRequestHandler {
  return (error, _req, res, next) => {
    if (res.headersSent) return next(error);
    const { status, message } = describe(error);
    if (status >= 500) log('request failed', error);
    res.status(status).json({ error: message });
  };
}

function describe(error: unknown): { status: number; message: string } {
  if (error instanceof HttpError) return { status: error.status, message: error.message };
  if (error instanceof multer.MulterError) {
    if (error.code === 'LIMIT_FILE_SIZE') return { status: 413, message: 'the upload is larger than the server accepts' };
    return { status: 400, message: `bad upload: ${error.message}` };
  }
  const e = error as { type?: string; status?: number; expose?: boolean; message?: string };
  if (e.type === 'entity.too.large') return { status: 413, message: 'the request body is too large; send large models as uploads' };
  if (e.type === 'entity.parse.failed') return { status: 400, message: 'the request body is not valid JSON' };
  if (typeof e.status === 'number' && e.status >= 400 && e.status < 500 && e.expose) return { status: e.status, message: e.message ?? 'bad request' };
  return { status: 500, message: 'internal error' };
}
