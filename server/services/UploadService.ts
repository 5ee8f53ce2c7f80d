import { createHash, randomUUID } from 'node:crypto';
import type { UploadView } from '../../shared/api/types';
import type { UploadRow, UserRow } from '../db/entities';
import type { Transactor } from '../db/Transactor';
import { badRequest, notFound, unsupportedMediaType } from '../http/HttpError';
import { iso, type Clock } from './clock';
import { recordAudit } from './recordAudit';

export interface IncomingFile {
  originalname: string;
  mimetype: string;
  buffer: Buffer;
}

/** Media types accepted for uploads, mapped to the type they are stored as. */
export const UPLOAD_TYPES: Record<string, UploadRow['mediaType']> = {
  'application/gzip': 'application/gzip',
  'application/x-gzip': 'application/gzip',
  'application/json': 'application/json',
};

export function uploadView(u: UploadRow): UploadView {
  return { id: u.id, projectId: u.projectId, filename: u.filename, mediaType: u.mediaType, bytes: u.bytes, sha256: u.sha256, createdAt: u.createdAt };
}

/**
 * Large model payloads, sent compressed rather than inline in a push. The
 * declared type must match the bytes: gzip starts with 1f 8b, JSON parses.
 */
export class UploadService {
  constructor(private readonly tx: Transactor, private readonly clock: Clock) {}

  async create(user: UserRow, projectId: string, file: IncomingFile | undefined): Promise<UploadView> {
    if (!file) throw badRequest('send the payload as the multipart field "file"');
    const mediaType = UPLOAD_TYPES[file.mimetype];
    if (!mediaType) throw unsupportedMediaType('uploads must be application/gzip or application/json');
    if (file.buffer.length === 0) throw badRequest('the upload is empty');
    if (mediaType === 'application/gzip' && !(file.buffer[0] === 0x1f && file.buffer[1] === 0x8b)) throw unsupportedMediaType('the upload is not gzip data');
    if (mediaType === 'application/json' && !isJson(file.buffer)) throw unsupportedMediaType('the upload is not valid JSON');
    const now = iso(this.clock());
    const row: UploadRow = {
      id: randomUUID(), projectId, filename: file.originalname.slice(0, 200) || 'payload', mediaType, bytes: file.buffer.length,
      sha256: createHash('sha256').update(file.buffer).digest('hex'), data: file.buffer, createdBy: user.id, createdAt: now,
    };
    return this.tx.write(async (repos) => {
      await repos.uploads.insert(row);
      await recordAudit(repos, now, { projectId, actorId: user.id, action: 'upload.create', target: row.filename, detail: { id: row.id, bytes: row.bytes, mediaType } });
      return uploadView(row);
    });
  }

  /** An upload's project, to check access before reading its bytes. */
  async projectOf(uploadId: string): Promise<string> {
    const row = await this.tx.read((repos) => repos.uploads.findOne({ select: { id: true, projectId: true }, where: { id: uploadId } }));
    if (!row) throw notFound('no such upload');
    return row.projectId;
  }

  async get(uploadId: string): Promise<UploadRow> {
    const row = await this.tx.read((repos) => repos.uploads.findOneBy({ id: uploadId }));
    if (!row) throw notFound('no such upload');
    return row;
  }
}

function isJson(bytes: Buffer): boolean {
  try {
    JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(bytes));
    return true;
  } catch {
    return false;
  }
}
