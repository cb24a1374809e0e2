// The worker queue (server/offThread/fairQueue.ts): bounded, and fair between buildings — one
// building's backlog does not hold up another's task, and a full queue refuses at once.
import { describe, expect, it } from 'vitest';
import { FairQueue, QueueFullError } from '../../server/offThread/fairQueue.ts';

function gate(): { promise: Promise<void>; open: () => void } {
  let open = () => undefined as void;
  const promise = new Promise<void>((resolve) => (open = resolve));
  return { promise, open };
}

describe('FairQueue', () => {
  it('takes buildings in turn: a task of building B runs before the rest of building A’s backlog', async () => {
    const q = new FairQueue({ concurrency: 1, maxWaiting: 10, maxWaitingPerKey: 10 });
    const order: string[] = [];
    const first = gate();
    const runs = [
      q.run('A', async () => {
        await first.promise;
        order.push('A1');
      }),
    ];
    for (const t of ['A2', 'A3', 'A4']) runs.push(q.run('A', async () => void order.push(t)));
    runs.push(q.run('B', async () => void order.push('B1')));
    first.open();
    await Promise.all(runs);
    expect(order).toEqual(['A1', 'A2', 'B1', 'A3', 'A4']);
  });

  it('refuses at once beyond the per-building and the total bounds, with a time to retry', async () => {
    const q = new FairQueue({ concurrency: 1, maxWaiting: 3, maxWaitingPerKey: 2 });
    const hold = gate();
    const runs = [q.run('A', () => hold.promise), q.run('A', async () => undefined), q.run('A', async () => undefined)];
    expect(() => q.run('A', async () => undefined)).toThrow(QueueFullError);
    runs.push(q.run('B', async () => undefined));
    expect(() => q.run('C', async () => undefined)).toThrow(QueueFullError);
    try {
      q.run('C', async () => undefined);
    } catch (e) {
      expect((e as QueueFullError).retryAfterSeconds).toBeGreaterThanOrEqual(1);
    }
    hold.open();
    await Promise.all(runs);
    expect(q.size).toEqual({ running: 0, waiting: 0 });
  });

  it('keeps going after a task fails', async () => {
    const q = new FairQueue({ concurrency: 1, maxWaiting: 5, maxWaitingPerKey: 5 });
    const failed = q.run('A', async () => {
      throw new Error('drawing failed');
    });
    const next = q.run('A', async () => 42);
    await expect(failed).rejects.toThrow('drawing failed');
    expect(await next).toBe(42);
  });
});
