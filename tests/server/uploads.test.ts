import { gunzipSync, gzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, makeCrew, startTestServer, type Crew, type TestServer } from './helpers';

let t: TestServer;
let crew: Crew;
const LIMIT = 64 * 1024;
beforeAll(async () => {
  t = await startTestServer({ UPLOAD_MAX_BYTES: String(LIMIT) });
  crew = await makeCrew(t);
});
afterAll(() => t.stop());

const upload = (file: Buffer, contentType: string, filename = 'model.sheaf.json.gz', token = crew.editor.accessToken) =>
  request(t.app).post(`/api/projects/${crew.projectId}/uploads`).set(bearer(token)).attach('file', file, { filename, contentType });

describe('uploads', () => {
  const model = JSON.stringify({ format: 'gluefield.sheaf', version: 1, simplices: [[0, 1], [1, 2], [0, 2]] });

  it('keep a gzip payload byte for byte, for members to fetch and a push to reference', async () => {
    const packed = gzipSync(model);
    const res = await upload(packed, 'application/gzip').expect(201);
    expect(res.body).toMatchObject({ mediaType: 'application/gzip', bytes: packed.length, filename: 'model.sheaf.json.gz', projectId: crew.projectId });
    const back = await request(t.app).get(`/api/uploads/${res.body.id}`).set(bearer(crew.viewer.accessToken)).buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(back.headers['content-type']).toBe('application/gzip');
    expect(gunzipSync(back.body as Buffer).toString()).toBe(model);

    const pushed = await request(t.app).post(`/api/projects/${crew.projectId}/changes`).set(bearer(crew.editor.accessToken))
      .send({ changes: [{ changeId: 'up-1', docId: 'big-model', kind: 'model', baseVersion: 0, uploadId: res.body.id, body: { name: 'Ring' } }] })
      .expect(200);
    expect(pushed.body.accepted).toHaveLength(1);
    const pulled = await request(t.app).get(`/api/projects/${crew.projectId}/changes?since=${pushed.body.revision - 1}`).set(bearer(crew.viewer.accessToken)).expect(200);
    expect(pulled.body.changes[0]).toMatchObject({ docId: 'big-model', uploadId: res.body.id, body: { name: 'Ring' } });
  });

  it('accept plain JSON too', async () => {
    await upload(Buffer.from(model), 'application/json', 'model.sheaf.json').expect(201);
  });

  it('refuse a payload past the size limit with 413', async () => {
    const res = await upload(Buffer.concat([gzipSync('x'), Buffer.alloc(LIMIT)]), 'application/gzip').expect(413);
    expect(res.body.error).toMatch(/larger/);
  });

  it.each([
    ['another media type', Buffer.from('hello'), 'text/plain'],
    ['bytes that are not gzip', Buffer.from('not gzip at all'), 'application/gzip'],
    ['JSON that does not parse', Buffer.from('{"format":'), 'application/json'],
  ])('refuse %s with 415', async (_what, bytes, type) => {
    const res = await upload(bytes, type).expect(415);
    expect(typeof res.body.error).toBe('string');
  });

  it('refuse a request without the file field, or with two files', async () => {
    await request(t.app).post(`/api/projects/${crew.projectId}/uploads`).set(bearer(crew.editor.accessToken)).field('note', 'x').expect(400);
    await request(t.app).post(`/api/projects/${crew.projectId}/uploads`).set(bearer(crew.editor.accessToken))
      .attach('file', gzipSync('a'), { filename: 'a.gz', contentType: 'application/gzip' })
      .attach('file', gzipSync('b'), { filename: 'b.gz', contentType: 'application/gzip' })
      .expect(400);
  });

  it('an upload of another project cannot be referenced or read by outsiders', async () => {
    const res = await upload(gzipSync(model), 'application/gzip').expect(201);
    const other = await request(t.app).post('/api/projects').set(bearer(crew.outsider.accessToken)).send({ name: 'Elsewhere' }).expect(201);
    await request(t.app).post(`/api/projects/${other.body.id}/changes`).set(bearer(crew.outsider.accessToken))
      .send({ changes: [{ changeId: 'steal', docId: 'm', kind: 'model', baseVersion: 0, uploadId: res.body.id }] })
      .expect(400);
    await request(t.app).get(`/api/uploads/${res.body.id}`).set(bearer(crew.outsider.accessToken)).expect(404);
  });
});
