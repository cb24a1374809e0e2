// Sizing (docs/analysis-rules.md §Sizing): median time to propose sections for one 60-storey stack and for a building
// of 400 stacks of 40 storeys, against analysing the same building in the same run.
// Target: the building in under 2 s on one core. Demo data, invented.
import { analyseBuilding } from '../shared/engine/stack/index.ts';
import { sizeBuilding, sizeStack } from '../shared/engine/sizing/index.ts';
import { sizingRequestSchema } from '../shared/schema/sizing.ts';
import { benchStackDocument } from './stack.ts';

function median(times: number[]): number {
  const sorted = [...times].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

interface Timing {
  /** Median wall-clock time, ms. */
  wall: number;
  /** Median CPU time of this process, ms: the figure that holds on a shared machine. */
  cpu: number;
}

function time(run: () => void, repeats: number): Timing {
  run();
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const start = performance.now();
    const usage = process.cpuUsage();
    run();
    const used = process.cpuUsage(usage);
    wall.push(performance.now() - start);
    cpu.push((used.user + used.system) / 1000);
  }
  return { wall: median(wall), cpu: median(cpu) };
}

const show = (t: Timing, digits = 0): string =>
  `median ${t.wall.toFixed(digits)} ms wall, ${t.cpu.toFixed(digits)} ms CPU`;

export async function benchSizing(): Promise<void> {
  const free = sizingRequestSchema.parse({ series: 'UKC', grade: 'S355', noUpwardIncrease: false });
  const rules = sizingRequestSchema.parse({ series: 'UKC', grade: 'S355', target: 0.9, noUpwardIncrease: true });
  const serial = sizingRequestSchema.parse({
    series: 'UKC',
    grade: 'S355',
    noUpwardIncrease: true,
    sameSerialSize: true,
  });

  const tall = benchStackDocument(60);
  const check = sizeStack(tall, rules);
  if (check.errors.length || !check.complete) throw new Error('bench stack could not be sized');
  console.log(
    `sizeStack, 60 storeys (UKC, no upward increase): ${show(
      time(() => sizeStack(tall, rules), 50),
      2,
    )}`,
  );

  const levels = new Map(Array.from({ length: 40 }, (_, i) => [`lv${i}`, i * 4] as const));
  const stacks = Array.from({ length: 400 }, (_, i) => ({ id: i, doc: benchStackDocument(40, true) }));
  const analysis = time(
    () =>
      analyseBuilding(
        stacks.map((s) => ({ ...s, name: `S${s.id}` })),
        levels,
        {},
      ),
    5,
  );
  console.log(`baseline: analyseBuilding, 400 stacks of 40 storeys: ${show(analysis)}`);
  for (const [label, request] of [
    ['no constraints', free],
    ['no upward increase, target 0.9', rules],
    ['same serial size', serial],
  ] as const) {
    const ms = time(() => sizeBuilding(stacks, request, {}, { levels }), 5);
    console.log(
      `sizeBuilding, 400 stacks of 40 storeys (${label}): ${show(ms)}, ${(ms.cpu / analysis.cpu).toFixed(2)}× analysis (target < 2000 ms)`,
    );
  }

  // Face reactions add nominal moments that couple the lifts: each raise re-analyses the whole stack.
  const faces = { yPlus: { Gk: 30, Qk: 15 }, zPlus: { Gk: 10, Qk: 5 } };
  const faced = stacks.slice(0, 40).map((s) => ({
    ...s,
    doc: {
      edges: s.doc.edges,
      nodes: s.doc.nodes.map((n) => (n.kind === 'restraint' ? { ...n, data: { ...n.data, faces } } : n)),
    },
  }));
  const withMoments = time(() => sizeBuilding(faced, rules, {}, { levels }), 3);
  console.log(
    `sizeBuilding, 40 stacks of 40 storeys with face reactions (nominal moments): ${show(withMoments)} (no target; ${(withMoments.cpu / 40).toFixed(0)} ms CPU per stack)`,
  );
}
