// The calculation package is drawn on a worker thread (server/offThread/pool.ts), so a freeze of
// a large building does not stall the requests and live edits the same process serves (sizing a whole
// building goes to the same thread). Invented data.
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { StackSummary } from '../../shared/schema/api.ts';
import type { RevisionDetail } from '../../shared/schema/revisions.ts';
import { startWithLeadAndBuilding, type TestServer } from './helpers.ts';

const STOREYS = 30;
const STOREY = 3.6;
/** One section per two-storey lift, bottom first (invented sizing that passes). */
const sections = [
  ...Array<string>(5).fill('UKC 356x406x393'),
  ...Array<string>(5).fill('UKC 305x305x198'),
  ...Array<string>(5).fill('UKC 254x254x132'),
];
const template = { storeys: STOREYS, storeyHeight: STOREY, spliceEvery: 2, sections, Gk: 60, Qk: 30 };

describe('drawing the package off the main thread', () => {
  let s: TestServer;
  let token: string;
  let buildingId: number;
  beforeAll(async () => {
    ({ s, token, buildingId } = await startWithLeadAndBuilding('Tall invented block'));
    for (let i = 0; i <= STOREYS; i++) {
      await s.api('POST', `/buildings/${buildingId}/levels`, {
        token,
        body: { name: i === 0 ? 'Ground' : `Floor ${i}`, elevation: Math.round(i * STOREY * 1000) / 1000 },
      });
    }
    for (let i = 0; i < 8; i++) {
      const r = await s.api('POST', `/buildings/${buildingId}/stacks`, {
        token,
        body: { name: `A/${i + 1}`, template },
      });
      expect((r.body as StackSummary).status).toBe('passes');
    }
  }, 60_000);
  afterAll(async () => {
    await s?.close();
  });

  it('keeps serving while a package of some hundred pages is drawn', async () => {
    // The server runs in this process, so a package drawn on the main thread would stall this event loop
    // for most of the freeze. Not a speed target: the longest stall is compared with the freeze itself.
    const loop = monitorEventLoopDelay({ resolution: 5 });
    loop.enable();
    const t0 = performance.now();
    const freeze = s.api('POST', `/buildings/${buildingId}/revisions`, {
      token,
      body: { note: 'Thread test', purpose: 'preliminary' },
    });
    const lists: number[] = [];
    let done = false;
    void freeze.finally(() => (done = true));
    while (!done) {
      lists.push((await s.api('GET', `/buildings/${buildingId}/stacks`, { token })).status);
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
    const frozen = await freeze;
    const wall = performance.now() - t0;
    loop.disable();
    expect(frozen.status).toBe(201);
    expect((frozen.body as RevisionDetail).stacks).toHaveLength(8);
    expect(lists.every((status) => status === 200)).toBe(true);
    const longestStall = loop.max / 1e6;
    expect(
      longestStall,
      `longest event-loop stall ${longestStall.toFixed(0)} ms in a freeze of ${wall.toFixed(0)} ms`,
    ).toBeLessThan(wall / 3);

    const res = await fetch(`${s.url}/api/revisions/${(frozen.body as RevisionDetail).id}/calc.pdf`, {
      headers: { Authorization: `Bearer ${token}` },
    });
    const pdf = Buffer.from(await res.arrayBuffer());
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    // Some hundred pages: pdfkit writes its page objects uncompressed.
    expect((pdf.toString('latin1').match(/\/Type \/Page\b/g) ?? []).length).toBeGreaterThan(100);
  }, 60_000);
});
