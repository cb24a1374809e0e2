// The queue in front of the worker thread: bounded, and fair between buildings. Each building (key)
// has its own line; the next task is taken from the lines in turn, so six downloads of one large
// package do not hold up another building's work behind them. A task that would exceed the bounds is
// refused at once (the route answers 503 with Retry-After) rather than waiting without end.
export class QueueFullError extends Error {
  constructor(readonly retryAfterSeconds: number) {
    super('The worker queue is full');
    this.name = 'QueueFullError';
  }
}

interface Waiting {
  start: () => void;
}

export interface FairQueueLimits {
  /** Tasks running at once (the worker threads). */
  concurrency: number;
  /** Tasks waiting, over all keys. */
  maxWaiting: number;
  /** Tasks waiting for one key. */
  maxWaitingPerKey: number;
}

export class FairQueue {
  private running = 0;
  private waiting = 0;
  private readonly lines = new Map<string, Waiting[]>();

  constructor(private readonly limits: FairQueueLimits) {}

  get size(): { running: number; waiting: number } {
    return { running: this.running, waiting: this.waiting };
  }

  run<T>(key: string, task: () => Promise<T>): Promise<T> {
    if (this.running < this.limits.concurrency && this.waiting === 0) return this.execute(task);
    const line = this.lines.get(key) ?? [];
    if (this.waiting >= this.limits.maxWaiting || line.length >= this.limits.maxWaitingPerKey) {
      throw new QueueFullError(Math.max(1, Math.ceil(this.waiting / this.limits.concurrency) * 2));
    }
    return new Promise<T>((resolve, reject) => {
      line.push({ start: () => void this.execute(task).then(resolve, reject) });
      // A key's line goes to the back of the round when it is (re)created.
      this.lines.delete(key);
      this.lines.set(key, line);
      this.waiting += 1;
    });
  }

  private async execute<T>(task: () => Promise<T>): Promise<T> {
    this.running += 1;
    try {
      return await task();
    } finally {
      this.running -= 1;
      this.startNext();
    }
  }

  /** Takes the first task of the first line, then sends that line to the back of the round. */
  private startNext(): void {
    if (this.running >= this.limits.concurrency) return;
    const first = this.lines.entries().next();
    if (first.done) return;
    const [key, line] = first.value;
    const next = line.shift() as Waiting;
    this.waiting -= 1;
    this.lines.delete(key);
    if (line.length > 0) this.lines.set(key, line);
    next.start();
  }
}
