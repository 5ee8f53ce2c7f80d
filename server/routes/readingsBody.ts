import { z } from 'zod';
import { READINGS_FORMAT, READINGS_VERSION } from '../../shared/engine/data/Readings';

const syncId = z.string().min(1).max(128).regex(/^[A-Za-z0-9._:@-]+$/, { message: 'ids use letters, digits and . _ : @ -' });

/**
 * A readings document's body: which model it belongs to, its name, and the
 * readings file inline (`text`) unless the change names a gzip upload. The
 * server cannot check readings against the model's cells (the model may be
 * an upload it never parses), so it checks the file's own shape here; the
 * cells are checked by the engine wherever the readings are read
 * (`readReadings`).
 */
export const readingsBody = z.object({
  modelId: syncId,
  name: z.string().trim().min(1, { message: 'must not be empty' }).max(200),
  count: z.number().int().min(0),
  bytes: z.number().int().min(0),
  text: z.string().max(16 * 1024 * 1024).optional(),
});

const readingsFile = z.object({
  format: z.literal(READINGS_FORMAT, { message: `must be "${READINGS_FORMAT}"` }),
  version: z.literal(READINGS_VERSION, { message: `must be ${READINGS_VERSION}` }),
  values: z.array(
    z.object({
      cell: z.array(z.number().int().min(0)).min(1, { message: 'must name at least one vertex' }),
      value: z.array(z.union([z.number(), z.string().max(100)])).min(1, { message: 'must hold at least one number' }),
      weight: z.number().positive().optional(),
    }),
  ),
});

export interface BodyProblem {
  path: (string | number)[];
  message: string;
}

/** Problems with a readings change (empty when it is fine); paths are relative to the change. */
export function readingsProblems(body: unknown, uploadId: string | undefined): BodyProblem[] {
  const parsed = readingsBody.safeParse(body);
  if (!parsed.success) return parsed.error.issues.map((i) => ({ path: ['body', ...(i.path as (string | number)[])], message: i.message }));
  const b = parsed.data;
  if (b.text === undefined) return uploadId ? [] : [{ path: ['body', 'text'], message: 'readings need the file as text or an uploadId' }];
  let json: unknown;
  try {
    json = JSON.parse(b.text);
  } catch (e) {
    return [{ path: ['body', 'text'], message: `is not JSON: ${(e as Error).message}` }];
  }
  const file = readingsFile.safeParse(json);
  if (!file.success) return file.error.issues.map((i) => ({ path: ['body', 'text', ...(i.path as (string | number)[])], message: i.message }));
  if (file.data.values.length !== b.count) {
    return [{ path: ['body', 'count'], message: `says ${b.count} readings, but the text holds ${file.data.values.length}` }];
  }
  return [];
}
