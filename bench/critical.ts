// Critical buckling analysis: median time of the analysis of a 60-storey stack (both axes, 4 elements
// per piece), beside analyseStack of the same stack; and a building of 400 stacks of 40 storeys
// analysed with it on the worker thread. Targets: under 20 ms and under 5 s. Demo data, invented.
import { withCriticalBuckling } from '../shared/engine/critical/index.ts';
import { allLevelElevations } from '../shared/engine/stack/context.ts';
import { inspectStack } from '../shared/engine/stack/inspectStack.ts';
import { stackPieces } from '../shared/engine/stack/stackPieces.ts';
import { selfWeightPerMetre, takeDown } from '../shared/engine/stack/takeDown.ts';
import { analyseStack } from '../shared/engine/stack/index.ts';
import { DEFAULT_ANALYSIS_OPTIONS } from '../shared/schema/results.ts';
import { createOffThread } from '../server/offThread/pool.ts';
import { benchStackDocument } from './stack.ts';

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

async function time(run: () => unknown, repeats: number): Promise<{ wall: number; cpu: number }> {
  for (let i = 0; i < Math.min(10, repeats); i++) await run();
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const startCpu = process.cpuUsage();
    const start = performance.now();
    await run();
    wall.push(performance.now() - start);
    const used = process.cpuUsage(startCpu);
    cpu.push((used.user + used.system) / 1000);
  }
  return { wall: median(wall), cpu: median(cpu) };
}

export async function benchCritical(): Promise<void> {
  const tall = benchStackDocument(60);
  const options = { ...DEFAULT_ANALYSIS_OPTIONS, bucklingLengths: 'critical' as const };
  const { model } = inspectStack(tall);
  if (!model) throw new Error('bench stack is invalid');
  const pieces = stackPieces(model, allLevelElevations(undefined));
  const weights = model.lifts.map((l) => ({
    bottom: l.bottom,
    top: l.top,
    perMetre: selfWeightPerMetre(l.section.massPerMetre),
  }));
  const { sectionNEd } = takeDown(
    model.entries,
    weights,
    options,
    pieces.flat().map((p) => p.from),
  );
  const solved = withCriticalBuckling(model, pieces, sectionNEd);
  if (solved.errors.length || !solved.result)
    throw new Error(`bench stack cannot be solved: ${solved.errors[0]?.message}`);
  const dofs = solved.result.y.shape?.elevations.length ?? 0;
  const baseline = await time(() => analyseStack(tall), 200);
  const alone = await time(() => withCriticalBuckling(model, pieces, sectionNEd), 200);
  const whole = await time(() => analyseStack(tall, options), 200);
  console.log(
    `baseline: analyseStack, 60 storeys, tabulated factors: median ${baseline.wall.toFixed(3)} ms wall, ${baseline.cpu.toFixed(3)} ms CPU`,
  );
  console.log(
    `critical buckling of the stack alone (both axes, ${pieces.flat().length} pieces, ${dofs} nodes per axis): median ${alone.wall.toFixed(2)} ms wall, ${alone.cpu.toFixed(2)} ms CPU, ${(alone.cpu / baseline.cpu).toFixed(1)}× analyseStack (target < 20 ms)`,
  );
  console.log(
    `analyseStack, 60 storeys, critical buckling lengths: median ${whole.wall.toFixed(2)} ms wall, ${whole.cpu.toFixed(2)} ms CPU, ${(whole.cpu / baseline.cpu).toFixed(1)}× tabulated`,
  );

  const levels = new Map(Array.from({ length: 40 }, (_, i) => [`lv${i}`, i * 4] as const));
  const stacks = Array.from({ length: 400 }, (_, i) => ({ id: i, name: `S${i}`, doc: benchStackDocument(40, true) }));
  const offThread = createOffThread();
  try {
    const task = { stacks, options, levels, sections: new Map() };
    const first = await offThread.analyseBuilding(task);
    const failed = first.filter((s) => s.status === 'errors');
    if (failed.length)
      throw new Error(`${failed.length} bench stacks have errors: ${failed[0].resultJson.slice(0, 300)}`);
    const wall: number[] = [];
    const cpu: number[] = [];
    for (let i = 0; i < 5; i++) {
      // process.cpuUsage counts every thread of the process, the worker's included
      const startCpu = process.cpuUsage();
      const start = performance.now();
      await offThread.analyseBuilding(task);
      wall.push(performance.now() - start);
      const used = process.cpuUsage(startCpu);
      cpu.push((used.user + used.system) / 1000);
    }
    console.log(
      `analyseBuilding on the worker thread, 400 stacks of 40 storeys, critical buckling lengths: median ${median(wall).toFixed(0)} ms wall, ${median(cpu).toFixed(0)} ms CPU, results back as JSON text (target < 5000 ms)`,
    );
  } finally {
    await offThread.close();
  }
}
