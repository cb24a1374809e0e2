// Drawing the calculation package of a large building, or sizing every stack of one, takes seconds
// of CPU. On the main thread that would stall every request and live edit this process serves, so a
// worker thread does it. One thread at a time keeps a core free for requests; it starts on first use
// (about half a second to load the engine and the renderer) and ends after ten minutes without work.
// Work waits in a bounded queue that takes buildings in turn (fairQueue.ts); a full queue is refused
// with 503 and Retry-After.
import { Piscina } from 'piscina';
import type { SnapshotText } from '../services/revisions.ts';
import { busy } from '../errors.ts';
import { FairQueue, QueueFullError, type FairQueueLimits } from './fairQueue.ts';
import { workerExecArgv } from './passwords.ts';
import type {
  AnalysedStack,
  BuildingAnalysisTask,
  BuildingSizingOutcome,
  BuildingSizingTask,
  EditOutcome,
  EditTask,
  PackageTask,
} from './tasks.ts';
import type { PackageExtras } from '../pdf/calcPackage.ts';

export interface OffThread {
  /** `extras.mark`, when given, is printed on every page (a re-drawn or check copy says so). */
  renderPackage(snapshot: SnapshotText, extras?: PackageExtras): Promise<Buffer>;
  /** `key`: the building, so that one building's work cannot hold up another's. */
  sizeBuilding(task: BuildingSizingTask, key?: string): Promise<BuildingSizingOutcome>;
  analyseBuilding(task: BuildingAnalysisTask, key?: string): Promise<AnalysedStack[]>;
  /** An edit of a large stack (parse, apply, analyse), on its own thread so it never waits behind a package. */
  editLargeStack(task: EditTask): Promise<EditOutcome>;
  close(): Promise<void>;
}

export const OFF_THREAD_LIMITS: FairQueueLimits = { concurrency: 1, maxWaiting: 16, maxWaitingPerKey: 4 };

export function createOffThread(limits: FairQueueLimits = OFF_THREAD_LIMITS): OffThread {
  const queue = new FairQueue(limits);
  const enqueue = <T>(key: string, task: () => Promise<T>): Promise<T> => {
    try {
      return queue.run(key, task);
    } catch (e) {
      if (e instanceof QueueFullError)
        throw busy('The server is busy with long work (packages, sizing); try again shortly', e.retryAfterSeconds);
      throw e;
    }
  };
  const pool = new Piscina({
    filename: new URL('./worker.mjs', import.meta.url).href,
    minThreads: 0,
    maxThreads: 1,
    idleTimeout: 10 * 60_000,
  });
  // Edits of large stacks: a tenth of a second of CPU each (docs/access.md), queued here instead of on the
  // event loop. A thread of their own so an edit never waits behind a package being drawn.
  const edits = new Piscina({
    filename: new URL('./worker.mjs', import.meta.url).href,
    minThreads: 0,
    maxThreads: 1,
    idleTimeout: 10 * 60_000,
    execArgv: workerExecArgv(),
    // Below the event loop's priority: an edit may wait a little, a request should not.
    workerData: { nice: 10 },
  });
  return {
    async renderPackage(snapshot, extras = {}) {
      const task: PackageTask = { snapshotText: snapshot.text, hash: snapshot.hash, ...extras };
      // A Buffer crosses the thread boundary as a plain Uint8Array.
      const bytes = (await enqueue(`building:${snapshot.buildingId}`, () =>
        pool.run(task, { name: 'renderPackage' }),
      )) as Uint8Array;
      return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    },
    sizeBuilding: (task, key = 'sizing') =>
      enqueue(key, () => pool.run(task, { name: 'sizeWholeBuilding' }) as Promise<BuildingSizingOutcome>),
    analyseBuilding: (task, key = 'analysis') =>
      enqueue(key, () => pool.run(task, { name: 'analyseWholeBuilding' }) as Promise<AnalysedStack[]>),
    editLargeStack: (task) => edits.run(task, { name: 'editLargeStack' }) as Promise<EditOutcome>,
    close: async () => {
      await Promise.all([pool.destroy(), edits.destroy()]);
    },
  };
}
