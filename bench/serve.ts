// A server process for benchmarks: fresh data folder, demo seed, ephemeral port; prints its URL as JSON.
// On stdin it answers `cpu` with its CPU time so far (µs, as JSON on stdout), and with BENCH_PROFILE set to a
// folder, `profile start` / `profile stop <name>` record a CPU profile of what lies between (Chrome DevTools).
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { Session } from 'node:inspector/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createInterface } from 'node:readline';
import { startServer } from '../server/server.ts';

const dataDir = mkdtempSync(path.join(tmpdir(), 'stanchion-bench-'));
const server = await startServer({
  port: 0,
  dataDir,
  seed: true,
  logLevel: 'silent',
  config: { bcryptRounds: 4, loginRateLimit: { windowMs: 60_000, max: 100_000 } },
});
process.stdout.write(`${JSON.stringify({ url: server.url })}\n`);

const profileDir = process.env.BENCH_PROFILE;
let session: Session | null = null;
async function command(line: string): Promise<void> {
  const [verb, arg, name] = line.trim().split(/\s+/);
  if (verb === 'cpu') process.stdout.write(`${JSON.stringify({ cpu: process.cpuUsage() })}\n`);
  if (verb !== 'profile' || !profileDir) return;
  if (arg === 'start') {
    session = new Session();
    session.connect();
    await session.post('Profiler.enable');
    await session.post('Profiler.start');
  } else if (arg === 'stop' && session) {
    const { profile } = await session.post('Profiler.stop');
    writeFileSync(path.join(profileDir, `${name ?? 'server'}.cpuprofile`), JSON.stringify(profile));
    session.disconnect();
    session = null;
  }
}
const input = createInterface({ input: process.stdin });
input.on('line', (line) => void command(line));
input.on('close', () => {
  void server.close().finally(() => {
    rmSync(dataDir, { recursive: true, force: true });
    process.exit(0);
  });
});
