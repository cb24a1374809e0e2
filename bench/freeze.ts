// Freezing a revision (docs/contracts.md §Revisions): a 40-stack, 30-level building frozen through the API, including
// the calculation package and the e-mail to the team. Target: under 10 s. Baseline in the same run: the
// engine analysing the same 40 stacks once. Run twice: axial loads only, then with beam reactions on
// two faces of every floor (nominal moments, docs/analysis-rules.md §Nominal moments), whose package carries the
// combined-check working for every piece. Demo data, invented.
import { mkdtempSync, rmSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { analyseStack } from '../shared/engine/index.ts';
import { stackFromTemplate } from '../shared/ops/stackFromTemplate.ts';
import type { RevisionDetail } from '../shared/schema/revisions.ts';
import type { RestraintFaces, StackDocument } from '../shared/schema/stack.ts';
import { startServer } from '../server/server.ts';
import { createBuilding } from '../server/services/buildings.ts';
import { createLevel, listLevels } from '../server/services/levels.ts';
import { createStack } from '../server/services/stacks.ts';
import { registerUser } from '../server/services/users.ts';
import { signToken } from '../server/services/tokens.ts';

const STACKS = 40;
const STOREYS = 30;
const STOREY_HEIGHT = 3.6;
/** One section per lift, bottom first: heavier low down so every lift passes (invented sizing). */
const SECTIONS = [
  ...Array<string>(5).fill('UKC 356x406x393'),
  ...Array<string>(3).fill('UKC 356x406x287'),
  ...Array<string>(3).fill('UKC 305x305x198'),
  ...Array<string>(2).fill('UKC 254x254x132'),
  ...Array<string>(2).fill('UKC 203x203x86'),
];

/** Beam reactions on a flange face and the web face of every floor, kN (invented). */
const FACES: RestraintFaces = { yPlus: { Gk: 30, Qk: 15 }, zPlus: { Gk: 10, Qk: 5 } };

const withFaces = (doc: StackDocument, faces: RestraintFaces): StackDocument => ({
  edges: doc.edges,
  nodes: doc.nodes.map((n) => (n.kind === 'restraint' ? { ...n, data: { ...n.data, faces } } : n)),
});

export async function benchFreeze(): Promise<void> {
  await freezeScenario('axial loads only', null);
  await freezeScenario('with beam reactions on two faces of every floor', FACES);
}

async function freezeScenario(label: string, faces: RestraintFaces | null): Promise<void> {
  console.log(`— ${label}`);
  const dataDir = mkdtempSync(join(tmpdir(), 'stanchion-bench-freeze-'));
  const server = await startServer({ port: 0, dataDir, logLevel: 'silent', env: {}, config: { bcryptRounds: 4 } });
  try {
    const { db } = server.ctx;
    const lead = await registerUser(
      db,
      { email: 'lead@bench.test', name: 'Bench Lead', password: 'bench-password-1' },
      4,
      { verified: true },
    );
    const building = await createBuilding(db, lead, { name: 'Bench tower', reference: 'BENCH-40x30' });
    for (let i = 0; i <= STOREYS; i++)
      await createLevel(
        db,
        building.id,
        { name: i === 0 ? 'Ground' : `Level ${i}`, elevation: Math.round(i * STOREY_HEIGHT * 1000) / 1000 },
        lead,
      );
    const template = {
      storeys: STOREYS,
      storeyHeight: STOREY_HEIGHT,
      baseElevation: 0,
      spliceEvery: 2,
      sections: SECTIONS,
      grade: 'S355' as const,
      baseFixity: 'pinned' as const,
      Gk: 90,
      Qk: 45,
    };
    const levels = await listLevels(db, building.id);
    const plain = stackFromTemplate(template, levels);
    const doc = faces ? withFaces(plain, faces) : plain;
    for (let i = 0; i < STACKS; i++)
      await createStack(
        db,
        building.id,
        { name: `${String.fromCharCode(65 + (i % 8))}/${Math.floor(i / 8) + 1}`, doc },
        lead,
      );

    const levelMap = new Map(levels.map((l) => [l.id, l.elevation]));
    const b0 = performance.now();
    for (let i = 0; i < STACKS; i++) analyseStack(doc, undefined, { levels: levelMap });
    const baseline = performance.now() - b0;

    const token = signToken(server.ctx.config.jwtSecret, lead.id);
    // The package is drawn on a worker thread: the server's own event loop should stay responsive.
    const loop = monitorEventLoopDelay({ resolution: 5 });
    loop.enable();
    const cpu0 = process.cpuUsage();
    const t0 = performance.now();
    const res = await fetch(`${server.url}/api/buildings/${building.id}/revisions`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Authorization: `Bearer ${token}` },
      body: JSON.stringify({ note: 'Bench issue', purpose: 'preliminary' }),
    });
    const wall = performance.now() - t0;
    const cpu = process.cpuUsage(cpu0);
    loop.disable();
    if (res.status !== 201) throw new Error(`freeze: ${res.status} ${(await res.text()).slice(0, 400)}`);
    const rev = (await res.json()) as RevisionDetail;

    const p0 = performance.now();
    const pdf = await fetch(`${server.url}/api/revisions/${rev.id}/calc.pdf`, {
      headers: { Authorization: `Bearer ${token}` },
    });
    const file = Buffer.from(await pdf.arrayBuffer());
    const pdfWall = performance.now() - p0;
    const bytes = file.length;
    // Page objects are written uncompressed by pdfkit.
    const pages = (file.toString('latin1').match(/\/Type \/Page\b/g) ?? []).length;

    // Reading the revision (its page, and the reply to every review step) takes the outline kept at the freeze; the
    // baseline is the same read with the outline gone, drawn again from the whole snapshot as before outlines.
    const readRevision = async () => {
      const readLoop = monitorEventLoopDelay({ resolution: 5 });
      readLoop.enable();
      const r0 = performance.now();
      const got = await fetch(`${server.url}/api/revisions/${rev.id}`, {
        headers: { Authorization: `Bearer ${token}` },
      });
      if (got.status !== 200) throw new Error(`revision read: ${got.status}`);
      await got.arrayBuffer();
      const ms = performance.now() - r0;
      readLoop.disable();
      return { ms, stall: readLoop.max / 1e6 };
    };
    const withOutline = await readRevision();
    await db('revision_outlines').where({ revision_id: rev.id }).delete();
    const fromSnapshot = await readRevision();

    console.log(
      `building: ${STACKS} stacks × ${STOREYS} storeys (${levels.length} levels), ${rev.stacks.length} stacks frozen as ${rev.code}`,
    );
    const cpuS = (cpu.user + cpu.system) / 1e6;
    console.log(
      `freeze (answers once committed; the package is drawn and the mail sent after): ${(wall / 1000).toFixed(2)} s wall ${wall < 10_000 ? 'OK' : 'OVER'}, ${cpuS.toFixed(2)} s CPU of this process, its worker threads included ${cpuS < 10 ? 'OK' : 'OVER'} (target < 10 s; load average ${loadavg()[0].toFixed(1)}: on a busy machine CPU time is the fairer figure)`,
    );
    console.log(
      `longest stall of the server's event loop during the freeze: ${(loop.max / 1e6).toFixed(0)} ms (requests and live edits wait at most this long)`,
    );
    console.log(
      `package (GET calc.pdf at once after the freeze: waits for its one drawing, then served as stored): ${(pdfWall / 1000).toFixed(2)} s, ${(bytes / 1024).toFixed(0)} KiB, ${pages} pages`,
    );
    console.log(
      `baseline (engine, same 40 stacks once): ${baseline.toFixed(0)} ms → freeze is ${(wall / baseline).toFixed(0)}× the baseline`,
    );
    console.log(
      `revision read (GET /api/revisions/:id): ${withOutline.ms.toFixed(0)} ms, longest stall ${withOutline.stall.toFixed(0)} ms, from the outline kept at the freeze; baseline, outline gone and drawn from the snapshot: ${fromSnapshot.ms.toFixed(0)} ms, stall ${fromSnapshot.stall.toFixed(0)} ms (${(fromSnapshot.ms / withOutline.ms).toFixed(1)}× the outline's time)`,
    );
    console.log(`mail: ${rev.mail.sent} sent, ${rev.mail.failed} failed`);
  } finally {
    await server.close();
    rmSync(dataDir, { recursive: true, force: true });
  }
}
