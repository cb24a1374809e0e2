// A building with a lead, an engineer and a viewer, levels and two stacks from templates (invented data).
import type { AuthResponse, StackDetail, StackSummary } from '../../shared/schema/api.ts';
import { addMember, createBuilding, registerUser, type TestServer } from './helpers.ts';

export interface RevisionFixture {
  lead: AuthResponse;
  engineer: AuthResponse;
  viewer: AuthResponse;
  buildingId: number;
  stackIds: number[];
}

export const STOREY = 3.6;
export const TEMPLATE = {
  storeys: 4,
  storeyHeight: STOREY,
  spliceEvery: 2,
  sections: ['UKC 254x254x73', 'UKC 203x203x46'],
  Gk: 180,
  Qk: 90,
};

export async function revisionFixture(s: TestServer, name = 'Invented block'): Promise<RevisionFixture> {
  const lead = await registerUser(s, 'lead');
  const engineer = await registerUser(s, 'engineer');
  const viewer = await registerUser(s, 'viewer');
  const building = await createBuilding(s, lead.token, name);
  await addMember(s, lead.token, building.id, engineer.user.email, 'engineer');
  await addMember(s, lead.token, building.id, viewer.user.email, 'viewer');
  for (let i = 0; i <= TEMPLATE.storeys; i++) {
    await s.api('POST', `/buildings/${building.id}/levels`, {
      token: lead.token,
      body: { name: i === 0 ? 'Ground' : `Floor ${i}`, elevation: i * STOREY },
    });
  }
  const stackIds: number[] = [];
  for (const stackName of ['B/2', 'A/1']) {
    const r = await s.api('POST', `/buildings/${building.id}/stacks`, {
      token: lead.token,
      body: { name: stackName, template: TEMPLATE },
    });
    if (r.status !== 201) throw new Error(`stack: ${r.status} ${JSON.stringify(r.body)}`);
    stackIds.push((r.body as StackSummary).id);
  }
  return { lead, engineer, viewer, buildingId: building.id, stackIds };
}

export async function setLiftSection(
  s: TestServer,
  token: string,
  stackId: number,
  liftId: string,
  section: string,
): Promise<StackDetail> {
  const stack = (await s.api('GET', `/stacks/${stackId}`, { token })).body as StackDetail;
  const doc = {
    ...stack.doc,
    nodes: stack.doc.nodes.map((n) =>
      n.id === liftId && n.kind === 'lift' ? { ...n, data: { ...n.data, section } } : n,
    ),
  };
  const r = await s.api('PUT', `/stacks/${stackId}`, { token, body: { doc, baseVersion: stack.version } });
  if (r.status !== 200) throw new Error(`edit: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body as StackDetail;
}
