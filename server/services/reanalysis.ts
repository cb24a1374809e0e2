// Analysing every stack of a building again under new options. With buckling lengths from the critical
// buckling analysis that is seconds of CPU for a large building, so it is done on the worker thread
// before the options are stored; the transaction then uses those results for every stack whose version
// and analysis inputs did not change meanwhile, and analyses any other stack itself.
import type { AnalysisOptions, StackResult } from '../../shared/schema/results.ts';
import type { ServerContext } from '../context.ts';
import { ENGINE_VERSION } from '../../shared/engine/version.ts';
import { analysisInputs, floorLoadsOf, positionPlaces, withPositions, type AnalysisInputs } from './analysis.ts';
import { parseOptions } from './buildings.ts';
import { parseDoc, placeOf, type StackRow } from './stackRows.ts';

export interface Precomputed {
  /** Levels and sections the results were worked out with. */
  inputsKey: string;
  byStack: Map<number, { version: number; results: StackResult }>;
}

export function inputsKey(inputs: AnalysisInputs): string {
  const options = Object.entries(inputs.options).sort(([a], [b]) => a.localeCompare(b));
  const positions = [...(inputs.positions ?? [])].map(([id, rows]) => [
    id,
    rows.map((r) => [r.id, r.grid_x, r.grid_y]),
  ]);
  return JSON.stringify([[...inputs.levels], [...inputs.sections], options, inputs.model ?? null, positions]);
}

/** Worker-thread results under the new options when they ask for the critical buckling analysis; null otherwise. */
export async function precomputeReanalysis(
  ctx: ServerContext,
  buildingId: number,
  change: Partial<AnalysisOptions> | undefined,
): Promise<Precomputed | null> {
  if (change?.bucklingLengths !== 'critical') return null;
  const row = await ctx.db('buildings').where({ id: buildingId }).first<{ options: string } | undefined>('options');
  if (!row) return null;
  const before = parseOptions(row.options);
  const options = { ...before, ...change };
  if (JSON.stringify(before) === JSON.stringify(options)) return null;
  const rows = await ctx
    .db<StackRow>('stacks')
    .where({ building_id: buildingId })
    .select('id', 'name', 'version', 'doc', 'grid_x', 'grid_y', 'web_along');
  const inputs = { ...(await analysisInputs(ctx.db, buildingId)), options };
  const docs = new Map(rows.map((r) => [r.id, parseDoc(r.doc)]));
  // A typical column's further positions go to the worker too, as stacks of their own under the negated position id.
  const further = rows.flatMap((r) =>
    positionPlaces(inputs, placeOf(r)).map((p) => ({
      id: -p.positionId,
      name: `${r.name} at ${p.name}`,
      doc: docs.get(r.id)!,
      floorLoads: floorLoadsOf(inputs, p.place),
    })),
  );
  const analysed = await ctx.offThread.analyseBuilding(
    {
      stacks: [
        ...rows.map((r) => ({
          id: r.id,
          name: r.name,
          doc: docs.get(r.id)!,
          floorLoads: floorLoadsOf(inputs, placeOf(r)),
        })),
        ...further,
      ],
      options,
      levels: inputs.levels,
      sections: inputs.sections,
    },
    `building:${buildingId}`,
  );
  const results = new Map(
    analysed.map((a) => [a.id, { ...(JSON.parse(a.resultJson) as StackResult), engineVersion: ENGINE_VERSION }]),
  );
  const byStack = new Map(
    rows.map((r) => {
      const worked = new Map(
        positionPlaces(inputs, placeOf(r)).map((p) => [p.positionId, results.get(-p.positionId)!]),
      );
      const own = withPositions(results.get(r.id)!, docs.get(r.id)!, inputs, placeOf(r), worked);
      return [r.id, { version: r.version, results: own }];
    }),
  );
  return { inputsKey: inputsKey(inputs), byStack };
}

/** The precomputed result for a stack row, if it still holds for it. */
export function precomputedFor(
  pre: Precomputed | null,
  inputs: AnalysisInputs,
  stack: StackRow,
): StackResult | undefined {
  if (!pre || pre.inputsKey !== inputsKey(inputs)) return undefined;
  const found = pre.byStack.get(stack.id);
  return found && found.version === stack.version ? found.results : undefined;
}
