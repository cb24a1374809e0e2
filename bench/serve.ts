// A server process for benchmarks: fresh data folder, demo seed, ephemeral port; prints its URL as JSON.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
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
process.stdin.resume();
process.stdin.on('end', () => {
  void server.close().finally(() => {
    rmSync(dataDir, { recursive: true, force: true });
    process.exit(0);
  });
});
