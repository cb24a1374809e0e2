// No internal node id ("lift-jsvj7d", "restraint-3") in anything a person reads about a revision: the
// calculation package's text, the revision details and comparison, and the e-mail. Ids are for linking only.
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { StackDetail } from '../../shared/schema/api.ts';
import type { OutboxMessage } from '../../shared/schema/outbox.ts';
import type { RevisionComparison, RevisionDetail } from '../../shared/schema/revisions.ts';
import { applyOps } from '../../shared/ops/applyOps.ts';
import { splitLiftOps } from '../../shared/ops/structuralEdits.ts';
import { INTERNAL_ID_PATTERN } from '../../shared/wording.ts';
import { eventually, makeAdmin, registerUser, startTestServer, type TestServer } from './helpers.ts';
import { revisionFixture, setLiftSection, type RevisionFixture } from './revisionsFixture.ts';

const ID_ANYWHERE = new RegExp(INTERNAL_ID_PATTERN.source, 'g');
const idsIn = (text: string) => text.match(ID_ANYWHERE) ?? [];

describe('no internal ids where people read', () => {
  let s: TestServer;
  let f: RevisionFixture;
  let first: RevisionDetail;
  let second: RevisionDetail;
  beforeAll(async () => {
    s = await startTestServer();
    f = await revisionFixture(s);
    first = (
      await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
        token: f.lead.token,
        body: { note: 'First issue', purpose: 'preliminary' },
      })
    ).body as RevisionDetail;
    // Ids as the editor makes them, by splitting a lift; then a lift too small, so the freeze needs an acknowledgement.
    const stack = (await s.api('GET', `/stacks/${f.stackIds[0]}`, { token: f.lead.token })).body as StackDetail;
    const lift = stack.doc.nodes.find((n) => n.kind === 'lift');
    let n = 0;
    const made = [
      'splice-jsvj7d',
      'lift-k2m9qx',
      'edge-a1b2c3',
      'edge-d4e5f6',
      'edge-g7h8i9',
      'edge-j1k2l3',
      'edge-m4n5o6',
    ];
    const { ops } = splitLiftOps(stack.doc, lift!.id, 1.8, () => made[n++]);
    const r = await s.api('PUT', `/stacks/${stack.id}`, {
      token: f.lead.token,
      body: { doc: applyOps(stack.doc, ops), baseVersion: stack.version },
    });
    expect(r.status).toBe(200);
    await setLiftSection(s, f.lead.token, stack.id, 'lift-k2m9qx', 'UKC 152x152x23');
    const frozen = await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
      token: f.lead.token,
      body: { note: 'Second issue', purpose: 'preliminary', acknowledgeFailingLifts: true },
      headers: { Origin: 'http://stanchion.test' },
    });
    expect(frozen.status).toBe(201);
    second = frozen.body as RevisionDetail;
  });
  afterAll(async () => {
    await s?.close();
  });

  it('the id pattern finds the ids the editor and the templates make (so this test can fail)', () => {
    expect(idsIn('Lift lift-jsvj7d and restraint-3 on splice-k2m9qx')).toEqual([
      'lift-jsvj7d',
      'restraint-3',
      'splice-k2m9qx',
    ]);
    expect(idsIn('Lift L2 at +3.600, Floor 1, UKC 152x152x23')).toEqual([]);
  });

  it('the calculation package prints lift labels and level names, no node id', async () => {
    const res = await fetch(`${s.url}/api/revisions/${second.id}/calc.pdf`, {
      headers: { Authorization: `Bearer ${f.viewer.token}` },
    });
    const parser = new PDFParse({ data: new Uint8Array(await res.arrayBuffer()) });
    try {
      const text = (await parser.getText()).text;
      expect(text).toContain('Load take-down');
      expect(idsIn(text)).toEqual([]);
      // No table cell cut short with an ellipsis (server/pdf/table.ts cuts text that does not fit)
      expect(text.split('\n').filter((line) => line.includes('…') && !line.startsWith('snapshot '))).toEqual([]);
      // The take-down shows the storeys and αn per level
      expect(text).toMatch(/\bn\s+αn\b/);
    } finally {
      await parser.destroy();
    }
  });

  it('the revision details and the comparison with the earlier revision name no node id', async () => {
    const detail = (await s.api('GET', `/revisions/${second.id}`, { token: f.viewer.token })).body as RevisionDetail;
    expect(detail.acknowledgement).toMatch(/B\/2 L2 \(UKC 152x152x23/);
    const shown = [
      detail.note,
      detail.acknowledgement ?? '',
      ...detail.recipients.map((r) => `${r.name} ${r.error ?? ''}`),
    ].join('\n');
    expect(idsIn(shown)).toEqual([]);
    const cmp = (
      await s.api('GET', `/buildings/${f.buildingId}/revisions/compare?from=${first.id}&to=${second.id}`, {
        token: f.viewer.token,
      })
    ).body as RevisionComparison;
    const labels = cmp.stacks
      .flatMap((st) => [st.name, ...st.nodes.map((x) => x.label), ...st.lifts.map((l) => l.label)])
      .concat(cmp.levels.map((l) => l.field));
    expect(labels.length).toBeGreaterThan(2);
    expect(idsIn(labels.join('\n'))).toEqual([]);
  });

  it('the e-mail names no node id', async () => {
    const admin = await registerUser(s, 'admin');
    await makeAdmin(s, admin.user.id);
    const sent = async () =>
      ((await s.api('GET', '/dev/outbox', { token: admin.token })).body as OutboxMessage[]).filter((m) =>
        m.subject.includes(second.code),
      );
    // The revision e-mail is sent by the background sender from the mail queue, after the freeze answered.
    await eventually(async () => (await sent()).length > 0);
    const outbox = await sent();
    for (const m of outbox) {
      expect(m.text).toContain('UKC 152x152x23');
      expect(idsIn(`${m.subject}\n${m.text}\n${m.html ?? ''}`)).toEqual([]);
    }
  });
});
