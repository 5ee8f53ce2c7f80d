/**
 * Runs work one batch at a time per key: items that arrive for a key while
 * a batch of it is running wait, and the next batch takes all of them (in
 * arrival order, up to `maxWeight`). Keys are independent.
 *
 * Used for pushes to one project, which the database serialises anyway on
 * the project's row lock: waiting here holds no pool connection, and one
 * transaction for several waiting pushes pays the round trips of the lock,
 * the reads and the writes once. If a batch of several fails, each of its
 * items runs again alone, so one item's failure is its own.
 */
export class KeyedBatcher<K, I, O> {
  private readonly queues = new Map<K, Waiting<I, O>[]>();

  constructor(
    private readonly work: (key: K, items: I[]) => Promise<O[]>,
    private readonly weight: (item: I) => number,
    private readonly maxWeight: number,
  ) {}

  run(key: K, item: I): Promise<O> {
    return new Promise<O>((resolve, reject) => {
      const queue = this.queues.get(key);
      const waiting = { item, resolve, reject };
      if (queue) {
        queue.push(waiting);
        return;
      }
      this.queues.set(key, [waiting]);
      void this.drain(key);
    });
  }

  private async drain(key: K): Promise<void> {
    const queue = this.queues.get(key)!;
    while (queue.length) {
      let weight = this.weight(queue[0].item);
      let take = 1;
      while (take < queue.length && weight + this.weight(queue[take].item) <= this.maxWeight) weight += this.weight(queue[take++].item);
      const batch = queue.splice(0, take);
      try {
        const outputs = await this.work(key, batch.map((w) => w.item));
        batch.forEach((w, i) => w.resolve(outputs[i]));
      } catch (error) {
        if (batch.length === 1) batch[0].reject(error);
        else for (const w of batch) await this.work(key, [w.item]).then(([output]) => w.resolve(output), w.reject);
      }
    }
    this.queues.delete(key);
  }
}

interface Waiting<I, O> {
  item: I;
  resolve: (output: O) => void;
  reject: (error: unknown) => void;
}
