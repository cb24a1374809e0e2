// A building's members and invitations (docs/rights.md). A member is addressed by user id, or by e-mail
// address while the invitation is pending.
import { z } from 'zod';
import type { AddMemberBody, Member, UpdateMemberBody } from '@shared/schema/api.ts';
import { memberSchema } from '@shared/schema/replies.ts';
import { http, seg } from './http.ts';

const members = (buildingId: number) => `/buildings/${buildingId}/members`;

export async function listMembers(buildingId: number): Promise<Member[]> {
  return z.array(memberSchema).parse(await http.get(members(buildingId)));
}

export async function addMember(buildingId: number, body: AddMemberBody): Promise<Member> {
  return memberSchema.parse(await http.post(members(buildingId), body));
}

export async function updateMember(buildingId: number, key: string | number, body: UpdateMemberBody): Promise<Member> {
  return memberSchema.parse(await http.patch(`${members(buildingId)}/${seg(key)}`, body));
}

export async function removeMember(buildingId: number, key: string | number): Promise<void> {
  await http.delete(`${members(buildingId)}/${seg(key)}`);
}
