// Password hashing and strength rating on a worker thread (docs/access.md). bcryptjs's asynchronous calls
// still run on the event loop in 100 ms slices, and all pending hashes take their slice in the same turn:
// thirty parallel registrations held the loop for seconds. Here the loop only waits.
// One pool for the process (every server in it shares it); its idle thread never keeps the process alive.
import { Piscina } from 'piscina';

/** The process's flags, less those a worker thread refuses (a server started with `node --input-type=module -e`). */
export const workerExecArgv = (): string[] =>
  process.execArgv.filter((a) => !a.startsWith('--input-type') && a !== '-e' && a !== '--eval');

let pool: Piscina | null = null;
function passwords(): Piscina {
  pool ??= new Piscina({
    filename: new URL('./passwordWorker.mjs', import.meta.url).href,
    minThreads: 0,
    maxThreads: 1,
    idleTimeout: 60_000,
    execArgv: workerExecArgv(),
  });
  return pool;
}

export const hashOffThread = (password: string, rounds: number): Promise<string> =>
  passwords().run({ password, rounds }, { name: 'hash' }) as Promise<string>;

export const compareOffThread = (password: string, hash: string): Promise<boolean> =>
  passwords().run({ password, hash }, { name: 'compare' }) as Promise<boolean>;

export interface Rating {
  score: number;
  warning: string | null;
  suggestions: string[];
}

export const rateOffThread = (password: string, personal: string[]): Promise<Rating> =>
  passwords().run({ password, personal }, { name: 'rate' }) as Promise<Rating>;
