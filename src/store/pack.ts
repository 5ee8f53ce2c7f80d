import { StoreError } from './StoreError';

/** A model text ready to store: packed once, hashed once, from one UTF-8 encoding. */
export interface PreparedText {
  packed: Uint8Array;
  hash: string;
  /** UTF-8 length of the text */
  bytes: number;
}

/** gzip the UTF-8 text (CompressionStream, available in pages and workers). */
export async function packText(text: string): Promise<Uint8Array> {
  return pipeThrough(new TextEncoder().encode(text), new CompressionStream('gzip'));
}

/** The text of {@link packText}'s output. Throws StoreError `corrupt` on bytes that are not gzip. */
export async function unpackText(bytes: Uint8Array): Promise<string> {
  let raw: Uint8Array;
  try {
    raw = await pipeThrough(bytes, new DecompressionStream('gzip'));
  } catch (cause) {
    throw new StoreError('corrupt', 'the stored model text could not be unpacked', { cause });
  }
  return new TextDecoder().decode(raw);
}

/** SHA-256 of the UTF-8 text, as 64 lowercase hex digits. */
export async function hashText(text: string): Promise<string> {
  return hashBytes(new TextEncoder().encode(text));
}

/** Pack and hash in one pass over a single encoding (the text may be many megabytes). */
export async function prepareText(text: string): Promise<PreparedText> {
  const utf8 = new TextEncoder().encode(text);
  const [packed, hash] = await Promise.all([pipeThrough(utf8, new CompressionStream('gzip')), hashBytes(utf8)]);
  return { packed, hash, bytes: utf8.byteLength };
}

async function hashBytes(utf8: Uint8Array): Promise<string> {
  const digest = new Uint8Array(await crypto.subtle.digest('SHA-256', utf8 as Uint8Array<ArrayBuffer>));
  let hex = '';
  for (const b of digest) hex += b.toString(16).padStart(2, '0');
  return hex;
}

async function pipeThrough(input: Uint8Array, transform: CompressionStream | DecompressionStream): Promise<Uint8Array> {
  const writer = transform.writable.getWriter();
  // Write and read concurrently: the stream applies backpressure, so awaiting the write first could stall.
  const written = writer.write(input as Uint8Array<ArrayBuffer>).then(() => writer.close());
  const [out] = await Promise.all([new Response(transform.readable).arrayBuffer(), written]);
  return new Uint8Array(out);
}
