// The grid and the levels' floor loads as CSV (docs/building-model.md): out as they stand, in with a preview
// that lists every row and every problem by line, then applied through the ordinary model writes (which
// re-analyse the stacks they affect). Lines and build-ups are matched by name, in any letter case.
import type { Knex } from 'knex';
import type { User } from '../../shared/schema/api.ts';
import { gridSchema, type BuildingModel, type FloorLoad, type Grid } from '../../shared/schema/building.ts';
import {
  FLOOR_LOAD_COLUMNS,
  GRID_COLUMNS,
  type FloorLoadsPreview,
  type GridPreview,
  type ImportProblem,
} from '../../shared/schema/imports.ts';
import type { ServerContext } from '../context.ts';
import { conflict, unprocessable } from '../errors.ts';
import { putFloorLoad, putGrid } from './buildingModel.ts';
import { readModel } from './buildingModelStore.ts';
import { toCsv } from './exportsFormats.ts';
import { fileHash, numberCell, readCsv } from './importsCsv.ts';
import { problemsMessage } from './importsApply.ts';
import { listLevels } from './levels.ts';

const lower = (s: string) => s.trim().toLowerCase();

export async function gridCsv(db: Knex, buildingId: number): Promise<string> {
  const { grid } = (await readModel(db, buildingId)).model;
  const rows = (['x', 'y'] as const).flatMap((direction) =>
    [...grid[direction].lines]
      .sort((a, b) => a.position - b.position)
      .map((l) => ({ direction, name: l.name, position_m: l.position })),
  );
  return toCsv(GRID_COLUMNS, rows);
}

export async function floorLoadsCsv(db: Knex, buildingId: number): Promise<string> {
  const [{ model }, levels] = await Promise.all([readModel(db, buildingId), listLevels(db, buildingId)]);
  const rows = levels.map((level) => {
    const floor = model.floors.find((f) => f.levelId === level.id);
    const buildup = floor ? model.buildups.find((b) => b.id === floor.buildupId) : undefined;
    return { level: level.name, buildup: buildup?.name ?? '', span: floor?.span ?? '' };
  });
  return toCsv(FLOOR_LOAD_COLUMNS, rows);
}

/** The grid the file gives: lines keep their ids when a line of that name and direction exists; edges are kept. */
export async function previewGrid(db: Knex, buildingId: number, file: Buffer): Promise<GridPreview> {
  const hash = fileHash(file);
  const read = await readCsv(file, GRID_COLUMNS);
  if (!read.ok) return { fileHash: hash, grid: null, rows: [], problems: read.problems };
  const { grid: current } = (await readModel(db, buildingId)).model;
  const problems: ImportProblem[] = [];
  const next: Grid = { x: { ...current.x, lines: [] }, y: { ...current.y, lines: [] } };
  const rows: GridPreview['rows'] = [];
  const ids = new Set([...current.x.lines, ...current.y.lines].map((l) => l.id));
  let fresh = 1;
  for (const row of read.rows) {
    const direction = lower(row.cells.direction ?? '');
    if (direction !== 'x' && direction !== 'y') {
      problems.push({
        row: row.line,
        column: 'direction',
        message: `"${row.cells.direction ?? ''}" is not a direction; use x or y`,
      });
      continue;
    }
    const name = (row.cells.name ?? '').trim();
    if (!name || name.length > 20) {
      problems.push({
        row: row.line,
        column: 'name',
        message: name ? 'name must be at most 20 characters' : 'name is empty',
      });
      continue;
    }
    const position = numberCell(row, 'position_m', 'm', -10_000, 10_000, problems);
    if (position === null) continue;
    const lines = next[direction].lines;
    if (lines.some((l) => lower(l.name) === lower(name))) {
      problems.push({ row: row.line, column: 'name', message: `${name} names two ${direction} lines` });
      continue;
    }
    if (lines.some((l) => Math.abs(l.position - position) < 0.001)) {
      problems.push({
        row: row.line,
        column: 'position_m',
        message: `${name} is at the position of another ${direction} line`,
      });
      continue;
    }
    const existing = current[direction].lines.find((l) => lower(l.name) === lower(name));
    let id = existing?.id;
    if (!id) {
      while (ids.has(`${direction}${fresh}`)) fresh += 1;
      id = `${direction}${fresh}`;
      ids.add(id);
    }
    lines.push({ id, name, position });
    rows.push({
      row: row.line,
      direction,
      name,
      position,
      change: !existing ? 'new' : existing.position === position ? 'same' : 'moved',
    });
  }
  const valid = problems.length === 0 && gridSchema.safeParse(next).success;
  return { fileHash: hash, grid: valid ? next : null, rows, problems };
}

export async function applyGrid(
  ctx: ServerContext,
  buildingId: number,
  file: Buffer,
  hash: string | undefined,
  user: User,
): Promise<BuildingModel> {
  const preview = await previewGrid(ctx.db, buildingId, file);
  if (preview.problems.length > 0 || !preview.grid)
    throw unprocessable(problemsMessage(preview.problems.length), preview);
  if (hash && hash !== preview.fileHash) throw conflict('The file is not the one previewed; preview it again');
  const { version: _version, ...model } = await putGrid(ctx, buildingId, preview.grid, user);
  return model;
}

/** Each row: a level by name, a build-up by name (empty: no floor load), and how the floor spans. */
export async function previewFloorLoads(db: Knex, buildingId: number, file: Buffer): Promise<FloorLoadsPreview> {
  const hash = fileHash(file);
  const read = await readCsv(file, FLOOR_LOAD_COLUMNS, ['level', 'buildup']);
  if (!read.ok) return { fileHash: hash, rows: [], problems: read.problems };
  const [{ model }, levels] = await Promise.all([readModel(db, buildingId), listLevels(db, buildingId)]);
  const problems: ImportProblem[] = [];
  const rows: FloorLoadsPreview['rows'] = [];
  const seen = new Set<string>();
  for (const row of read.rows) {
    const level = levels.find((l) => lower(l.name) === lower(row.cells.level ?? ''));
    if (!level) {
      problems.push({
        row: row.line,
        column: 'level',
        message: `The building has no level "${row.cells.level ?? ''}"`,
      });
      continue;
    }
    if (seen.has(level.id)) {
      problems.push({ row: row.line, column: 'level', message: `Level ${level.name} is given twice` });
      continue;
    }
    seen.add(level.id);
    const name = (row.cells.buildup ?? '').trim();
    const buildup = name ? model.buildups.find((b) => lower(b.name) === lower(name)) : undefined;
    if (name && !buildup) {
      problems.push({ row: row.line, column: 'buildup', message: `The building has no build-up "${name}"` });
      continue;
    }
    const spanText = lower(row.cells.span ?? '') || 'two-way';
    if (spanText !== 'two-way' && spanText !== 'x' && spanText !== 'y') {
      problems.push({
        row: row.line,
        column: 'span',
        message: `"${row.cells.span}" is not a span; use two-way, x or y`,
      });
      continue;
    }
    const before = model.floors.find((f) => f.levelId === level.id);
    const after = buildup?.id ?? null;
    const same = (before?.buildupId ?? null) === after && (after === null || before?.span === spanText);
    rows.push({
      row: row.line,
      levelId: level.id,
      level: level.name,
      buildupId: after,
      buildup: buildup?.name ?? null,
      span: spanText,
      change: same ? 'same' : 'changed',
    });
  }
  return { fileHash: hash, rows, problems };
}

export async function applyFloorLoads(
  ctx: ServerContext,
  buildingId: number,
  file: Buffer,
  hash: string | undefined,
  user: User,
): Promise<{ applied: number }> {
  const preview = await previewFloorLoads(ctx.db, buildingId, file);
  if (preview.problems.length > 0) throw unprocessable(problemsMessage(preview.problems.length), preview);
  if (hash && hash !== preview.fileHash) throw conflict('The file is not the one previewed; preview it again');
  const { model } = await readModel(ctx.db, buildingId);
  let applied = 0;
  for (const row of preview.rows) {
    if (row.change === 'same') continue;
    // Line loads on the level are kept when it keeps a floor load.
    const lines: FloorLoad['lines'] = model.floors.find((f) => f.levelId === row.levelId)?.lines ?? [];
    await putFloorLoad(
      ctx,
      buildingId,
      Number(row.levelId),
      { buildupId: row.buildupId, span: row.span, lines: row.buildupId === null ? [] : lines },
      user,
    );
    applied += 1;
  }
  return { applied };
}
