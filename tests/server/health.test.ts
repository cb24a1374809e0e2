import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { clientBuildNeeded, clientStep, viteScript } from '../../scripts/start.ts';
import { DEMO_BUILDING, DEMO_PASSWORD, DEMO_STACKS, seedDemoIfEmpty } from '../../seeds/demo.ts';
import { DEMO_GRID_BUILDING } from '../../seeds/demoGrid.ts';
import type { AuthResponse, BuildingSummary, Level, StackDetail, StackSummary } from '../../shared/schema/api.ts';
import type { BuildingModelReply } from '../../shared/schema/building.ts';
import type { BuildingPositionsReply, StackPositionsReply } from '../../shared/schema/stackPositions.ts';
import { errorCode, onPostgres, signIn, startTestServer, type TestServer } from './helpers.ts';

describe('health and the app shell', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer();
  });
  afterAll(async () => {
    await s?.close();
  });

  it('GET /api/health reports ok, the package version and the database in use', async () => {
    const r = await s.api('GET', '/health');
    expect(r.status).toBe(200);
    const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { version: string };
    expect(r.body).toEqual({ ok: true, version: pkg.version, database: onPostgres ? 'postgres' : 'sqlite' });
  });

  it('answers an unknown /api route with a JSON 404 in the error shape', async () => {
    const r = await s.api('GET', '/no-such-thing');
    expect(r.status).toBe(404);
    expect(errorCode(r.body)).toBe('not_found');
  });

  it('sends security headers from helmet and no x-powered-by', async () => {
    const r = await s.api('GET', '/health');
    expect(r.headers.get('x-content-type-options')).toBe('nosniff');
    expect(r.headers.get('x-powered-by')).toBeNull();
  });

  it('generates the JWT secret once into DATA_DIR with mode 600', () => {
    const st = statSync(join(s.dataDir, 'jwt-secret'));
    expect(st.mode & 0o777).toBe(0o600);
    expect(st.size).toBeGreaterThan(32);
  });

  it.skipIf(onPostgres)('keeps the SQLite file in DATA_DIR with foreign keys on and WAL journalling', async () => {
    expect(statSync(join(s.dataDir, 'stanchion.sqlite')).size).toBeGreaterThan(0);
    const fk = (await s.ctx.db.raw('PRAGMA foreign_keys')) as { foreign_keys: number }[];
    const wal = (await s.ctx.db.raw('PRAGMA journal_mode')) as { journal_mode: string }[];
    expect(fk[0].foreign_keys).toBe(1);
    expect(wal[0].journal_mode).toBe('wal');
  });
});

describe('npm start decides when to rebuild the client', () => {
  const root = mkdtempSync(join(tmpdir(), 'stanchion-start-'));
  const touch = (path: string, when: Date) => {
    mkdirSync(dirname(join(root, path)), { recursive: true });
    writeFileSync(join(root, path), 'x');
    utimesSync(join(root, path), when, when);
  };
  afterAll(() => rmSync(root, { recursive: true, force: true }));

  it('builds when dist/index.html is missing, not when it is newer than every source, and again after a source changes', () => {
    touch('src/main.ts', new Date('2025-01-01T00:00:00Z'));
    touch('shared/engine/x.ts', new Date('2025-01-01T00:00:00Z'));
    touch('index.html', new Date('2025-01-01T00:00:00Z'));
    touch('vite.config.ts', new Date('2025-01-01T00:00:00Z'));
    for (const dir of ['src', 'shared/engine', 'shared', ''])
      utimesSync(join(root, dir), new Date('2025-01-01T00:00:00Z'), new Date('2025-01-01T00:00:00Z'));
    expect(clientBuildNeeded(root)).toBe(true);
    touch('dist/index.html', new Date('2025-01-02T00:00:00Z'));
    expect(clientBuildNeeded(root)).toBe(false);
    touch('shared/engine/x.ts', new Date('2025-01-03T00:00:00Z'));
    expect(clientBuildNeeded(root)).toBe(true);
  });

  it('without Vite (a production install) serves a stale dist/ and stops when there is none', () => {
    expect(viteScript(root)).toBeNull();
    expect(clientStep(root, false)).toBe('serve-stale');
    expect(clientStep(root, true)).toBe('build');
    touch('dist/index.html', new Date('2025-01-04T00:00:00Z'));
    expect(clientStep(root, false)).toBe('serve');
    rmSync(join(root, 'dist'), { recursive: true });
    expect(clientStep(root, false)).toBe('missing');
  });

  it('finds the Vite of a development install', () => {
    const script = viteScript(fileURLToPath(new URL('../..', import.meta.url)));
    expect(script).toMatch(/node_modules\/vite\/bin\/vite\.js$/);
    expect(statSync(script as string).isFile()).toBe(true);
  });
});

describe('serving the built client', () => {
  let s: TestServer;
  const dist = mkdtempSync(join(tmpdir(), 'stanchion-dist-'));
  beforeAll(async () => {
    mkdirSync(join(dist, 'assets'));
    writeFileSync(join(dist, 'index.html'), '<!doctype html><title>client shell</title>');
    writeFileSync(join(dist, 'assets', 'main-abc123.js'), 'console.log(1)');
    s = await startTestServer({ config: { distDir: dist } });
  });
  afterAll(async () => {
    await s?.close();
    rmSync(dist, { recursive: true, force: true });
  });

  it('answers a client route with index.html, not cached', async () => {
    const res = await fetch(`${s.url}/buildings/12/stacks/3`);
    expect(res.status).toBe(200);
    expect(await res.text()).toContain('client shell');
    expect(res.headers.get('cache-control')).toBe('no-cache');
  });

  it('serves hashed assets with a one-year immutable cache', async () => {
    const res = await fetch(`${s.url}/assets/main-abc123.js`);
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
  });

  it('still answers unknown /api routes with JSON, never the client shell', async () => {
    const r = await s.api('GET', '/buildings/1/nothing-here');
    expect(r.status).toBe(404);
    expect(errorCode(r.body)).toBe('not_found');
  });
});

describe('first start with the demo seed', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer({ seed: true });
  });
  afterAll(async () => {
    await s?.close();
  });

  const leadToken = async () => (await signIn(s, 'lead@stanchion.test', DEMO_PASSWORD)).token;
  const demoBuilding = async (token: string, name: string) =>
    ((await s.api('GET', '/buildings', { token })).body as BuildingSummary[]).find((b) => b.name === name)!;

  it('lets each demo account sign in with the demo password and see both demo buildings with its role', async () => {
    for (const [email, role] of [
      ['lead@stanchion.test', 'lead'],
      ['engineer@stanchion.test', 'engineer'],
      ['viewer@stanchion.test', 'viewer'],
      ['admin@stanchion.test', 'viewer'],
    ]) {
      const login = await s.api('POST', '/auth/login', { body: { email, password: DEMO_PASSWORD } });
      expect(login.status).toBe(200);
      const { token, user } = login.body as AuthResponse;
      expect(user.isAdmin).toBe(email.startsWith('admin'));
      const list = (await s.api('GET', '/buildings', { token })).body as BuildingSummary[];
      expect(list.map((b) => [b.name, b.role])).toEqual([
        [DEMO_BUILDING.name, role],
        [DEMO_GRID_BUILDING.name, role],
      ]);
    }
  });

  it('seeds 6–10 levels and stacks whose documents analyse without errors and pass', async () => {
    const token = await leadToken();
    const building = await demoBuilding(token, DEMO_BUILDING.name);
    const levels = (await s.api('GET', `/buildings/${building.id}/levels`, { token })).body as unknown[];
    expect(levels.length).toBeGreaterThanOrEqual(6);
    expect(levels.length).toBeLessThanOrEqual(10);
    const stacks = (await s.api('GET', `/buildings/${building.id}/stacks`, { token })).body as StackSummary[];
    expect(stacks.map((x) => x.name).sort()).toEqual(DEMO_STACKS.map((x) => x.name).sort());
    for (const st of stacks) {
      expect(st.status).toBe('passes');
      expect(st.utilisation).toBeGreaterThan(0.2);
    }
  });

  // The second demo building (seeds/demoGrid.ts). Its figures are invented demo data: grid lines A–D at 0, 7.5, 15
  // and 22.5 m along x, 1–4 at 0, 6, 12 and 18 m along y, the slab 0.3 m beyond the outer lines; the office floor
  // gk 2.8 + 1.2 + 0.5 = 4.5 kN/m², qk 2.5 + 1.0 partitions = 3.5 kN/m² (B); the roof gk 2.8 + 0.7 + 0.5 = 4.0 kN/m²,
  // qk 0.6 kN/m² (H).
  const OFFICE = { gk: 4.5, qk: 3.5 };
  const ROOF = { gk: 4, qk: 0.6 };
  /**
   * Tributary areas by hand (m²): half the bay each side, the slab edge beyond an outer line.
   * Corner A/1 (0.3 + 3.75)(0.3 + 3) = 4.05 × 3.3 = 13.365; edge B/1 (3.75 + 3.75)(0.3 + 3) = 7.5 × 3.3 = 24.75;
   * edge A/2 (0.3 + 3.75)(3 + 3) = 4.05 × 6 = 24.3; internal B/2 (3.75 + 3.75)(3 + 3) = 7.5 × 6 = 45.
   */
  const AREA: Record<string, number> = { 'A/1': 13.365, 'B/1': 24.75, 'A/2': 24.3, 'B/2': 45 };
  /** Each stack at its own crossing first, then at the three alike to it (typical columns). */
  const ALIKE: Record<string, string[]> = {
    'A/1': ['A/1', 'D/1', 'A/4', 'D/4'],
    'B/1': ['B/1', 'C/1', 'B/4', 'C/4'],
    'A/2': ['A/2', 'A/3', 'D/2', 'D/3'],
    'B/2': ['B/2', 'C/2', 'B/3', 'C/3'],
  };
  const gridBuilding = async (token: string) => {
    const building = await demoBuilding(token, DEMO_GRID_BUILDING.name);
    const get = async <T>(path: string) => (await s.api('GET', path, { token })).body as T;
    const stacks = await get<StackSummary[]>(`/buildings/${building.id}/stacks`);
    return { building, get, stacks, byName: (name: string) => stacks.find((st) => st.name === name)! };
  };

  it('seeds a second building with a grid, two build-ups and a floor load on every level above the ground', async () => {
    const token = await leadToken();
    const { building, get } = await gridBuilding(token);
    const model = await get<BuildingModelReply>(`/buildings/${building.id}/model`);
    expect(model.grid.x.lines.map((l) => [l.name, l.position])).toEqual([
      ['A', 0],
      ['B', 7.5],
      ['C', 15],
      ['D', 22.5],
    ]);
    expect(model.grid.y.lines.map((l) => [l.name, l.position])).toEqual([
      ['1', 0],
      ['2', 6],
      ['3', 12],
      ['4', 18],
    ]);
    expect([model.grid.x.edgeBefore, model.grid.x.edgeAfter, model.grid.y.edgeBefore, model.grid.y.edgeAfter]).toEqual([
      0.3, 0.3, 0.3, 0.3,
    ]);
    const buildup = (name: string) => model.buildups.find((b) => b.name === name)!;
    expect(buildup('Office floor').imposed).toEqual({ qk: 2.5, category: 'B' });
    expect(buildup('Office floor').partitions).toEqual({ load: 1, as: 'imposed' });
    expect(buildup('Roof').imposed).toEqual({ qk: 0.6, category: 'H' });
    const levels = await get<Level[]>(`/buildings/${building.id}/levels`);
    const floorOf = (level: Level) => {
      const floor = model.floors.find((f) => f.levelId === level.id);
      return floor ? model.buildups.find((b) => b.id === floor.buildupId)?.name : 'none';
    };
    expect(levels.map((l) => [l.name, l.elevation, floorOf(l)])).toEqual([
      ['Ground', 0, 'none'],
      ['Level 1', 4, 'Office floor'],
      ['Level 2', 8, 'Office floor'],
      ['Level 3', 12, 'Office floor'],
      ['Level 4', 16, 'Office floor'],
      ['Level 5', 20, 'Office floor'],
      ['Roof', 24, 'Roof'],
    ]);
  });

  it("places the second building's stacks on the grid, their restraints and cap loaded from their tributary areas", async () => {
    const token = await leadToken();
    const { get, stacks, byName } = await gridBuilding(token);
    expect(stacks.map((st) => [st.name, st.gridX, st.gridY])).toEqual([
      ['A/1', 'A', '1'],
      ['A/2', 'A', '2'],
      ['B/1', 'B', '1'],
      ['B/2', 'B', '2'],
    ]);
    for (const st of stacks) {
      const { doc, results } = await get<StackDetail>(`/stacks/${st.id}`);
      const area = AREA[st.name];
      const uses = results.floorLoads ?? [];
      // Five office floors on restraints, the roof on the cap.
      expect(uses.map((u) => u.nodeId).sort()).toEqual([
        'cap',
        'restraint-1',
        'restraint-2',
        'restraint-3',
        'restraint-4',
        'restraint-5',
      ]);
      for (const use of uses) {
        const load = use.nodeId === 'cap' ? ROOF : OFFICE;
        expect(use.area, `${st.name} ${use.nodeId}`).toBeCloseTo(area, 9);
        expect(use.Gk, `${st.name} ${use.nodeId}`).toBeCloseTo(load.gk * area, 9);
        expect(use.Qk, `${st.name} ${use.nodeId}`).toBeCloseTo(load.qk * area, 9);
        expect(use.byHand).toBe(false);
      }
      // The documents type no loads: what the take-down carries came from the floors.
      for (const node of doc.nodes)
        if (node.kind === 'restraint' || node.kind === 'cap') expect([node.data.Gk, node.data.Qk]).toEqual([0, 0]);
    }
    // Corner A/1 at Level 1: Gk = 4.5 × 13.365 = 60.1425 kN, Qk = 3.5 × 13.365 = 46.7775 kN.
    const corner = await get<StackDetail>(`/stacks/${byName('A/1').id}`);
    const level1 = corner.results.takeDown.find((t) => t.elevation === 4)!;
    expect(level1.Gk).toBeCloseTo(60.1425, 9);
    expect(level1.Qk).toBeCloseTo(46.7775, 9);
  });

  it('lists the typical positions of the second building, and every lift passes at every position', async () => {
    const token = await leadToken();
    const { building, get, stacks, byName } = await gridBuilding(token);
    const plan = await get<BuildingPositionsReply>(`/buildings/${building.id}/stack-positions`);
    expect(plan.stacks.map((p) => p.stackId).sort()).toEqual(stacks.map((st) => st.id).sort());
    for (const st of stacks) {
      const { results } = plan.stacks.find((p) => p.stackId === st.id)!;
      expect(results.map((r) => r.name)).toEqual(ALIKE[st.name]);
      for (const position of results) {
        // Six loaded levels (five floors and the roof), each over the same tributary area.
        expect(position.area, position.name).toBeCloseTo(6 * AREA[st.name], 9);
        expect(position.status, position.name).toBe('passes');
        for (const lift of position.lifts) expect(lift.utilisation, `${position.name} ${lift.label}`).toBeLessThan(1);
      }
      expect(st.status).toBe('passes');
      expect(st.utilisation).toBeLessThan(1);
    }
    expect(new Set(plan.stacks.flatMap((p) => p.results.map((r) => r.name))).size).toBe(16);
    // The internal column is well worked, yet clear of its limit.
    expect(byName('B/2').utilisation).toBeGreaterThan(0.6);
    expect(byName('B/2').utilisation).toBeLessThan(0.95);
    const internal = await get<StackPositionsReply>(`/stacks/${byName('B/2').id}/positions`);
    expect(internal.positions.map((p) => p.name)).toEqual(['C/2', 'B/3', 'C/3']);
  });

  it('does not seed again on a second start', async () => {
    expect(await seedDemoIfEmpty(s.ctx.db, 4)).toBe(false);
  });
});
