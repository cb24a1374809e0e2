// SQLite's WAL is copied into the database file by the checkpointer's thread (server/walCheckpointer.ts), not
// at the end of a commit on the event loop: the server's connection no longer checkpoints, yet what it
// commits reaches the database file within moments. PostgreSQL has no WAL of ours to look after.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { onPostgres, startWithLeadAndBuilding, type TestServer } from './helpers.ts';

describe.skipIf(onPostgres)('the SQLite checkpointer', () => {
  let s: TestServer;
  let token: string;
  beforeAll(async () => {
    ({ s, token } = await startWithLeadAndBuilding('Checkpoints'));
  });
  afterAll(async () => {
    await s?.close();
  });

  it("copies committed pages into the database file while the server's connection never checkpoints", async () => {
    const [setting] = (await s.ctx.db.raw('PRAGMA wal_autocheckpoint')) as { wal_autocheckpoint: number }[];
    expect(setting.wal_autocheckpoint).toBe(0);
    const marker = `Checkpointed ${Date.now().toString(36)}`;
    expect((await s.api('POST', '/buildings', { token, body: { name: marker } })).status).toBe(201);
    const file = join(s.dataDir, 'stanchion.sqlite');
    const deadline = Date.now() + 5000;
    while (!readFileSync(file).includes(marker) && Date.now() < deadline)
      await new Promise((resolve) => setTimeout(resolve, 50));
    expect(readFileSync(file).includes(marker)).toBe(true);
  });
});
