// Editing the building model (docs/building-model.md): the grid, build-ups, a level's floor load, the area
// overrides of a stack or of one of its further positions (docs/typical-columns.md) and its place on the grid.
// Each write is one transaction that stores the model and re-analyses every stack whose derived loads it can
// change; the live rooms hear after commit.
import type { Knex } from 'knex';
import type { User } from '../../shared/schema/api.ts';
import {
  gridRef,
  positionOverridesKey,
  type AreaOverride,
  type Buildup,
  type BuildingModel,
  type BuildingModelReply,
  type Grid,
  type Placement,
  type StackPlacement,
} from '../../shared/schema/building.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import type { ServerContext } from '../context.ts';
import { now } from '../db.ts';
import { conflict, notFound, unprocessable } from '../errors.ts';
import { analysisInputs } from './analysis.ts';
import { recordAudit } from './audit.ts';
import { readModel, writeModel } from './buildingModelStore.ts';
import { broadcastChanges, commitDoc, type CommittedChange } from './stackOps.ts';
import { loadStackRow, type StackRow } from './stackRows.ts';
import { storeReanalyses } from './storeReanalyses.ts';

export async function getModel(db: Knex, buildingId: number): Promise<BuildingModelReply> {
  const { model, version } = await readModel(db, buildingId);
  return { ...model, version };
}

/** Stored documents were validated on the way in; the hot path of a building-wide change reads them as they are. */
const storedDoc = (row: Pick<StackRow, 'doc'>): StackDocument => JSON.parse(row.doc) as StackDocument;

/** What re-analysing and placing need of a stack row: never its stored results, which are large. */
const ROW_COLUMNS = ['id', 'building_id', 'name', 'doc', 'version'] as const;
const GRID_COLUMNS = ['grid_x', 'grid_y', 'web_along'] as const;
type ModelRow = Pick<StackRow, (typeof ROW_COLUMNS)[number] | (typeof GRID_COLUMNS)[number]>;
const PLACE_COLUMNS = ['id', 'name', 'grid_x', 'grid_y', 'web_along'] as const;
type PlaceRow = Pick<StackRow, (typeof PLACE_COLUMNS)[number]>;

const onGrid = (row: Pick<StackRow, 'grid_x' | 'grid_y'>) => row.grid_x !== null && row.grid_y !== null;

/** A stack uses a level when a restraint, its cap or support sits on it; found in the stored text, no parse needed. */
const usesLevel = (row: Pick<StackRow, 'doc'>, levelId: string) =>
  row.doc.includes(`"levelId":${JSON.stringify(levelId)}`);

export interface ModelChange {
  version: number;
  model: BuildingModel;
  changes: CommittedChange[];
  placements?: Placement[];
}

async function reanalyse(
  trx: Knex,
  buildingId: number,
  rows: ModelRow[],
  userId: number,
  action: string,
): Promise<CommittedChange[]> {
  if (rows.length === 0) return [];
  return storeReanalyses(trx, rows, await analysisInputs(trx, buildingId), { userId, action });
}

/** After commit: the model to the building room, then each re-analysed stack as for any edit. */
export function broadcastModelChange(ctx: ServerContext, buildingId: number, change: ModelChange, user: User): void {
  const by = { userId: user.id, name: user.name };
  try {
    ctx.broadcaster.buildingModelChanged({
      buildingId,
      version: change.version,
      model: change.model,
      by,
      ...(change.placements ? { placements: change.placements } : {}),
    });
  } catch (e) {
    // The change is committed; a failed notification must not turn it into an error reply.
    console.error(`broadcast of building ${buildingId} model v${change.version} failed`, e);
  }
  broadcastChanges(ctx, change.changes, by);
}

/** Stores `next` over the model read at `version`, with an audit row, and re-analyses the stacks `affected` picks. */
async function storeAndReanalyse(
  trx: Knex,
  buildingId: number,
  next: BuildingModel,
  version: number,
  user: User,
  action: string,
  affected: (row: ModelRow) => boolean,
  detail: Record<string, unknown>,
): Promise<ModelChange> {
  const stored = await writeModel(trx, buildingId, next, version);
  await recordAudit(trx, { userId: user.id, buildingId, action, version: stored, detail });
  return {
    version: stored,
    model: next,
    changes: await reanalyse(trx, buildingId, await modelRows(trx, buildingId, affected), user.id, action),
  };
}

/**
 * The building's stacks that `affected` picks, with their place on the grid read from its own index
 * (migrations/202612031420_add_stack_place_index.ts): on SQLite the row's place lies after its large results.
 */
async function modelRows(trx: Knex, buildingId: number, affected: (row: ModelRow) => boolean): Promise<ModelRow[]> {
  const stacks = trx<StackRow>('stacks').where({ building_id: buildingId });
  const rows = await stacks
    .clone()
    .orderBy('id')
    .select<Omit<ModelRow, (typeof GRID_COLUMNS)[number]>[]>(...ROW_COLUMNS);
  const places = new Map(
    (await stacks.clone().select<Pick<StackRow, 'id' | (typeof GRID_COLUMNS)[number]>[]>('id', ...GRID_COLUMNS)).map(
      ({ id, ...place }) => [id, place],
    ),
  );
  return rows.map((r) => ({ ...r, grid_x: null, grid_y: null, web_along: null, ...places.get(r.id) })).filter(affected);
}

const toPlacement = (r: PlaceRow): Placement => ({
  id: r.id,
  name: r.name,
  gridX: r.grid_x,
  gridY: r.grid_y,
  webAlong: r.web_along === 'y' ? 'y' : 'x',
});

export async function putGrid(
  ctx: ServerContext,
  buildingId: number,
  grid: Grid,
  user: User,
): Promise<BuildingModelReply> {
  const change = await ctx.db.transaction(async (trx) => {
    const { model, version } = await readModel(trx, buildingId, { lock: true });
    const stacks = await trx<StackRow>('stacks')
      .where({ building_id: buildingId })
      .orderBy('id')
      .select<PlaceRow[]>(...PLACE_COLUMNS);
    const placed = stacks.filter(onGrid);
    const lost = placed.filter((s) => gridRef(grid, s.grid_x!, s.grid_y!) === null);
    const lostPositions = (
      await trx('stack_positions').where({ building_id: buildingId }).select('grid_x', 'grid_y')
    ).filter((p: { grid_x: string; grid_y: string }) => gridRef(grid, p.grid_x, p.grid_y) === null);
    if (lostPositions.length)
      throw conflict('Typical columns stand on grid lines this grid no longer has; remove those positions first');
    if (lost.length) {
      throw conflict(
        `Stacks ${lost.map((s) => s.name).join(', ')} stand on grid lines this grid no longer has; take them off the grid first`,
        { stacks: lost.map((s) => s.id) },
      );
    }
    const ids = new Set([...grid.x.lines, ...grid.y.lines].map((l) => l.id));
    const orphan = model.floors.flatMap((f) => f.lines).find((l) => !ids.has(l.gridLineId));
    if (orphan)
      throw conflict(`The line load "${orphan.label}" is on a grid line this grid no longer has; remove it first`, {
        gridLineId: orphan.gridLineId,
      });
    // A stack on the grid is named by its lines, so renaming a line renames its stacks.
    const names = new Map(stacks.map((s) => [s.id, s.name]));
    for (const s of placed) names.set(s.id, gridRef(grid, s.grid_x!, s.grid_y!)!);
    const seen = new Map<string, number>();
    for (const [id, name] of names) {
      const other = seen.get(name.toLowerCase());
      if (other !== undefined)
        throw conflict(`Two stacks would be called ${name}; rename one before renaming the grid lines`, {
          stacks: [other, id],
        });
      seen.set(name.toLowerCase(), id);
    }
    for (const s of placed) {
      const name = names.get(s.id)!;
      if (name !== s.name) {
        await trx('stacks').where({ id: s.id }).update({ name, updated_at: now() });
        s.name = name;
      }
    }
    const next: BuildingModel = { ...model, grid };
    const result = await storeAndReanalyse(trx, buildingId, next, version, user, 'building.grid', onGrid, {
      x: grid.x.lines.length,
      y: grid.y.lines.length,
    });
    return { ...result, placements: stacks.map(toPlacement) };
  });
  broadcastModelChange(ctx, buildingId, change, user);
  return { ...change.model, version: change.version };
}

export async function putBuildups(
  ctx: ServerContext,
  buildingId: number,
  buildups: Buildup[],
  user: User,
): Promise<BuildingModelReply> {
  const change = await ctx.db.transaction(async (trx) => {
    const { model, version } = await readModel(trx, buildingId, { lock: true });
    const ids = new Set(buildups.map((b) => b.id));
    const orphan = model.floors.find((f) => !ids.has(f.buildupId));
    if (orphan)
      throw conflict(
        `Build-up ${orphan.buildupId} is used by a level's floor load; give that level another build-up first`,
        { levelId: orphan.levelId },
      );
    const changed = new Set(
      buildups
        .filter((b) => JSON.stringify(b) !== JSON.stringify(model.buildups.find((o) => o.id === b.id)))
        .map((b) => b.id),
    );
    const levels = model.floors.filter((f) => changed.has(f.buildupId)).map((f) => f.levelId);
    const affected = (row: ModelRow) => onGrid(row) && levels.some((l) => usesLevel(row, l));
    return storeAndReanalyse(trx, buildingId, { ...model, buildups }, version, user, 'building.buildups', affected, {
      buildups: buildups.length,
    });
  });
  broadcastModelChange(ctx, buildingId, change, user);
  return { ...change.model, version: change.version };
}

export interface FloorLoadInput {
  buildupId: string | null;
  span: BuildingModel['floors'][number]['span'];
  lines: BuildingModel['floors'][number]['lines'];
}

function assertEdgeLines(grid: Grid, lines: FloorLoadInput['lines']): void {
  for (const line of lines) {
    const dir = grid.x.lines.some((l) => l.id === line.gridLineId)
      ? grid.x
      : grid.y.lines.some((l) => l.id === line.gridLineId)
        ? grid.y
        : null;
    if (!dir)
      throw unprocessable(
        `The line load "${line.label}" names grid line ${line.gridLineId}, which the grid does not have`,
        { gridLineId: line.gridLineId },
      );
    const positions = dir.lines.map((l) => l.position);
    const own = dir.lines.find((l) => l.id === line.gridLineId)!.position;
    if (own !== Math.min(...positions) && own !== Math.max(...positions)) {
      throw unprocessable(
        `The line load "${line.label}" must be on an edge grid line (the first or last of its direction)`,
        { gridLineId: line.gridLineId },
      );
    }
  }
}

/** A level's floor load; `buildupId: null` takes it away (stacks on that level keep their typed loads again). */
export async function putFloorLoad(
  ctx: ServerContext,
  buildingId: number,
  levelId: number,
  input: FloorLoadInput,
  user: User,
): Promise<BuildingModelReply> {
  const key = String(levelId);
  const change = await ctx.db.transaction(async (trx) => {
    const level = await trx('levels').where({ id: levelId, building_id: buildingId }).first('id');
    if (!level) throw notFound('Level');
    const { model, version } = await readModel(trx, buildingId, { lock: true });
    const others = model.floors.filter((f) => f.levelId !== key);
    let floors = others;
    if (input.buildupId !== null) {
      if (!model.buildups.some((b) => b.id === input.buildupId))
        throw unprocessable(`The building has no build-up ${input.buildupId}`, { buildupId: input.buildupId });
      assertEdgeLines(model.grid, input.lines);
      floors = [...others, { levelId: key, buildupId: input.buildupId, span: input.span, lines: input.lines }];
    }
    const affected = (row: ModelRow) => onGrid(row) && usesLevel(row, key);
    return storeAndReanalyse(trx, buildingId, { ...model, floors }, version, user, 'level.floor-load', affected, {
      levelId,
      ...input,
    });
  });
  broadcastModelChange(ctx, buildingId, change, user);
  return { ...change.model, version: change.version };
}

/**
 * Areas set by hand for a stack's own place or, given `positionId`, for that further position of the stack
 * (stored under `positionOverridesKey`, docs/typical-columns.md); an empty list takes them away. One transaction
 * stores the model and re-analyses the stack, whose results hold every position's check.
 */
export async function putAreaOverrides(
  ctx: ServerContext,
  stackId: number,
  overrides: AreaOverride[],
  user: User,
  positionId?: number,
): Promise<BuildingModelReply> {
  const row = await loadStackRow(ctx.db, stackId);
  const buildingId = row.building_id;
  const levelIds = new Set(
    (await ctx.db('levels').where({ building_id: buildingId }).select<{ id: number }[]>('id')).map((l) => String(l.id)),
  );
  const seen = new Set<string>();
  for (const o of overrides) {
    if (!levelIds.has(o.levelId)) throw unprocessable(`The building has no level ${o.levelId}`, { levelId: o.levelId });
    if (seen.has(o.levelId))
      throw unprocessable(`Level ${o.levelId} has two areas set by hand; give one`, { levelId: o.levelId });
    seen.add(o.levelId);
  }
  const change = await ctx.db.transaction(async (trx) => {
    const { model, version } = await readModel(trx, buildingId, { lock: true });
    if (
      positionId !== undefined &&
      !(await trx('stack_positions').where({ id: positionId, stack_id: stackId }).first('id'))
    )
      throw notFound('Position');
    const key = positionId === undefined ? String(stackId) : positionOverridesKey(positionId);
    const byKey = { ...model.overrides };
    if (overrides.length) byKey[key] = overrides;
    else delete byKey[key];
    return storeAndReanalyse(
      trx,
      buildingId,
      { ...model, overrides: byKey },
      version,
      user,
      'stack.area-overrides',
      (r) => r.id === stackId,
      { stackId, ...(positionId === undefined ? {} : { positionId }), overrides: overrides.length },
    );
  });
  broadcastModelChange(ctx, buildingId, change, user);
  return { ...change.model, version: change.version };
}

/**
 * Takes the areas set by hand under `keys` (a removed stack's own and its positions', or one removed position's)
 * out of the model read (locked) in the caller's transaction, with an audit row; the change to broadcast after
 * commit, or null when none of the keys had areas. No stack is re-analysed: no remaining place reads these keys.
 */
export async function dropOverrides(
  trx: Knex,
  buildingId: number,
  read: { model: BuildingModel; version: number },
  keys: readonly string[],
  user: User,
  detail: Record<string, unknown>,
): Promise<ModelChange | null> {
  if (!keys.some((k) => k in read.model.overrides)) return null;
  const overrides = Object.fromEntries(Object.entries(read.model.overrides).filter(([k]) => !keys.includes(k)));
  const next: BuildingModel = { ...read.model, overrides };
  const version = await writeModel(trx, buildingId, next, read.version);
  await recordAudit(trx, { userId: user.id, buildingId, action: 'stack.area-overrides', version, detail });
  return { version, model: next, changes: [] };
}

/** Puts a stack on a crossing of the grid (named after its lines) or takes it off (it keeps its name). */
export async function placeStack(
  ctx: ServerContext,
  stackId: number,
  placement: StackPlacement,
  user: User,
): Promise<Placement> {
  const change = await ctx.db.transaction(async (trx) => {
    const row = await loadStackRow(trx, stackId, { lock: true });
    const buildingId = row.building_id;
    const { model, version } = await readModel(trx, buildingId);
    let name = row.name;
    if (placement.gridX === null && (await trx('stack_positions').where({ stack_id: stackId }).first('id')))
      throw conflict(
        'The stack stands at further positions as a typical column; remove them before taking it off the grid',
      );
    if (placement.gridX !== null && placement.gridY !== null) {
      if (!model.grid.x.lines.some((l) => l.id === placement.gridX))
        throw unprocessable(`The grid has no x line ${placement.gridX}`, { gridX: placement.gridX });
      if (!model.grid.y.lines.some((l) => l.id === placement.gridY))
        throw unprocessable(`The grid has no y line ${placement.gridY}`, { gridY: placement.gridY });
      const taken = await trx('stacks')
        .where({ building_id: buildingId, grid_x: placement.gridX, grid_y: placement.gridY })
        .whereNot({ id: stackId })
        .first<{ name: string } | undefined>('name');
      if (taken) throw conflict(`Stack ${taken.name} already stands there`);
      const typical = await trx('stack_positions')
        .where({ building_id: buildingId, grid_x: placement.gridX, grid_y: placement.gridY })
        .first('id');
      if (typical) throw conflict('A typical column already stands there; remove that position first');
      name = gridRef(model.grid, placement.gridX, placement.gridY)!;
      const clash = await trx('stacks')
        .where({ building_id: buildingId })
        .whereNot({ id: stackId })
        .whereRaw('lower(name) = ?', [name.toLowerCase()])
        .first<{ id: number } | undefined>('id');
      if (clash)
        throw conflict(`This building already has a stack called "${name}"; rename it first`, { id: clash.id });
    }
    const columns = { grid_x: placement.gridX, grid_y: placement.gridY, web_along: placement.webAlong, name };
    await trx('stacks')
      .where({ id: stackId })
      .update({ ...columns, updated_at: now() });
    const placed = { ...row, ...columns };
    const inputs = await analysisInputs(trx, buildingId);
    const committed = await commitDoc(
      trx,
      placed,
      { doc: storedDoc(placed), ops: [], touched: new Set(), userId: user.id, action: 'stack.place' },
      inputs,
    );
    const placements = (
      await trx<StackRow>('stacks')
        .where({ building_id: buildingId })
        .orderBy('id')
        .select<PlaceRow[]>(...PLACE_COLUMNS)
    ).map(toPlacement);
    return { version, model, changes: [committed], placements, placement: toPlacement(placed), buildingId };
  });
  broadcastModelChange(ctx, change.buildingId, change, user);
  return change.placement;
}
