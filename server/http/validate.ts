import type { Request } from 'express';
import { z } from 'zod';
import { badRequest, notFound } from './HttpError';

/** Parse a request body; a mismatch is a 400 naming the first problem. */
export function parseBody<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  return parseOr(schema, req.body ?? {}, 'body');
}

/** Parse a query string. */
export function parseQuery<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  return parseOr(schema, req.query, 'query');
}

/**
 * Parse path parameters. An id of the wrong shape names nothing that could
 * exist, so it answers 404, exactly as a well-formed id that does not.
 */
export function parseParams<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  const result = schema.safeParse(req.params);
  if (!result.success) throw notFound();
  return result.data;
}

function parseOr<S extends z.ZodType>(schema: S, value: unknown, where: string): z.infer<S> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const issue = result.error.issues[0];
  const path = issue.path.length ? issue.path.join('.') : where;
  throw badRequest(`${path}: ${issue.message}`);
}

export const uuid = z.uuid();
export const email = z.string().trim().toLowerCase().pipe(z.email({ message: 'not a valid e-mail address' })).pipe(z.string().max(254));
export const projectRole = z.enum(['owner', 'editor', 'viewer']);
