import { createHash } from 'node:crypto';
import type { ChangeInput } from '../../shared/sync/types';

/** JSON with object keys sorted at every depth, so equal values give equal text. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}

/** SHA-256 of what a change makes the document hold: its body, its upload, or its deletion. */
export function contentHash(change: Pick<ChangeInput, 'body' | 'uploadId' | 'deleted'>): string {
  const content = change.deleted ? { deleted: true } : { body: change.body ?? null, uploadId: change.uploadId ?? null };
  return createHash('sha256').update(canonicalJson(content)).digest('hex');
}
