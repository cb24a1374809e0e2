// Median time of analyseStack (60 storeys) and analyseBuilding (400 stacks of 40 storeys).
// Targets: under 1 ms and under 200 ms on one core. Demo data, invented.
import { analyseBuilding, analyseStack } from '../shared/engine/stack/index.ts';
import type { StackDocument, StackEdge, StackNode } from '../shared/schema/stack.ts';

const SECTIONS = ['UKC 356x406x235', 'UKC 305x305x158', 'UKC 254x254x107', 'UKC 203x203x71', 'UKC 203x203x46'];

/** A braced stack: 4 m storeys, a lift every two storeys, office floors and a roof; heavier sections low down. */
export function benchStackDocument(storeys: number, levelIds = false): StackDocument {
  const nodes: StackNode[] = [{ id: 's', kind: 'support', data: { elevation: 0, fixity: 'fixed' } }];
  const edges: StackEdge[] = [];
  const link = (source: string, target: string): void => void edges.push({ id: `e${edges.length}`, source, target });
  const liftCount = Math.ceil(storeys / 2);
  let below = 's';
  for (let i = 0; i < liftCount; i++) {
    const lift = `l${i}`;
    const top = Math.min(storeys, 2 * (i + 1)) * 4;
    const section = SECTIONS[Math.min(SECTIONS.length - 1, Math.floor((i / liftCount) * SECTIONS.length))];
    nodes.push({ id: lift, kind: 'lift', data: { section, grade: 'S355' } });
    link(below, lift);
    const above = i === liftCount - 1 ? 'c' : `p${i}`;
    nodes.push(
      above === 'c'
        ? { id: 'c', kind: 'cap', data: { elevation: top, fixity: 'pinned', Gk: 40, Qk: 12, category: 'H' } }
        : { id: above, kind: 'splice', data: { elevation: top } },
    );
    link(lift, above);
    below = above;
  }
  for (let floor = 1; floor < storeys; floor++) {
    const id = `r${floor}`;
    const data = {
      elevation: floor * 4,
      axes: floor % 3 === 0 ? ('z' as const) : ('both' as const),
      fixity: 'pinned' as const,
      Gk: 60,
      Qk: 30,
      category: floor % 5 === 0 ? ('E' as const) : ('B' as const),
    };
    nodes.push({ id, kind: 'restraint', data: levelIds ? { ...data, levelId: `lv${floor}` } : data });
    link(id, `l${Math.floor((floor - 1) / 2)}`);
  }
  return { nodes, edges };
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

/** Median wall time and median process CPU time (ms) of `run`; CPU time is the fairer figure on a busy machine. */
function time(run: () => void, repeats: number): { wall: number; cpu: number } {
  for (let i = 0; i < Math.min(20, repeats); i++) run();
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const startCpu = process.cpuUsage();
    const start = performance.now();
    run();
    wall.push(performance.now() - start);
    const used = process.cpuUsage(startCpu);
    cpu.push((used.user + used.system) / 1000);
  }
  return { wall: median(wall), cpu: median(cpu) };
}

export async function benchStack(): Promise<void> {
  const tall = benchStackDocument(60);
  const check = analyseStack(tall);
  if (check.errors.length) throw new Error(`bench stack is invalid: ${check.errors[0].message}`);
  const one = time(() => analyseStack(tall), 500);
  console.log(
    `analyseStack, 60 storeys: median ${one.wall.toFixed(3)} ms wall, ${one.cpu.toFixed(3)} ms CPU (target < 1 ms)`,
  );

  const levels = new Map(Array.from({ length: 40 }, (_, i) => [`lv${i}`, i * 4] as const));
  const stacks = Array.from({ length: 400 }, (_, i) => ({ id: i, name: `S${i}`, doc: benchStackDocument(40, true) }));
  const building = time(() => analyseBuilding(stacks, levels, {}), 15);
  console.log(
    `analyseBuilding, 400 stacks of 40 storeys: median ${building.wall.toFixed(1)} ms wall, ${building.cpu.toFixed(1)} ms CPU (target < 200 ms)`,
  );
  // As the server calls the engine: documents read back through stackDocumentSchema need no second shape check.
  const parsed = time(() => analyseBuilding(stacks, levels, {}, { shapeChecked: true }), 15);
  console.log(
    `analyseBuilding, same, documents already parsed (the server's case): median ${parsed.wall.toFixed(1)} ms wall, ${parsed.cpu.toFixed(1)} ms CPU (target < 200 ms)`,
  );
}
