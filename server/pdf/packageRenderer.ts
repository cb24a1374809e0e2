// Drawing the calculation package of a large building takes seconds of CPU. On the main thread that
// would stall every request and live edit this process serves, so a worker thread draws it. One
// thread at a time keeps a core free for requests; it starts on first use (about half a second to load
// the renderer) and ends after ten minutes without work.
import { Piscina } from 'piscina';
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';

export interface PackageRenderer {
  render(snapshot: RevisionSnapshot, hash: string): Promise<Buffer>;
  close(): Promise<void>;
}

export function createPackageRenderer(): PackageRenderer {
  const pool = new Piscina<{ snapshot: RevisionSnapshot; hash: string }, Uint8Array>({
    filename: new URL('./calcPackageWorker.mjs', import.meta.url).href,
    minThreads: 0,
    maxThreads: 1,
    idleTimeout: 10 * 60_000,
  });
  return {
    async render(snapshot, hash) {
      // A Buffer crosses the thread boundary as a plain Uint8Array.
      const bytes = await pool.run({ snapshot, hash });
      return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    },
    close: () => pool.destroy(),
  };
}
