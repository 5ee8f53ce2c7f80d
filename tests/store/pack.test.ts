import 'fake-indexeddb/auto';
import { describe, expect, test } from 'vitest';
import { hashText, packText, prepareText, StoreError, unpackText } from '../../src/store';

describe('pack', () => {
  test('unpackText(packText(text)) returns the text, including non-ASCII characters', async () => {
    const text = 'Ridge line — station RL-01, 1 234,5 m; ∂δ = 0 ✓\n'.repeat(1000);
    const packed = await packText(text);
    expect(packed.byteLength).toBeLessThan(text.length / 10);
    expect(await unpackText(packed)).toBe(text);
  });

  test('packText output is gzip (magic bytes 1f 8b, RFC 1952)', async () => {
    const packed = await packText('{}');
    expect([packed[0], packed[1]]).toEqual([0x1f, 0x8b]);
  });

  test('hashText is SHA-256: "abc" and "" give the FIPS 180-2 / NIST example digests', async () => {
    expect(await hashText('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(await hashText('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });

  test('prepareText packs, hashes and measures the UTF-8 length in one go', async () => {
    const text = 'é'.repeat(10);
    const p = await prepareText(text);
    expect(p.bytes).toBe(20);
    expect(p.hash).toBe(await hashText(text));
    expect(await unpackText(p.packed)).toBe(text);
  });

  test('unpackText of bytes that are not gzip throws StoreError corrupt', async () => {
    const err = await unpackText(new Uint8Array([1, 2, 3, 4, 5])).catch((e) => e);
    expect(err).toBeInstanceOf(StoreError);
    expect(err.code).toBe('corrupt');
  });
});
