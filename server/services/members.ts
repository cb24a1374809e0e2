// Building membership: the lead adds people by e-mail. An account with a verified address becomes a
// member at once; any other address gets an invitation that becomes a membership only when an account
// with that address verifies it, and only until the invitation expires (docs/access.md).
import type { Knex } from 'knex';
import { ROLE_RANK, type Member, type Role, type User } from '../../shared/schema/api.ts';
import { conflict, forbidden, notFound, unprocessable } from '../errors.ts';
import { isoTime, isPostgres, now } from '../db.ts';
import { enqueueMail } from '../mail/mailQueue.ts';
import { invitationMessage } from '../mail/messages.ts';
import { recordAudit } from './audit.ts';

/** Call only for a verified address: turns its live invitations into memberships; expired ones lapse. */
export async function acceptInvitations(trx: Knex, userId: number, email: string): Promise<void> {
  const invitations = await trx('invitations')
    .where({ email })
    .andWhere((q) => q.whereNull('expires_at').orWhere('expires_at', '>', now()))
    .select<{ id: number; building_id: number; role: Role }[]>('id', 'building_id', 'role');
  for (const inv of invitations) {
    const already = await trx('memberships').where({ building_id: inv.building_id, user_id: userId }).first('id');
    if (already) continue;
    await trx('memberships').insert({
      building_id: inv.building_id,
      user_id: userId,
      role: inv.role,
      created_at: now(),
    });
    await recordAudit(trx, {
      userId,
      buildingId: inv.building_id,
      action: 'member.accept',
      detail: { email, role: inv.role },
    });
  }
  await trx('invitations').where({ email }).delete();
}

export async function listMembers(db: Knex, buildingId: number): Promise<Member[]> {
  const members = await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.building_id', buildingId)
    .orderBy('u.email')
    .select<{ user_id: number; email: string; name: string; role: Role }[]>('m.user_id', 'u.email', 'u.name', 'm.role');
  const invited = await db('invitations')
    .where({ building_id: buildingId })
    .orderBy('email')
    .select<{ email: string; role: Role; expires_at: unknown }[]>('email', 'role', 'expires_at');
  // The latest invitation e-mail to each address, so the lead sees one that could not be sent.
  const mails = await db('mail_queue')
    .where({ building_id: buildingId, kind: 'invitation' })
    .orderBy('id')
    .select<{ to: string; status: string; attempts: number; last_error: string | null }[]>(
      'to',
      'status',
      'attempts',
      'last_error',
    );
  const mailTo = new Map(
    mails.map((m) => [
      m.to,
      {
        status: m.status === 'sent' ? 'sent' : m.status === 'failed' ? 'failed' : 'pending',
        attempts: Number(m.attempts),
        error: m.last_error,
      } as const,
    ]),
  );
  return [
    ...members.map((m) => ({ userId: m.user_id, email: m.email, name: m.name, role: m.role, pending: false })),
    ...invited.map((i) => {
      const mail = mailTo.get(i.email);
      return {
        userId: null,
        email: i.email,
        name: null,
        role: i.role,
        pending: true,
        ...(i.expires_at ? { expiresAt: isoTime(i.expires_at) } : {}),
        ...(mail ? { invitationMail: mail } : {}),
      };
    }),
  ];
}

export interface InviteSettings {
  /** Where the invited person signs in or registers (the configured public URL). */
  link: string;
  /** Days an invitation stays open. */
  days: number;
}

/**
 * Adds an account with a verified address as a member; invites any other address. The invitation e-mail
 * is queued in the same transaction and sent by the background sender; listMembers shows whether it went.
 * An unverified account with the address is invited too: it joins when it verifies.
 */
export async function addMember(
  db: Knex,
  outbox: { kick(): void },
  buildingId: number,
  email: string,
  role: Role,
  by: User,
  settings: InviteSettings,
): Promise<Member> {
  const outcome = await db.transaction(async (trx) => {
    const building = await trx('buildings').where({ id: buildingId }).first<{ name: string } | undefined>('name');
    if (!building) throw notFound('Building');
    const user = await trx('users')
      .where({ email })
      .first<{ id: number; name: string; email_verified_at: unknown } | undefined>('id', 'name', 'email_verified_at');
    if (user) {
      const existing = await trx('memberships').where({ building_id: buildingId, user_id: user.id }).first('id');
      if (existing) throw conflict(`${email} is already a member of this building`);
    }
    if (user && user.email_verified_at !== null && user.email_verified_at !== undefined) {
      await trx('memberships').insert({ building_id: buildingId, user_id: user.id, role, created_at: now() });
      await recordAudit(trx, { userId: by.id, buildingId, action: 'member.add', detail: { email, role } });
      return {
        member: { userId: user.id, email, name: user.name, role, pending: false } satisfies Member,
        invite: false,
      };
    }
    await trx('invitations').where({ building_id: buildingId, email }).delete();
    const expiresAt = new Date(Date.now() + settings.days * 86_400_000).toISOString();
    await trx('invitations').insert({
      building_id: buildingId,
      email,
      role,
      invited_by: by.id,
      created_at: now(),
      expires_at: expiresAt,
    });
    await recordAudit(trx, { userId: by.id, buildingId, action: 'member.invite', detail: { email, role } });
    const message = invitationMessage({
      to: email,
      buildingName: building.name,
      inviterName: by.name,
      role,
      link: settings.link,
      days: settings.days,
    });
    await enqueueMail(trx, [{ kind: 'invitation', message, buildingId }]);
    const member: Member = {
      userId: null,
      email,
      name: null,
      role,
      pending: true,
      expiresAt,
      invitationMail: { status: 'pending', attempts: 0, error: null },
    };
    return { member, invite: true };
  });
  if (outcome.invite) outbox.kick();
  return outcome.member;
}

/**
 * Locks the building's memberships for the rest of the transaction (PostgreSQL; SQLite has one writer)
 * and checks the caller is still a lead: two leads removing each other at once are then serialised,
 * and the second finds itself no longer a lead (or the last one) instead of leaving no lead at all.
 */
async function lockMemberships(trx: Knex, buildingId: number, by: User): Promise<void> {
  const query = trx('memberships').where({ building_id: buildingId });
  if (isPostgres(trx)) query.forUpdate();
  const rows = await query.select<{ user_id: number; role: Role }[]>('user_id', 'role');
  if (rows.find((r) => r.user_id === by.id)?.role !== 'lead')
    throw forbidden('You are no longer a lead of this building');
}

async function assertLeadRemains(trx: Knex, buildingId: number, userId: number, newRole: Role | null): Promise<void> {
  const current = await trx('memberships')
    .where({ building_id: buildingId, user_id: userId })
    .first<{ role: Role } | undefined>('role');
  if (!current) throw notFound('Member');
  if (current.role !== 'lead' || (newRole && ROLE_RANK[newRole] >= ROLE_RANK.lead)) return;
  const leads = await trx('memberships')
    .where({ building_id: buildingId, role: 'lead' })
    .count<{ n: number | string }[]>({ n: '*' });
  if (Number(leads[0].n) <= 1) throw unprocessable('A building must keep at least one lead');
}

export async function updateMemberRole(
  db: Knex,
  buildingId: number,
  userId: number,
  role: Role,
  by: User,
): Promise<Member> {
  return db.transaction(async (trx) => {
    await lockMemberships(trx, buildingId, by);
    await assertLeadRemains(trx, buildingId, userId, role);
    await trx('memberships').where({ building_id: buildingId, user_id: userId }).update({ role });
    await recordAudit(trx, { userId: by.id, buildingId, action: 'member.role', detail: { memberId: userId, role } });
    const u = await trx('users').where({ id: userId }).first<{ email: string; name: string }>('email', 'name');
    return { userId, email: u.email, name: u.name, role, pending: false };
  });
}

export async function removeMember(db: Knex, buildingId: number, userId: number, by: User): Promise<void> {
  await db.transaction(async (trx) => {
    await lockMemberships(trx, buildingId, by);
    await assertLeadRemains(trx, buildingId, userId, null);
    await trx('memberships').where({ building_id: buildingId, user_id: userId }).delete();
    await recordAudit(trx, { userId: by.id, buildingId, action: 'member.remove', detail: { memberId: userId } });
  });
}

export async function cancelInvitation(db: Knex, buildingId: number, email: string, by: User): Promise<void> {
  await db.transaction(async (trx) => {
    const n = await trx('invitations').where({ building_id: buildingId, email }).delete();
    if (n === 0) throw notFound('Invitation');
    await recordAudit(trx, { userId: by.id, buildingId, action: 'member.uninvite', detail: { email } });
  });
}

export async function updateInvitationRole(
  db: Knex,
  buildingId: number,
  email: string,
  role: Role,
  by: User,
): Promise<Member> {
  return db.transaction(async (trx) => {
    const n = await trx('invitations').where({ building_id: buildingId, email }).update({ role });
    if (n === 0) throw notFound('Invitation');
    await recordAudit(trx, { userId: by.id, buildingId, action: 'member.invite-role', detail: { email, role } });
    return { userId: null, email, name: null, role, pending: true };
  });
}

/**
 * A site admin gives a building that has no lead (a race before the lock above, or a database edited
 * by hand) a lead again: an existing account, made a member or raised to lead. Refused (409) while
 * the building still has a lead, who can do this themselves.
 */
export async function restoreLead(db: Knex, buildingId: number, email: string, by: User): Promise<Member> {
  return db.transaction(async (trx) => {
    const buildingQuery = trx('buildings').where({ id: buildingId });
    if (isPostgres(trx)) buildingQuery.forUpdate();
    if (!(await buildingQuery.first('id'))) throw notFound('Building');
    const leads = await trx('memberships')
      .where({ building_id: buildingId, role: 'lead' })
      .count<{ n: number | string }[]>({ n: '*' });
    if (Number(leads[0].n) > 0) throw conflict('This building has a lead; the lead manages its members');
    const user = await trx('users').where({ email }).first<{ id: number; name: string } | undefined>('id', 'name');
    if (!user) throw unprocessable(`There is no account for ${email}; the new lead must register first`);
    const updated = await trx('memberships')
      .where({ building_id: buildingId, user_id: user.id })
      .update({ role: 'lead' });
    if (updated === 0)
      await trx('memberships').insert({ building_id: buildingId, user_id: user.id, role: 'lead', created_at: now() });
    await recordAudit(trx, { userId: by.id, buildingId, action: 'member.restore-lead', detail: { email } });
    return { userId: user.id, email, name: user.name, role: 'lead', pending: false };
  });
}
