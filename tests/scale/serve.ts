// One server process of the scale-out suite: configuration from the environment (DATABASE_URL,
// DATABASE_SCHEMA, REDIS_URL, REDIS_PREFIX, JWT_SECRET), an ephemeral port; prints its URL as JSON.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { startServer } from '../../server/server.ts';

const dataDir = mkdtempSync(path.join(tmpdir(), 'stanchion-scale-'));
const server = await startServer({
  port: 0,
  dataDir,
  seed: process.env.SEED === '1',
  logLevel: 'silent',
  config: { bcryptRounds: 4 },
});
process.stdout.write(`${JSON.stringify({ url: server.url })}\n`);
process.stdin.resume();
process.stdin.on('end', () => {
  void server.close().finally(() => {
    rmSync(dataDir, { recursive: true, force: true });
    process.exit(0);
  });
});
