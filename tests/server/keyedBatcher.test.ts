import { describe, expect, it } from 'vitest';
import { KeyedBatcher } from '../../server/services/KeyedBatcher';

/** A batch's work that the test lets finish when it chooses. */
function gatedWork() {
  const batches: { key: string; items: number[] }[] = [];
  const gates: (() => void)[] = [];
  const work = (key: string, items: number[]) =>
    new Promise<number[]>((resolve, reject) => {
      batches.push({ key, items });
      gates.push(() => (items.includes(-1) ? reject(new Error('bad item')) : resolve(items.map((x) => x * 10))));
    });
  const openNext = async () => {
    while (!gates.length) await new Promise((r) => setTimeout(r, 1));
    gates.shift()!();
  };
  return { batches, work, openNext };
}

describe('KeyedBatcher', () => {
  it('runs what waits for a key as the next batch, in arrival order, and answers each item with its own output', async () => {
    const { batches, work, openNext } = gatedWork();
    const b = new KeyedBatcher<string, number, number>(work, () => 1, 100);
    const first = b.run('p', 1);
    const rest = [b.run('p', 2), b.run('p', 3), b.run('p', 4)];
    await openNext();
    expect(await first).toBe(10);
    await openNext();
    expect(await Promise.all(rest)).toEqual([20, 30, 40]);
    expect(batches).toEqual([{ key: 'p', items: [1] }, { key: 'p', items: [2, 3, 4] }]);
  });

  it('keeps keys apart: one key waiting does not hold up another', async () => {
    const { batches, work, openNext } = gatedWork();
    const b = new KeyedBatcher<string, number, number>(work, () => 1, 100);
    void b.run('p', 1);
    const other = b.run('q', 2);
    await new Promise((r) => setTimeout(r, 5));
    expect(batches.map((x) => x.key)).toEqual(['p', 'q']);
    await openNext(); // p
    await openNext(); // q
    expect(await other).toBe(20);
  });

  it('splits what waits at maxWeight', async () => {
    const { batches, work, openNext } = gatedWork();
    const b = new KeyedBatcher<string, number, number>(work, (x) => x, 5);
    const all = [b.run('p', 1), b.run('p', 2), b.run('p', 3), b.run('p', 4), b.run('p', 9)];
    for (let i = 0; i < 4; i++) await openNext();
    expect(await Promise.all(all)).toEqual([10, 20, 30, 40, 90]);
    // An item heavier than maxWeight still runs, alone.
    expect(batches.map((x) => x.items)).toEqual([[1], [2, 3], [4], [9]]);
  });

  it('when a batch of several fails, runs each alone, so only the failing item fails', async () => {
    const { batches, work, openNext } = gatedWork();
    const b = new KeyedBatcher<string, number, number>(work, () => 1, 100);
    const first = b.run('p', 1);
    const rest = [b.run('p', 2), b.run('p', -1), b.run('p', 3)].map((p) => p.then((v) => ({ v }), (e: Error) => ({ e: e.message })));
    for (let i = 0; i < 5; i++) await openNext();
    expect(await first).toBe(10);
    expect(await Promise.all(rest)).toEqual([{ v: 20 }, { e: 'bad item' }, { v: 30 }]);
    expect(batches.map((x) => x.items)).toEqual([[1], [2, -1, 3], [2], [-1], [3]]);
  });
});
