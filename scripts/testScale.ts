// docs/live-protocol.md §Several processes: the scale-out suite (every server test on PostgreSQL + Redis, then two
// server processes sharing rooms). Runs when TEST_DATABASE_URL and TEST_REDIS_URL are set; says so loudly when not.
import { spawnSync } from 'node:child_process';

if (!process.env.TEST_DATABASE_URL || !process.env.TEST_REDIS_URL) {
  console.warn(
    '\n!! Scale-out suite skipped: set TEST_DATABASE_URL (PostgreSQL) and TEST_REDIS_URL (Redis) to run it;\n' +
      '!! .ci/run sets them to the local services (see DEVELOPERS.md).\n',
  );
  process.exit(0);
}
const run = spawnSync('npx', ['vitest', 'run', '--project', 'server-pg', '--project', 'scale'], { stdio: 'inherit' });
process.exit(run.status ?? 1);
