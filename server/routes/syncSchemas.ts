import { z } from 'zod';
import { DOC_KINDS, type ChangeInput } from '../../shared/sync/types';
import { readingsProblems } from './readingsBody';

const syncId = z.string().min(1).max(128).regex(/^[A-Za-z0-9._:@-]+$/, { message: 'ids use letters, digits and . _ : @ -' });

/** Provenance every run must carry, so a result can be traced to its engine, settings and model. */
const provenance = z.object({
  engineVersion: z.string().min(1).max(50),
  method: z.string().min(1).max(50),
  field: z.string().min(1).max(50),
  modelHash: z.string().min(1).max(128),
  ranAt: z.union([z.string().min(1).max(40), z.number()]),
});

export const changeSchema = z
  .object({
    changeId: syncId,
    docId: syncId,
    kind: z.enum(DOC_KINDS),
    baseVersion: z.number().int().min(0).max(2 ** 31 - 1),
    body: z.json().optional(),
    uploadId: z.uuid().optional(),
    deleted: z.boolean().optional(),
  })
  .superRefine((c, ctx) => {
    if (!c.deleted && c.body === undefined && c.uploadId === undefined) {
      ctx.addIssue({ code: 'custom', message: 'a change needs a body, an uploadId or deleted: true' });
    }
    if (c.kind === 'run' && !c.deleted && !provenance.safeParse((c.body as { provenance?: unknown } | null)?.provenance).success) {
      ctx.addIssue({ code: 'custom', path: ['body', 'provenance'], message: 'a run needs provenance {engineVersion, method, field, modelHash, ranAt}' });
    }
    if (c.kind === 'readings' && !c.deleted) {
      for (const p of readingsProblems(c.body, c.uploadId)) ctx.addIssue({ code: 'custom', path: p.path, message: p.message });
    }
  }) satisfies z.ZodType<ChangeInput>;

/** At most this many changes in one push; a client with more sends several. */
export const MAX_CHANGES_PER_PUSH = 500;

export const pushSchema = z.object({ changes: z.array(changeSchema).min(1).max(MAX_CHANGES_PER_PUSH) });

export const pullQuery = z.object({
  since: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(1000).default(500),
});
