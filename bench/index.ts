// npm run bench: every benchmark, each printing figures and ratios to a baseline measured in the same run.
import { benchEngine } from './engine.ts';
import { benchStack } from './stack.ts';
import { benchRealtime } from './realtime.ts';
import { benchSizing } from './sizing.ts';
import { benchFreeze } from './freeze.ts';
import { benchCritical } from './critical.ts';
import { benchFloorLoad } from './floorLoad.ts';

const benches: [string, () => Promise<void>][] = [
  ['member check (issue 3)', benchEngine],
  ['stack analysis (issue 4)', benchStack],
  ['live channel (issue 6)', benchRealtime],
  ['sizing (issue 11)', benchSizing],
  ['freeze a revision (issue 8)', benchFreeze],
  ['critical buckling (issue 23)', benchCritical],
  ['floor load at building scale (issue 20)', benchFloorLoad],
];

const only = process.argv[2];
for (const [name, run] of benches) {
  if (only && !name.includes(only)) continue;
  console.log(`\n== ${name}`);
  await run();
}
