// The level-loads template (docs/contracts.md §Imports): one row per stack and level that has exactly one restraint or
// cap there, filled with the loads it carries now, so a download re-imports unchanged.
import type { Knex } from 'knex';
import { LOAD_COLUMNS } from '../../shared/schema/imports.ts';
import { toCsv, type Cell } from './exportsFormats.ts';
import { buildingLevels, buildingStacks, floorLoadOf, nodesAtLevel } from './importsLoadTargets.ts';

export async function loadsTemplateCsv(db: Knex, buildingId: number): Promise<string> {
  const [stacks, levels] = await Promise.all([buildingStacks(db, buildingId), buildingLevels(db, buildingId)]);
  stacks.sort(
    (a, b) => a.row.name.localeCompare(b.row.name, 'en', { numeric: true, sensitivity: 'base' }) || a.row.id - b.row.id,
  );
  const rows: Record<string, Cell>[] = [];
  for (const stack of stacks) {
    for (const level of levels) {
      const nodes = nodesAtLevel(stack.doc, level, levels);
      if (nodes.length !== 1) continue;
      const load = floorLoadOf(nodes[0]!);
      // String(n) is the shortest text that reads back as the same number, so the round trip is exact.
      rows.push({
        stack: stack.row.name,
        level: level.name,
        Gk_kN: String(load.Gk),
        Qk_kN: String(load.Qk),
        category: load.category,
      });
    }
  }
  return toCsv(LOAD_COLUMNS, rows);
}
